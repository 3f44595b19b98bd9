import type { Geometry } from 'geojson';
import type { UnitDto } from '../../shared/schemas/unit';
import { kindFamily, type UnitKind } from '../../shared/domain/unit-kinds';
import { feetToMiles, sqMetresToHectares, SQ_M_PER_ACRE } from '../../shared/units';
import { stripCrs } from './geojson';

/** The stored columns of a unit, from a model or a raw row. */
export interface UnitRow {
  id: number;
  propertyId: number;
  kind: UnitKind;
  name: string;
  notes: string | null;
  geometry: Geometry;
  acres: number | string | null;
  perimeterFt: number | string | null;
  lengthFt: number | string | null;
  createdAt: Date | string;
  updatedAt: Date | string;
}

const num = (v: number | string | null) => (v === null || v === undefined ? null : Number(v));
const iso = (d: Date | string) => (d instanceof Date ? d.toISOString() : new Date(d).toISOString());

/** A unit with its measures: acres and perimeter for areas, length for lines. */
export function presentUnit(u: UnitRow): UnitDto {
  const acres = num(u.acres);
  const lengthFt = num(u.lengthFt);
  return {
    id: u.id,
    propertyId: u.propertyId,
    kind: u.kind,
    family: kindFamily(u.kind),
    name: u.name,
    notes: u.notes,
    geometry: stripCrs(u.geometry),
    acres,
    hectares: acres === null ? null : Math.round(sqMetresToHectares(acres * SQ_M_PER_ACRE) * 10000) / 10000,
    perimeterFt: num(u.perimeterFt),
    lengthFt,
    lengthMi: lengthFt === null ? null : Math.round(feetToMiles(lengthFt) * 10000) / 10000,
    createdAt: iso(u.createdAt),
    updatedAt: iso(u.updatedAt),
  };
}
