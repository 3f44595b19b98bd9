/**
 * Re-measures every stored boundary and unit with the current measure (shared/domain/geometry.ts)
 * and bumps the revision of each plan whose numbers changed, so cached plan answers are refetched.
 * Migration 0010 runs it once to bring acres stored with turf's spherical measure onto the WGS84
 * ellipsoid; rounding is the writers' (property-writer: acres 3 places; unit-writer: acres 4 places;
 * feet 1 place). Raw SQL only, so a migration can call it whatever the models become.
 */
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { Geometry, MultiPolygon } from 'geojson';
import { fitsFamily, measureArea, measureUnit } from '../../shared/domain/geometry';
import { kindFamily, type UnitKind } from '../../shared/domain/unit-kinds';

const round = (v: number | null, places: number): number | null => (v === null ? null : Math.round(v * 10 ** places) / 10 ** places);
const same = (stored: string | number | null, next: number | null): boolean => (stored === null ? next === null : next !== null && Number(stored) === next);

/** Counts of rows whose stored measures changed. */
export interface RemeasureResult {
  properties: number;
  units: number;
}

/** Re-measures every property boundary and unit in one transaction; answers how many rows changed. */
export async function remeasureStoredMeasures(sequelize: Sequelize, transaction?: Transaction): Promise<RemeasureResult> {
  const touched = new Set<number>();
  let propertyCount = 0;
  let unitCount = 0;

  const properties = await sequelize.query<{ id: number; boundary: MultiPolygon; acres: string | null; perimeter_ft: string | null }>(
    'SELECT id, ST_AsGeoJSON(boundary, 15)::json AS boundary, acres, perimeter_ft FROM properties WHERE boundary IS NOT NULL ORDER BY id',
    { type: QueryTypes.SELECT, transaction },
  );
  for (const p of properties) {
    const m = measureArea(p.boundary);
    const acres = round(m.acres, 3);
    const perimeterFt = round(m.perimeterFt, 1);
    if (same(p.acres, acres) && same(p.perimeter_ft, perimeterFt)) continue;
    await sequelize.query('UPDATE properties SET acres = :acres, perimeter_ft = :perimeterFt WHERE id = :id', { replacements: { id: p.id, acres, perimeterFt }, transaction });
    touched.add(p.id);
    propertyCount += 1;
  }

  const units = await sequelize.query<{ id: number; property_id: number; kind: UnitKind; geometry: Geometry; acres: string | null; perimeter_ft: string | null; length_ft: string | null }>(
    'SELECT id, property_id, kind, ST_AsGeoJSON(geometry, 15)::json AS geometry, acres, perimeter_ft, length_ft FROM units ORDER BY id',
    { type: QueryTypes.SELECT, transaction },
  );
  for (const u of units) {
    if (!fitsFamily(kindFamily(u.kind), u.geometry)) continue; // never stored by the writers; leave it as it is
    const m = measureUnit(u.kind, u.geometry);
    const acres = round(m.acres, 4);
    const perimeterFt = round(m.perimeterFt, 1);
    const lengthFt = round(m.lengthFt, 1);
    if (same(u.acres, acres) && same(u.perimeter_ft, perimeterFt) && same(u.length_ft, lengthFt)) continue;
    await sequelize.query('UPDATE units SET acres = :acres, perimeter_ft = :perimeterFt, length_ft = :lengthFt WHERE id = :id', { replacements: { id: u.id, acres, perimeterFt, lengthFt }, transaction });
    touched.add(u.property_id);
    unitCount += 1;
  }

  if (touched.size > 0) {
    await sequelize.query('UPDATE properties SET revision = revision + 1 WHERE id IN (:ids)', { replacements: { ids: [...touched] }, transaction });
  }
  return { properties: propertyCount, units: unitCount };
}
