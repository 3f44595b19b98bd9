/** Turn whatever geometry a file held into plan-ready features (lon/lat, 2-D, simple types) or skip reasons. */
import type { LineString, MultiLineString, MultiPolygon, Point, Polygon, Position } from 'geojson';
import { isUnitKind, kindFamily, type KindFamily, type UnitKind } from '../../../shared/domain/unit-kinds';
import { tooManyFeatures } from './geo-file-error';
import type { ImportedFeature, PlanGeometry, SkippedFeature } from './types';

/** A feature as a reader found it: geometry and properties not yet trusted. */
export interface SourceFeature {
  index: number;
  geometry: unknown;
  properties: unknown;
  /** Notes the reader already has for this feature (e.g. the layer it came from). */
  notes?: string[];
  /** Set when the reader already knows the feature cannot be used: the skip reason. */
  problem?: string;
}

export interface NormalizeOptions {
  maxFeatures: number;
  /** Reason given when a feature has no geometry at all. */
  noGeometryReason?: string;
  /** Reason given when coordinates look projected (defaults to a general one). */
  projectedReason?: string;
  /** Notes added to every feature (e.g. a datum caution). */
  notesForAll?: string[];
}

export interface NormalizeResult {
  features: ImportedFeature[];
  skipped: SkippedFeature[];
}

type Pos = [number, number];
type CleanGeometry = Polygon | MultiPolygon | LineString | MultiLineString | Point;
type PartOutcome = { ok: true; geometries: CleanGeometry[]; notes: string[] } | { ok: false; reason: string };

/** Default skip reason for coordinates in metres or feet rather than degrees. */
export const PROJECTED_REASON = 'coordinates look projected (metres?) — export as WGS84 longitude/latitude';

/** Coordinates with a magnitude at least this large cannot be degrees: "numbers in the hundreds of thousands". */
const PROJECTED_MAGNITUDE = 1000;
const MAX_COLLECTION_DEPTH = 8;
const NAME_KEYS = ['name', 'title', 'label'];

/** The feature name from name/Name/title/label properties (any letter case), or undefined. */
export function pickName(properties: Record<string, unknown>): string | undefined {
  for (const wanted of NAME_KEYS) {
    for (const [key, value] of Object.entries(properties)) {
      if (key.toLowerCase() !== wanted) continue;
      if (typeof value === 'string' && value.trim() !== '') return value.trim();
      if (typeof value === 'number' && Number.isFinite(value)) return String(value);
    }
  }
  return undefined;
}

/** The unit kind a feature's properties state (`kind`, or GPX `type`), when it is a kind of that family. */
export function pickKind(properties: Record<string, unknown>, family: KindFamily): UnitKind | undefined {
  for (const key of ['kind', 'type']) {
    const value = properties[key];
    if (typeof value === 'string' && isUnitKind(value.trim()) && kindFamily(value.trim() as UnitKind) === family) {
      return value.trim() as UnitKind;
    }
  }
  return undefined;
}

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

const familyOf = (geometry: CleanGeometry): KindFamily =>
  geometry.type === 'Point' ? 'point' : geometry.type === 'LineString' || geometry.type === 'MultiLineString' ? 'line' : 'area';

interface Simple {
  type: string;
  coordinates: unknown;
}

/** Flatten nested GeometryCollections into simple parts; collect unsupported types. */
function collectParts(geometry: unknown, depth: number, parts: Simple[], unsupported: string[]): void {
  if (!isRecord(geometry) || typeof geometry.type !== 'string') {
    unsupported.push('the geometry has no "type"');
    return;
  }
  if (geometry.type === 'GeometryCollection') {
    if (depth >= MAX_COLLECTION_DEPTH) {
      unsupported.push(`geometry collections nested deeper than ${MAX_COLLECTION_DEPTH} levels`);
      return;
    }
    if (!Array.isArray(geometry.geometries)) {
      unsupported.push('a GeometryCollection without a "geometries" list');
      return;
    }
    for (const child of geometry.geometries) collectParts(child, depth + 1, parts, unsupported);
    return;
  }
  if (['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon'].includes(geometry.type)) {
    parts.push({ type: geometry.type, coordinates: geometry.coordinates });
    return;
  }
  unsupported.push(`unsupported geometry type "${geometry.type}"`);
}

