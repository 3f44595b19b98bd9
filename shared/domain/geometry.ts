/**
 * Measurements of plan-map geometry: area, perimeter and length of GeoJSON shapes in WGS84
 * longitude/latitude, plus small helpers (bounding box, centroid, MultiPolygon wrapping).
 *
 * Every area and length is measured on the WGS84 ellipsoid by `./ellipsoid` (equal-area latitude
 * for areas, local radii of curvature for edges), within 0.01 % of GeographicLib for properties of
 * 0.1 to 50,000 acres between 20° and 65° latitude; the unit tests check it on random shapes. The
 * server's stored measures, the browser's live preview, exports and documents all come from here.
 * Results are returned unrounded: presentation rounds.
 */
import { bbox, feature, featureCollection } from '@turf/turf';
import type {
  BBox,
  Geometry,
  LineString,
  MultiLineString,
  MultiPoint,
  MultiPolygon,
  Point,
  Polygon,
} from 'geojson';
import { KIND_STYLES, kindFamily, type KindFamily, type UnitKind } from './unit-kinds';
import { feetToMiles, metresToFeet, sqMetresToAcres, sqMetresToHectares } from '../units';
import { measurePolygonRings, pathLengthM } from './ellipsoid';

export type AreaGeometry = Polygon | MultiPolygon;
export type LineGeometry = LineString | MultiLineString;
export type PointGeometry = Point | MultiPoint;

export interface AreaMeasure {
  acres: number;
  hectares: number;
  sqM: number;
  /** Length of every ring, outer rings and holes alike. */
  perimeterFt: number;
}

export interface LineMeasure {
  lengthFt: number;
  lengthMi: number;
  lengthM: number;
}

/** The measures stored with a unit: area fields for area kinds, length fields for line kinds. */
export interface UnitMeasure {
  acres: number | null;
  hectares: number | null;
  perimeterFt: number | null;
  lengthFt: number | null;
  lengthMi: number | null;
}

export interface LonLat {
  lon: number;
  lat: number;
}

/** Thrown when a unit's geometry type does not fit its kind (a food plot drawn as a line). */
export class GeometryKindMismatchError extends Error {
  readonly code = 'geometry-kind-mismatch';
  readonly kind: UnitKind;
  readonly geometryType: string;

  constructor(kind: UnitKind, geometryType: string) {
    super(kindMismatchMessage(kind, geometryType));
    this.name = 'GeometryKindMismatchError';
    this.kind = kind;
    this.geometryType = geometryType;
  }
}

const FAMILY_TYPES: Record<KindFamily, readonly string[]> = {
  area: ['Polygon', 'MultiPolygon'],
  line: ['LineString', 'MultiLineString'],
  point: ['Point', 'MultiPoint'],
};

const FAMILY_WORDS: Record<KindFamily, string> = {
  area: 'an area (Polygon)',
  line: 'a line (LineString)',
  point: 'a point (Point)',
};

/** "A food plot", "An access route": the kind's label as the subject of a sentence. */
export function kindWithArticle(kind: UnitKind): string {
  const label = KIND_STYLES[kind].label.toLowerCase();
  return `${/^[aeiou]/.test(label) ? 'An' : 'A'} ${label}`;
}

function kindMismatchMessage(kind: UnitKind, geometryType: string): string {
  return `${kindWithArticle(kind)} must be drawn as ${FAMILY_WORDS[kindFamily(kind)]}, not ${geometryType ? `a ${geometryType}` : 'an unknown shape'}`;
}

/** True when the geometry's type belongs to the family (area, line or point). */
export function fitsFamily(family: KindFamily, geometry: Geometry): boolean {
  return FAMILY_TYPES[family].includes(geometry?.type);
}

/** Area (holes subtracted) and perimeter (all rings) of a Polygon or MultiPolygon, on the WGS84 ellipsoid. */
export function measureArea(geom: AreaGeometry): AreaMeasure {
  const polygons = geom.type === 'Polygon' ? [geom.coordinates] : geom.coordinates;
  let sqM = 0;
  let perimeterM = 0;
  for (const rings of polygons) {
    const m = measurePolygonRings(rings);
    sqM += m.areaSqM;
    perimeterM += m.perimeterM;
  }
  return {
    acres: sqMetresToAcres(sqM),
    hectares: sqMetresToHectares(sqM),
    sqM,
    perimeterFt: metresToFeet(perimeterM),
  };
}

/** Area of a Polygon or MultiPolygon in m² on the WGS84 ellipsoid (holes subtracted). */
export function areaSqM(geom: AreaGeometry): number {
  return measureArea(geom).sqM;
}

/** Length of a LineString or MultiLineString on the WGS84 ellipsoid. */
export function measureLine(geom: LineGeometry): LineMeasure {
  const metres = lengthM(geom);
  const lengthFt = metresToFeet(metres);
  return { lengthFt, lengthMi: feetToMiles(lengthFt), lengthM: metres };
}

/** Length in metres of a LineString or MultiLineString on the WGS84 ellipsoid. */
export function lengthM(geom: LineGeometry): number {
  if (geom.type === 'LineString') return pathLengthM(geom.coordinates);
  let total = 0;
  for (const line of geom.coordinates) total += pathLengthM(line);
  return total;
}

/**
 * The measures of a unit by its kind's family: acres, hectares and perimeter for areas, length for
 * lines, all null for points. Throws GeometryKindMismatchError when the geometry does not fit.
 */
export function measureUnit(kind: UnitKind, geometry: Geometry): UnitMeasure {
  const family = kindFamily(kind);
  if (!fitsFamily(family, geometry)) throw new GeometryKindMismatchError(kind, geometry?.type);
  if (family === 'area') {
    const m = measureArea(geometry as AreaGeometry);
    return { acres: m.acres, hectares: m.hectares, perimeterFt: m.perimeterFt, lengthFt: null, lengthMi: null };
  }
  if (family === 'line') {
    const m = measureLine(geometry as LineGeometry);
    return { acres: null, hectares: null, perimeterFt: null, lengthFt: m.lengthFt, lengthMi: m.lengthMi };
  }
  return { acres: null, hectares: null, perimeterFt: null, lengthFt: null, lengthMi: null };
}

/**
 * Bounding box [west, south, east, north] of all the geometries, or null for an empty list.
 * Does not handle shapes crossing the antimeridian (no property of ours does).
 */
export function bboxOf(geometries: readonly Geometry[]): BBox | null {
  if (geometries.length === 0) return null;
  const box = bbox(featureCollection(geometries.map((g) => feature(g))));
  return box.some((v) => !Number.isFinite(v)) ? null : box;
}

/** The one centroid (area-weighted, holes and every part of a MultiPolygon counted): see `centroid.ts`. */
export { centroidOf } from './centroid';

/** The geometry as a MultiPolygon (PostGIS boundary columns refuse a bare Polygon). */
export function toMultiPolygon(geom: AreaGeometry): MultiPolygon {
  return geom.type === 'MultiPolygon' ? geom : { type: 'MultiPolygon', coordinates: [geom.coordinates] };
}

/** "44.1234 N, 90.5678 W": a position as people read it, latitude first, 4 decimals (about 11 m). */
export function formatLatLon(lon: number, lat: number): string {
  const ns = lat >= 0 ? 'N' : 'S';
  const ew = lon >= 0 ? 'E' : 'W';
  return `${Math.abs(lat).toFixed(4)} ${ns}, ${Math.abs(lon).toFixed(4)} ${ew}`;
}
