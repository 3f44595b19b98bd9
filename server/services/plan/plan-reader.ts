/**
 * Reads a property's plan lean: one query for the property (ownership and revision), one raw query
 * for its units. Answers are cached per process keyed by the plan's revision, which every write bumps
 * in the same transaction (units in their commands; the summary's other inputs through the triggers
 * of migration 0092), so a cache entry can never be stale (only unused) — several instances stay
 * consistent without sharing memory.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { Firm, Property } from '../../models';
import { notFound } from '../../errors';
import { buildId } from '../../build-id';
import { presentUnit, type UnitRow } from '../../presenters/unit';
import { planWarnings, shareByKind, type PlanWarning } from '../../../shared/domain/plan-checks';
import { seasonPlanWarnings } from '../../queries/plan-season-checks';
import { huntingSettings } from '../../../shared/domain/stand-winds';
import type { PlanSummary } from '../../../shared/schemas/unit';
import { stripCrs } from '../../presenters/geojson';
import { GEOMETRY_LIMITS } from '../../../shared/limits';
import { precompress, type Precompressed } from '../http/precompressed';

export interface LoadedPlan {
  property: Property;
  revision: number;
  units: () => Promise<UnitRow[]>;
}

const MAX_ENTRIES = 200;
const cache = new Map<string, unknown>();

function remember<T>(key: string, make: () => Promise<T>): Promise<T> {
  if (cache.has(key)) {
    const value = cache.get(key) as T;
    cache.delete(key);
    cache.set(key, value);
    return Promise.resolve(value);
  }
  return make().then((value) => {
    cache.set(key, value);
    if (cache.size > MAX_ENTRIES) cache.delete(cache.keys().next().value as string);
    return value;
  });
}

/** The property (404 outside the firm) and a lazy, memoised reader of its units. */
export async function loadPlan(propertyId: number, firmId: number, options: { lean?: boolean } = {}): Promise<LoadedPlan> {
  // `lean` reads only what the units answer needs (no boundary to parse on every request).
  const property = await Property.findOne({ where: { id: propertyId, firmId }, attributes: options.lean ? ['id', 'firmId', 'revision'] : undefined });
  if (!property) throw notFound('That property');
  let rows: Promise<UnitRow[]> | null = null;
  return {
    property,
    revision: property.revision,
    units: () =>
      (rows ??= readUnitRows(propertyId)),
  };
}

const UNITS_SQL = `SELECT id, property_id AS "propertyId", kind, name, notes, ST_AsGeoJSON(geometry, 9)::json AS geometry,
                acres, perimeter_ft AS "perimeterFt", length_ft AS "lengthFt", created_at AS "createdAt", updated_at AS "updatedAt"
         FROM units WHERE property_id = :propertyId ORDER BY id`;

/** A property's units as lean rows (geometry as GeoJSON), optionally inside the caller's transaction. */
export function readUnitRows(propertyId: number, transaction?: Transaction): Promise<UnitRow[]> {
  return sequelize.query<UnitRow>(UNITS_SQL, { replacements: { propertyId }, type: QueryTypes.SELECT, transaction });
}

/**
 * The plan's revision, read first and alone (one small indexed query): 404 outside the firm. A write
 * bumps the revision in the same transaction as its units, so units read after it are at least as new.
 */
export async function planRevision(propertyId: number, firmId: number): Promise<number> {
  const rows = await sequelize.query<{ revision: number }>('SELECT revision FROM properties WHERE id = $1 AND firm_id = $2', {
    bind: [propertyId, firmId],
    type: QueryTypes.SELECT,
  });
  if (rows.length === 0) throw notFound('That property');
  return rows[0].revision;
}

/** The weak ETag of a plan at a revision and build (a new answer format is never a 304). */
export const planEtagAt = (propertyId: number, revision: number): string => `W/"plan-${propertyId}-r${revision}-${buildId}"`;

/**
 * The `{ data: UnitDto[] }` answer of a plan at a revision, serialised and compressed once (gzip and
 * brotli) and cached by revision; call after `planRevision` has checked the firm.
 */
export function unitsAnswer(propertyId: number, revision: number): Promise<Precompressed> {
  return remember(`units-answer:${propertyId}:${revision}`, async () => {
    const rows = await readUnitRows(propertyId);
    return precompress(Buffer.from(JSON.stringify({ data: rows.map(presentUnit) })));
  });
}

const presentWarning = (w: PlanWarning): PlanSummary['warnings'][number] => ({
  code: w.code,
  unitIds: w.unitIds.map(Number),
  message: w.message,
  ...(w.acres !== undefined ? { acres: w.acres } : {}),
  ...(w.lengthFt !== undefined ? { lengthFt: w.lengthFt } : {}),
});

/**
 * Share of the property by kind and the plan warnings — the map's and the season's (plant-back
 * intervals and rotation) — cached whole by the plan's revision. Every input bumps the revision in
 * the same transaction as its write: units in their commands; tasks, prescriptions, the firm's
 * materials, practices and settings (route buffer) through the triggers of migration 0092.
 */
export function planSummary(plan: LoadedPlan): Promise<PlanSummary> {
  return remember(`summary:${plan.property.id}:${plan.revision}`, () => summaryOf(plan));
}

/**
 * The plan summary of a property of the firm (404 outside it): a warm read is the one revision query;
 * the plan itself is loaded only when the summary at that revision is not cached yet.
 */
export async function planSummaryOf(propertyId: number, firmId: number): Promise<PlanSummary> {
  const revision = await planRevision(propertyId, firmId);
  return remember(`summary:${propertyId}:${revision}`, async () => summaryOf(await loadPlan(propertyId, firmId)));
}

async function summaryOf(plan: LoadedPlan): Promise<PlanSummary> {
  const [mapped, season] = await Promise.all([mapSummary(plan), seasonPlanWarnings(plan.property.id, plan.property.firmId)]);
  return season.length ? { ...mapped, warnings: [...mapped.warnings, ...season.map(presentWarning)] } : mapped;
}

async function mapSummary(plan: LoadedPlan): Promise<PlanSummary> {
  const firm = await Firm.findByPk(plan.property.firmId, { attributes: ['id', 'settings'] });
  const { routeBufferYd } = huntingSettings(firm?.settings);
  const units = await plan.units();
  const boundary = plan.property.boundary ? stripCrs(plan.property.boundary) : null;
  const planUnits = units.map((u) => ({ id: String(u.id), name: u.name, kind: u.kind, geometry: u.geometry }));
  const boundaryAcres = plan.property.acres;
  return {
    propertyId: plan.property.id,
    revision: plan.revision,
    boundaryAcres,
    shareByKind: boundaryAcres ? shareByKind(boundaryAcres, planUnits) : [],
    // Stored shapes already passed PostGIS validation: skip the quadratic crossing pre-check on large ones.
    warnings: planWarnings({ boundary, units: planUnits, maxVertices: GEOMETRY_LIMITS.boundaryMaxVertices, crossingCheckMaxVertices: GEOMETRY_LIMITS.crossingCheckMaxVertices, routeBufferYd }).map(presentWarning),
  };
}