class PartError extends Error {}

interface CleanState {
  droppedZ: boolean;
  closedRings: number;
}

function cleanPosition(value: unknown, state: CleanState): Pos {
  if (!Array.isArray(value) || value.length < 2) throw new PartError('a position is not a [longitude, latitude] pair');
  const lon: unknown = value[0];
  const lat: unknown = value[1];
  if (typeof lon !== 'number' || typeof lat !== 'number' || !Number.isFinite(lon) || !Number.isFinite(lat)) {
    throw new PartError('a coordinate is not a number');
  }
  // A clean pair is kept as it is (a large file holds hundreds of thousands: no copy to collect).
  if (value.length === 2) return value as Pos;
  state.droppedZ = true;
  return [lon, lat];
}

function cleanPositions(value: unknown, state: CleanState): Pos[] {
  if (!Array.isArray(value)) throw new PartError('coordinates are not a list of positions');
  return value.map((p) => cleanPosition(p, state));
}

function cleanLine(value: unknown, state: CleanState, what: string): Pos[] {
  const line = cleanPositions(value, state);
  if (line.length === 0) throw new PartError('empty geometry (no coordinates)');
  if (line.length < 2) throw new PartError(`${what} has only ${line.length} position; a line needs at least 2`);
  return line;
}

const samePosition = (a: Pos, b: Pos): boolean => a[0] === b[0] && a[1] === b[1];

function cleanPolygonRings(value: unknown, state: CleanState, what: string): Pos[][] {
  if (!Array.isArray(value) || value.length === 0) throw new PartError('empty geometry (a polygon without rings)');
  return value.map((ringValue, ringIndex) => {
    const ring = cleanPositions(ringValue, state);
    const ringName = ringIndex === 0 ? `the outer ring of ${what}` : `hole ${ringIndex} of ${what}`;
    if (ring.length === 0) throw new PartError(`empty geometry (${ringName} has no positions)`);
    if (!samePosition(ring[0], ring[ring.length - 1])) {
      ring.push([ring[0][0], ring[0][1]]);
      state.closedRings += 1;
    }
    if (ring.length < 4) {
      throw new PartError(`${ringName} has fewer than 4 positions (a ring needs at least 3 corners and a closing position)`);
    }
    return ring;
  });
}

/** Clean one simple part into one or more plan geometries (a MultiPoint becomes points). */
function cleanPart(part: Simple, state: CleanState): CleanGeometry[] {
  const c = part.coordinates;
  switch (part.type) {
    case 'Point':
      if (Array.isArray(c) && c.length === 0) throw new PartError('empty geometry (a point without coordinates)');
      return [{ type: 'Point', coordinates: cleanPosition(c, state) }];
    case 'MultiPoint': {
      const points = cleanPositions(c, state);
      if (points.length === 0) throw new PartError('empty geometry (no coordinates)');
      return points.map((p) => ({ type: 'Point', coordinates: p }));
    }
    case 'LineString':
      return [{ type: 'LineString', coordinates: cleanLine(c, state, 'the line') }];
    case 'MultiLineString': {
      if (!Array.isArray(c) || c.length === 0) throw new PartError('empty geometry (no lines)');
      const lines = c.map((line, i) => cleanLine(line, state, `line ${i + 1}`));
      return [lines.length === 1 ? { type: 'LineString', coordinates: lines[0] } : { type: 'MultiLineString', coordinates: lines }];
    }
    case 'Polygon':
      return [{ type: 'Polygon', coordinates: cleanPolygonRings(c, state, 'the polygon') }];
    case 'MultiPolygon': {
      if (!Array.isArray(c) || c.length === 0) throw new PartError('empty geometry (no polygons)');
      const polygons = c.map((rings, i) => cleanPolygonRings(rings, state, `polygon ${i + 1}`));
      return [polygons.length === 1 ? { type: 'Polygon', coordinates: polygons[0] } : { type: 'MultiPolygon', coordinates: polygons }];
    }
    default:
      throw new PartError(`unsupported geometry type "${part.type}"`);
  }
}

