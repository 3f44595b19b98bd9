/**
 * Structural checks of a drawn or imported geometry, worded for the consultant who has to fix it.
 * Made for zod refinements: each problem carries a path relative to the geometry object
 * (`['coordinates', ring, position]`) that can go straight into `ctx.addIssue({ path })`.
 */
import { area, booleanPointInPolygon, kinks } from '@turf/turf';
import type { Geometry, Polygon, Position } from 'geojson';
import { formatLatLon, type LonLat } from './geometry';

export type GeometryProblemCode =
  | 'unsupported-type'
  | 'bad-structure'
  | 'longitude-out-of-range'
  | 'latitude-out-of-range'
  | 'too-few-positions'
  | 'ring-not-closed'
  | 'too-many-vertices'
  | 'self-intersection'
  | 'hole-outside-outer-ring'
  | 'no-area';

export interface GeometryProblem {
  code: GeometryProblemCode;
  message: string;
  /** Path inside the geometry object, e.g. ['coordinates', 0, 3]. */
  path: (string | number)[];
  /** Where on the map, when the problem has a place. */
  where?: LonLat;
}

export interface GeometryCheckOptions {
  /**
   * Most vertices allowed over the whole geometry (a ring's closing repeat not counted). The
   * self-intersection test is quadratic (turf `kinks`: about 0.35 s at 10,000 vertices), so it is
   * skipped when the cap is exceeded.
   */
  maxVertices: number;
  /**
   * Above this many vertices the quadratic self-crossing test is left to the database (PostGIS
   * `ST_IsValid`), which answers the same question in n·log n. Default: no limit.
   */
  crossingCheckMaxVertices?: number;
}

/** Out-of-range positions reported one by one before a summary line takes over. */
const MAX_POSITIONS_REPORTED = 5;

const SUPPORTED = ['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon'];

type Path = (string | number)[];

const EMPTY_MULTI_MESSAGES: Record<string, string> = {
  MultiPoint: 'The shape has no points: place at least one point or delete it.',
  MultiLineString: 'The line has no parts: draw the line or delete it.',
  MultiPolygon: 'The outline has no parts: draw the outline or delete it.',
};

/** Array levels above the positions (a Point's coordinates are the position itself). */
const NESTING_DEPTH: Record<string, number> = {
  Point: 0,
  MultiPoint: 1,
  LineString: 1,
  MultiLineString: 2,
  Polygon: 2,
  MultiPolygon: 3,
};

/**
 * Everything structurally wrong with a geometry: coordinate ranges, ring closure and size, vertex
 * cap, self-crossings (with where), holes outside their outer ring, outlines without area.
 * An empty list means the geometry is fit to store and measure.
 */
export function findGeometryProblems(geom: Geometry, options: GeometryCheckOptions): GeometryProblem[] {
  const problems: GeometryProblem[] = [];
  if (!geom || typeof geom !== 'object' || !SUPPORTED.includes(geom.type)) {
    const type = geom && typeof geom === 'object' && typeof geom.type === 'string' ? geom.type : 'not a geometry';
    problems.push({
      code: 'unsupported-type',
      message: `The shape type "${type}" is not supported: draw or import a point, line or area (Point, LineString, Polygon or their Multi- forms).`,
      path: ['type'],
    });
    return problems;
  }
  const coords: unknown = (geom as { coordinates?: unknown }).coordinates;
  const depth = NESTING_DEPTH[geom.type] ?? 0;
  if (!hasDepth(coords, depth)) {
    problems.push({
      code: 'bad-structure',
      message: `The ${geom.type} coordinates are not nested the way GeoJSON requires: re-export the file from its source program, or redraw the shape.`,
      path: ['coordinates'],
    });
    return problems;
  }

  const ranges = new RangeTally(problems);
  const positions = listPositions(geom.type, coords as PositionTree, ['coordinates']);
  for (const { position, path, subject } of positions) ranges.check(position, path, subject);
  ranges.finish();

  const vertices = countVertices(geom);
  const overCap = vertices > options.maxVertices;
  if (overCap) {
    problems.push({
      code: 'too-many-vertices',
      message: `The shape has ${vertices.toLocaleString('en-US')} corners; the limit is ${options.maxVertices.toLocaleString('en-US')}: simplify it (fewer corners along smooth edges) and try again.`,
      path: ['coordinates'],
    });
  }

  const emptyMulti = EMPTY_MULTI_MESSAGES[geom.type];
  if (emptyMulti && (coords as unknown[]).length === 0) {
    problems.push({ code: 'too-few-positions', message: emptyMulti, path: ['coordinates'] });
    return problems;
  }

  if (geom.type === 'LineString' || geom.type === 'MultiLineString') {
    const lines = geom.type === 'LineString' ? [geom.coordinates] : geom.coordinates;
    lines.forEach((line, i) => {
      if (line.length < 2) {
        const subject = geom.type === 'LineString' ? 'The line' : `Part ${i + 1} of the line`;
        problems.push({
          code: 'too-few-positions',
          message: `${subject} has ${line.length} point${line.length === 1 ? '' : 's'}; a line needs at least 2: add a point or delete it.`,
          path: geom.type === 'LineString' ? ['coordinates'] : ['coordinates', i],
        });
      }
    });
  }

  if (geom.type === 'Polygon' || geom.type === 'MultiPolygon') {
    const polygons = geom.type === 'Polygon' ? [geom.coordinates] : geom.coordinates;
    const multi = geom.type === 'MultiPolygon';
    polygons.forEach((rings, p) => {
      const base: Path = multi ? ['coordinates', p] : ['coordinates'];
      const partName = multi ? `part ${p + 1} of the outline` : 'the outline';
      if (ranges.malformed === 0) checkPolygon(rings, base, partName, !overCap && ranges.count === 0, vertices <= (options.crossingCheckMaxVertices ?? Infinity), problems);
    });
  }
  return problems;
}

