/** Helpers shared by the exporters: input checks, coordinate rounding and winding, names, escaping. */
import { rewind } from '@turf/turf';
import type { Position } from 'geojson';
import { isUnitKind, kindFamily } from '../../../shared/domain/unit-kinds';
import { GeoFileError } from './geo-file-error';
import type { AreaGeometry, ExportUnit, PlanExport, PlanGeometry } from './types';

/** Decimal places kept in exported coordinates: 1e-7° is about 1 cm on the ground. */
export const COORDINATE_DECIMALS = 7;
const SCALE = 10 ** COORDINATE_DECIMALS;

/** A coordinate rounded to 7 decimals (never -0). */
export function roundCoordinate(value: number): number {
  const rounded = Math.round(value * SCALE) / SCALE;
  return rounded === 0 ? 0 : rounded;
}

/** A coordinate as text with at most 7 decimals and no exponent (for XML and CSV). */
export function formatCoordinate(value: number): string {
  const text = roundCoordinate(value).toFixed(COORDINATE_DECIMALS).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
  return text === '-0' ? '0' : text;
}

const roundPosition = (p: Position): Position => [roundCoordinate(p[0]), roundCoordinate(p[1])];

/** The geometry in 2-D lon/lat rounded to 7 decimals, polygons wound by the right-hand rule (RFC 7946 §3.1.6). */
export function prepareGeometry<G extends PlanGeometry>(geometry: G): G {
  let rounded: PlanGeometry;
  switch (geometry.type) {
    case 'Point':
      rounded = { type: 'Point', coordinates: roundPosition(geometry.coordinates) };
      break;
    case 'LineString':
      rounded = { type: 'LineString', coordinates: geometry.coordinates.map(roundPosition) };
      break;
    case 'MultiLineString':
      rounded = { type: 'MultiLineString', coordinates: geometry.coordinates.map((l) => l.map(roundPosition)) };
      break;
    case 'Polygon':
      rounded = { type: 'Polygon', coordinates: geometry.coordinates.map((r) => r.map(roundPosition)) };
      break;
    case 'MultiPolygon':
      rounded = { type: 'MultiPolygon', coordinates: geometry.coordinates.map((p) => p.map((r) => r.map(roundPosition))) };
      break;
  }
  if (rounded.type === 'Polygon' || rounded.type === 'MultiPolygon') {
    // turf rewind with reverse=false: exterior rings counter-clockwise, holes clockwise.
    return rewind(rounded, { reverse: false, mutate: true }) as G;
  }
  return rounded as G;
}

/** The polygons of an area geometry as a list of ring lists. */
export function polygonsOf(geometry: AreaGeometry): Position[][][] {
  return geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates;
}

/** The lines of a line geometry as a list of position lists. */
export function linesOf(geometry: PlanGeometry): Position[][] {
  if (geometry.type === 'LineString') return [geometry.coordinates];
  if (geometry.type === 'MultiLineString') return geometry.coordinates;
  return [];
}

/** A file-name-safe slug of the property name (ASCII letters, digits and hyphens), 'plan' when empty. */
export function slugify(name: string): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/&/g, ' and ')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/, '');
  return slug || 'plan';
}

export { escapeXml } from '../../../shared/domain/xml';

const GEOMETRY_TYPES_BY_FAMILY = {
  area: ['Polygon', 'MultiPolygon'],
  line: ['LineString', 'MultiLineString'],
  point: ['Point'],
} as const;

function checkPositions(geometry: PlanGeometry, where: string): void {
  const check = (p: unknown) => {
    if (!Array.isArray(p) || typeof p[0] !== 'number' || typeof p[1] !== 'number' || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      throw invalidExport(`${where} has a position that is not a pair of numbers.`);
    }
    if (Math.abs(p[0]) > 180 || Math.abs(p[1]) > 90) {
      throw invalidExport(`${where} has a position outside longitude −180..180 / latitude −90..90 ([${p[0]}, ${p[1]}]).`);
    }
  };
  const walk = (value: unknown, depth: number): void => {
    if (!Array.isArray(value)) throw invalidExport(`${where} has malformed coordinates.`);
    if (depth === 0) check(value);
    else {
      if (value.length === 0) throw invalidExport(`${where} has empty coordinates.`);
      value.forEach((v) => walk(v, depth - 1));
    }
  };
  const depth = { Point: 0, LineString: 1, MultiLineString: 2, Polygon: 2, MultiPolygon: 3 }[geometry.type];
  walk(geometry.coordinates, depth);
}

function invalidExport(message: string): GeoFileError {
  return new GeoFileError(422, 'invalid-export', `The plan cannot be exported: ${message}`);
}

/** Check a plan before export: known kinds, geometry of the kind's family, lon/lat positions. */
export function checkPlanExport(plan: PlanExport): void {
  if (!plan || typeof plan !== 'object' || !Array.isArray(plan.units)) throw invalidExport('no list of units was given.');
  if (typeof plan.propertyName !== 'string') throw invalidExport('the property has no name.');
  if (plan.boundary) {
    if (plan.boundary.type !== 'Polygon' && plan.boundary.type !== 'MultiPolygon') {
      throw invalidExport(`the property boundary is a ${String((plan.boundary as { type?: unknown }).type)}, not a Polygon or MultiPolygon.`);
    }
    checkPositions(plan.boundary, 'The property boundary');
  }
  plan.units.forEach((unit: ExportUnit, i) => {
    const where = `Unit ${i + 1} ("${String(unit?.name ?? '')}")`;
    if (!unit || typeof unit !== 'object') throw invalidExport(`unit ${i + 1} is missing.`);
    if (typeof unit.kind !== 'string' || !isUnitKind(unit.kind)) throw invalidExport(`${where} has an unknown kind "${String(unit.kind)}".`);
    const allowed: readonly string[] = GEOMETRY_TYPES_BY_FAMILY[kindFamily(unit.kind)];
    if (!unit.geometry || !allowed.includes(unit.geometry.type)) {
      throw invalidExport(`${where} is a ${unit.kind} but its geometry is ${unit.geometry ? `a ${unit.geometry.type}` : 'missing'}; expected ${allowed.join(' or ')}.`);
    }
    checkPositions(unit.geometry, where);
  });
}