/** Call `visit` with every position of the geometry (a plain loop: it runs over every vertex of a file). */
function eachPosition(geometry: CleanGeometry, visit: (lon: number, lat: number) => void): void {
  const line = (positions: Position[]) => {
    for (let i = 0; i < positions.length; i += 1) visit(positions[i][0], positions[i][1]);
  };
  switch (geometry.type) {
    case 'Point':
      visit(geometry.coordinates[0], geometry.coordinates[1]);
      return;
    case 'LineString':
      line(geometry.coordinates);
      return;
    case 'MultiLineString':
    case 'Polygon':
      for (const l of geometry.coordinates) line(l);
      return;
    case 'MultiPolygon':
      for (const polygon of geometry.coordinates) for (const ring of polygon) line(ring);
  }
}

/** Why the coordinates cannot be WGS84 longitude/latitude, or undefined when they can. */
function rangeProblem(geometry: CleanGeometry, projectedReason: string): string | undefined {
  let maxAbs = 0;
  let badLon: number | undefined;
  let badLat: number | undefined;
  let swapFits = true;
  eachPosition(geometry, (lon, lat) => {
    maxAbs = Math.max(maxAbs, Math.abs(lon), Math.abs(lat));
    if (badLon === undefined && Math.abs(lon) > 180) badLon = lon;
    if (badLat === undefined && Math.abs(lat) > 90) badLat = lat;
    if (Math.abs(lon) > 90 || Math.abs(lat) > 180) swapFits = false;
  });
  if (badLon === undefined && badLat === undefined) return undefined;
  if (maxAbs >= PROJECTED_MAGNITUDE) return projectedReason;
  const parts: string[] = [];
  if (badLon !== undefined) parts.push(`longitude ${badLon} is outside −180..180`);
  if (badLat !== undefined) parts.push(`latitude ${badLat} is outside −90..90`);
  const swapHint = badLat !== undefined && swapFits ? ' (are longitude and latitude swapped? GeoJSON and KML list longitude first)' : '';
  return `coordinates out of range: ${parts.join(', ')}${swapHint}`;
}

const combinable = (geometries: CleanGeometry[], family: KindFamily): boolean =>
  geometries.length > 1 && family !== 'point' && geometries.every((g) => familyOf(g) === family);

/** Merge homogeneous area or line parts of one collection into one Multi* geometry. */
function combine(geometries: CleanGeometry[]): CleanGeometry {
  if (familyOf(geometries[0]) === 'area') {
    const polygons = geometries.flatMap((g) =>
      g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [],
    );
    return { type: 'MultiPolygon', coordinates: polygons };
  }
  const lines = geometries.flatMap((g) =>
    g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [],
  );
  return { type: 'MultiLineString', coordinates: lines };
}

/**
 * Normalise source features: explode GeometryCollections (homogeneous area or line collections
 * become one Multi* feature, mixed ones become parts), drop Z, close open rings, and skip empty,
 * unsupported, out-of-range or projected geometry with a reason.
 */