/** Ring size and closure, then (when the ring structure is sound) crossings, holes and area. */
function checkPolygon(rings: Position[][], base: Path, partName: string, deepChecks: boolean, crossingCheck: boolean, problems: GeometryProblem[]): void {
  const Part = capitalise(partName);
  if (rings.length === 0) {
    problems.push({ code: 'too-few-positions', message: `${Part} has no rings: draw the outline or delete the part.`, path: base });
    return;
  }
  let ringsSound = true;
  rings.forEach((ring, r) => {
    const ringName = r === 0 ? partName : `hole ${r} of ${partName}`;
    const RingName = capitalise(ringName);
    const path = [...base, r];
    if (ring.length < 4) {
      ringsSound = false;
      problems.push({
        code: 'too-few-positions',
        message: `${RingName} has ${ring.length} position${ring.length === 1 ? '' : 's'}; a closed ring needs at least 4 (3 corners and the first one repeated): add corners or delete it.`,
        path,
      });
      return;
    }
    const first = ring[0];
    const last = ring[ring.length - 1];
    if (first[0] !== last[0] || first[1] !== last[1]) {
      ringsSound = false;
      problems.push({
        code: 'ring-not-closed',
        message: `${RingName} is not closed: its last point (${formatLatLon(last[0], last[1])}) must repeat its first point (${formatLatLon(first[0], first[1])}). Close the shape on its starting corner.`,
        path: [...path, ring.length - 1],
        where: { lon: last[0], lat: last[1] },
      });
    }
  });
  if (!ringsSound || !deepChecks) return;

  const polygon: Polygon = { type: 'Polygon', coordinates: rings.map(dropRepeats) };
  const crossings = crossingCheck ? kinks(polygon).features : [];
  if (crossings.length > 0) {
    const [lon, lat] = crossings[0].geometry.coordinates;
    problems.push({
      code: 'self-intersection',
      message: `${Part} crosses itself near ${formatLatLon(lon, lat)}: move a corner so the edges do not cross${rings.length > 1 ? ' (or a hole crosses the outer edge: keep holes inside it)' : ''}.`,
      path: base,
      where: { lon, lat },
    });
    return;
  }

  const outer: Polygon = { type: 'Polygon', coordinates: [rings[0]] };
  for (let h = 1; h < rings.length; h++) {
    const outside = rings[h].find((pos) => !booleanPointInPolygon(pos, outer));
    if (outside) {
      problems.push({
        code: 'hole-outside-outer-ring',
        message: `Hole ${h} of ${partName} lies outside its outer edge near ${formatLatLon(outside[0], outside[1])}: move the hole inside the outline or delete it.`,
        path: [...base, h],
        where: { lon: outside[0], lat: outside[1] },
      });
    }
  }

  // Below a square metre there is nothing to plant: corners on one line, or drawn twice. This is a
  // check of the shape as drawn on the map (turf's edges run straight in longitude and sin(latitude),
  // so corners on one parallel enclose nothing), not a measure: acres come from geometry.ts.
  if (area(outer) < 1) {
    const [lon, lat] = rings[0][0];
    problems.push({
      code: 'no-area',
      message: `${Part} encloses no area (its corners lie on one line) near ${formatLatLon(lon, lat)}: redraw it with at least 3 corners apart.`,
      path: [...base, 0],
      where: { lon, lat },
    });
  }
}

/** Consecutive repeated positions (a double click) would read as false crossings in `kinks`. */
function dropRepeats(ring: Position[]): Position[] {
  return ring.filter((pos, i) => i === 0 || pos[0] !== ring[i - 1][0] || pos[1] !== ring[i - 1][1]);
}

/** Counts out-of-range positions, reports the first few one by one and then a summary. */
class RangeTally {
  /** Positions out of range or malformed. */
  count = 0;
  /** Positions that are not a pair of finite numbers. */
  malformed = 0;
  private firstPath: Path | null = null;