export function normalizeFeatures(sources: Iterable<SourceFeature>, options: NormalizeOptions): NormalizeResult {
  const features: ImportedFeature[] = [];
  const skipped: SkippedFeature[] = [];
  const projectedReason = options.projectedReason ?? PROJECTED_REASON;
  const guard = () => {
    if (features.length + skipped.length > options.maxFeatures) throw tooManyFeatures(`more than ${options.maxFeatures}`, options.maxFeatures);
  };

  for (const source of sources) {
    const properties = isRecord(source.properties) ? source.properties : {};
    const name = pickName(properties);
    const skip = (reason: string, part?: number) => {
      skipped.push({ index: source.index, ...(part !== undefined ? { part } : {}), ...(name ? { name } : {}), reason });
      guard();
    };

    if (source.problem) {
      skip(source.problem);
      continue;
    }
    if (source.geometry === null || source.geometry === undefined) {
      skip(options.noGeometryReason ?? 'no geometry');
      continue;
    }
    const parts: Simple[] = [];
    const unsupported: string[] = [];
    collectParts(source.geometry, 0, parts, unsupported);
    const isCollection = isRecord(source.geometry) && source.geometry.type === 'GeometryCollection';
    if (parts.length === 0) {
      skip(unsupported[0] ?? 'empty geometry (a GeometryCollection with no members)');
      continue;
    }

    // Clean each part; a failing part of a collection is skipped on its own.
    const outcomes: PartOutcome[] = parts.map((part) => {
      const state: CleanState = { droppedZ: false, closedRings: 0 };
      try {
        const geometries = cleanPart(part, state);
        for (const g of geometries) {
          const problem = rangeProblem(g, projectedReason);
          if (problem) return { ok: false, reason: problem };
        }
        const notes: string[] = [];
        if (state.droppedZ) notes.push('elevation (Z) values dropped; longitude and latitude kept');
        if (state.closedRings > 0) {
          notes.push(
            state.closedRings === 1
              ? 'an unclosed ring was closed by repeating its first position'
              : `${state.closedRings} unclosed rings were closed by repeating their first positions`,
          );
        }
        return { ok: true, geometries, notes };
      } catch (error) {
        if (error instanceof PartError) return { ok: false, reason: error.message };
        throw error;
      }
    });

    const good = outcomes.filter((o): o is Extract<PartOutcome, { ok: true }> => o.ok);
    const bad = outcomes.filter((o): o is Extract<PartOutcome, { ok: false }> => !o.ok);
    const geometries = good.flatMap((o) => o.geometries);
    const notes = [...(source.notes ?? []), ...(options.notesForAll ?? []), ...new Set(good.flatMap((o) => o.notes))];
    if (unsupported.length > 0) notes.push(`ignored part of the collection: ${[...new Set(unsupported)].join('; ')}`);

    if (geometries.length === 0) {
      // Nothing usable: one skip entry carrying the first reason.
      skip(bad[0]?.reason ?? unsupported[0] ?? 'empty geometry');
      continue;
    }
    const sourceFamily = familyOf(geometries[0]);
    let emitted: CleanGeometry[];
    if (combinable(geometries, sourceFamily)) {
      emitted = [combine(geometries)];
      if (isCollection) notes.push(`${geometries.length} ${sourceFamily === 'area' ? 'polygons' : 'lines'} of a collection joined into one feature`);
    } else {
      emitted = geometries;
    }
    if (bad.length > 0) {
      notes.push(`${bad.length} part(s) left out: ${[...new Set(bad.map((b) => b.reason))].join('; ')}`);
    }

    emitted.forEach((geometry, partIndex) => {
      const family = familyOf(geometry);
      const kind = pickKind(properties, family);
      const partNotes = emitted.length > 1 ? [...notes, `part ${partIndex + 1} of ${emitted.length} of one ${isCollection ? 'geometry collection' : 'multi-point'}`] : notes;
      features.push({
        index: source.index,
        ...(emitted.length > 1 ? { part: partIndex } : {}),
        name: name ?? `Imported ${family} ${source.index + 1}`,
        geometry: geometry as PlanGeometry,
        family,
        ...(kind ? { kind } : {}),
        properties,
        notes: partNotes,
      });
      guard();
    });
  }
  return { features, skipped };
}