  constructor(private readonly problems: GeometryProblem[]) {}

  check(pos: unknown, path: Path, subject: string): void {
    if (!Array.isArray(pos) || pos.length < 2 || !pos.every((v) => typeof v === 'number' && Number.isFinite(v))) {
      this.malformed += 1;
      this.add(path, {
        code: 'bad-structure',
        message: `${subject} is not a longitude, latitude pair of numbers: fix or delete that point.`,
        path,
      });
      return;
    }
    const [lon, lat] = pos as number[];
    const swapHint =
      Math.abs(lon) <= 90 && Math.abs(lat) > 90 && Math.abs(lat) <= 180
        ? ' The numbers look swapped: GeoJSON puts longitude first, then latitude.'
        : '';
    if (lon < -180 || lon > 180) {
      this.add(path, {
        code: 'longitude-out-of-range',
        message: `${subject} has longitude ${lon}, outside −180 to 180: correct that point.${swapHint}`,
        path,
      });
    } else if (lat < -90 || lat > 90) {
      this.add(path, {
        code: 'latitude-out-of-range',
        message: `${subject} has latitude ${lat}, outside −90 to 90: correct that point.${swapHint}`,
        path,
      });
    }
  }

  finish(): void {
    const extra = this.count - MAX_POSITIONS_REPORTED;
    if (extra > 0 && this.firstPath) {
      this.problems.push({
        code: 'bad-structure',
        message: `${extra} more point${extra === 1 ? ' is' : 's are'} not valid longitude, latitude positions: check the file's coordinate system is WGS84 longitude/latitude (EPSG:4326).`,
        path: this.firstPath,
      });
    }
  }

  private add(path: Path, problem: GeometryProblem): void {
    this.count += 1;
    if (this.firstPath === null) this.firstPath = path;
    if (this.count <= MAX_POSITIONS_REPORTED) this.problems.push(problem);
  }
}

type PositionTree = unknown[];

interface PositionAt {
  position: unknown;
  path: Path;
  subject: string;
}

/** Every position with its path and a human name ("Point 4 of hole 1 of the outline"). */
function listPositions(type: string, coords: PositionTree, base: Path): PositionAt[] {
  const out: PositionAt[] = [];
  const eachIn = (list: unknown[], path: Path, owner: string) =>
    list.forEach((position, i) => out.push({ position, path: [...path, i], subject: `Point ${i + 1} of ${owner}` }));
  switch (type) {
    case 'Point':
      out.push({ position: coords, path: base, subject: 'The point' });
      break;
    case 'MultiPoint':
      eachIn(coords, base, 'the points');
      break;
    case 'LineString':
      eachIn(coords, base, 'the line');
      break;
    case 'MultiLineString':
      coords.forEach((line, l) => eachIn(line as unknown[], [...base, l], `part ${l + 1} of the line`));
      break;
    case 'Polygon':
      coords.forEach((ring, r) => eachIn(ring as unknown[], [...base, r], ringName(r, 'the outline')));
      break;
    case 'MultiPolygon':
      coords.forEach((rings, p) =>
        (rings as unknown[]).forEach((ring, r) =>
          eachIn(ring as unknown[], [...base, p, r], ringName(r, `part ${p + 1} of the outline`)),
        ),
      );
      break;
  }
  return out;
}

function ringName(r: number, polygonName: string): string {
  return r === 0 ? polygonName : `hole ${r} of ${polygonName}`;
}

/** True when `value` is nested arrays `depth` deep above the positions (positions not inspected). */
function hasDepth(value: unknown, depth: number): boolean {
  if (depth === 0) return Array.isArray(value);
  return Array.isArray(value) && value.every((child) => hasDepth(child, depth - 1));
}

/** Vertices over the whole geometry, not counting a closed ring's repeated first position. */
function countVertices(geom: Geometry): number {
  switch (geom.type) {
    case 'Point':
      return 1;
    case 'MultiPoint':
    case 'LineString':
      return geom.coordinates.length;
    case 'MultiLineString':
      return geom.coordinates.reduce((n, line) => n + line.length, 0);
    case 'Polygon':
      return ringVertices(geom.coordinates);
    case 'MultiPolygon':
      return geom.coordinates.reduce((n, rings) => n + ringVertices(rings), 0);
    default:
      return 0;
  }
}

function ringVertices(rings: Position[][]): number {
  return rings.reduce((n, ring) => n + Math.max(0, ring.length - (isClosed(ring) ? 1 : 0)), 0);
}

function isClosed(ring: Position[]): boolean {
  if (ring.length < 2) return false;
  const first = ring[0];
  const last = ring[ring.length - 1];
  return Array.isArray(first) && Array.isArray(last) && first[0] === last[0] && first[1] === last[1];
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
