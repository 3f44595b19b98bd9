/**
 * Scent geometry in a flat frame around a point: the downwind cone (a circular sector) and tests of
 * whether it reaches a polygon or a line. Points are projected with the ellipsoidal azimuthal
 * equidistant frame of `geodesic.ts`, so distances and bearings from the cone's apex are exact.
 */
import type { Geometry, Position } from 'geojson';
import { destination, inverse, localXY, normalizeDeg } from './geodesic';

/** Metres per international yard: 0.9144 exactly (NIST Handbook 44, App. C). */
export const METRES_PER_YARD = 0.9144;

export type XY = [number, number];

/** A scent cone: from its apex, centred on `bearingDeg` (where the wind carries scent), ± `halfAngleDeg`, out to `reachM`. */
export interface Cone {
  apex: Position;
  bearingDeg: number;
  halfAngleDeg: number;
  reachM: number;
}

/** The smallest difference between two bearings, 0–180 degrees. */
export function bearingGapDeg(a: number, b: number): number {
  const d = Math.abs(normalizeDeg(a) - normalizeDeg(b));
  return d > 180 ? 360 - d : d;
}

const bearingOf = ([x, y]: XY) => normalizeDeg((Math.atan2(x, y) * 180) / Math.PI);

function inSector(p: XY, cone: Cone): boolean {
  const d = Math.hypot(p[0], p[1]);
  if (d > cone.reachM) return false;
  if (d < 1e-6) return true;
  return bearingGapDeg(bearingOf(p), cone.bearingDeg) <= cone.halfAngleDeg + 1e-9;
}

function segmentsCross(a: XY, b: XY, c: XY, d: XY): boolean {
  const cross = (o: XY, p: XY, q: XY) => (p[0] - o[0]) * (q[1] - o[1]) - (p[1] - o[1]) * (q[0] - o[0]);
  const d1 = cross(c, d, a), d2 = cross(c, d, b), d3 = cross(a, b, c), d4 = cross(a, b, d);
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
}

/** True when the segment a–b meets the cone's arc (the circle of radius reach, within the half-angle). */
function segmentMeetsArc(a: XY, b: XY, cone: Cone): boolean {
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const qa = dx * dx + dy * dy;
  if (qa === 0) return false;
  const qb = 2 * (a[0] * dx + a[1] * dy);
  const qc = a[0] * a[0] + a[1] * a[1] - cone.reachM * cone.reachM;
  const disc = qb * qb - 4 * qa * qc;
  if (disc < 0) return false;
  for (const t of [(-qb - Math.sqrt(disc)) / (2 * qa), (-qb + Math.sqrt(disc)) / (2 * qa)]) {
    if (t < 0 || t > 1) continue;
    const p: XY = [a[0] + t * dx, a[1] + t * dy];
    if (bearingGapDeg(bearingOf(p), cone.bearingDeg) <= cone.halfAngleDeg) return true;
  }
  return false;
}

function radialEnds(cone: Cone): XY[] {
  return [-1, 1].map((s) => {
    const b = ((cone.bearingDeg + s * cone.halfAngleDeg) * Math.PI) / 180;
    return [cone.reachM * Math.sin(b), cone.reachM * Math.cos(b)] as XY;
  });
}

/** True when the segment a–b (in the cone's frame) enters the cone. */
function segmentMeetsCone(a: XY, b: XY, cone: Cone, ends: XY[]): boolean {
  if (inSector(a, cone) || inSector(b, cone)) return true;
  for (const e of ends) if (segmentsCross(a, b, [0, 0], e)) return true;
  return segmentMeetsArc(a, b, cone);
}

/** Even-odd point-in-rings test in a flat frame. */
export function pointInRings(p: XY, rings: readonly XY[][]): boolean {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i]!, [xj, yj] = ring[j]!;
      if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

/** The polygons (each as rings) of an area geometry, or the paths of a line geometry. */
export function partsOf(geometry: Geometry): Position[][][] {
  switch (geometry.type) {
    case 'Polygon':
      return [geometry.coordinates];
    case 'MultiPolygon':
      return geometry.coordinates;
    case 'LineString':
      return [[geometry.coordinates]];
    case 'MultiLineString':
      return geometry.coordinates.map((l) => [l]);
    default:
      return [];
  }
}

const isArea = (g: Geometry) => g.type === 'Polygon' || g.type === 'MultiPolygon';

/** True when the cone reaches any part of an area (or line) geometry. */
export function coneReaches(cone: Cone, geometry: Geometry): boolean {
  const ends = radialEnds(cone);
  const area = isArea(geometry);
  for (const part of partsOf(geometry)) {
    const rings = part.map((ring) => ring.map((p) => localXY(cone.apex, p)));
    if (area && pointInRings([0, 0], rings)) return true;
    for (const ring of rings) {
      for (let i = 1; i < ring.length; i++) if (segmentMeetsCone(ring[i - 1]!, ring[i]!, cone, ends)) return true;
      if (ring.length === 1 && inSector(ring[0]!, cone)) return true;
    }
  }
  return false;
}

/** The cone as a closed polygon ring in [lon, lat], its arc drawn every few degrees (for maps). */
export function coneRing(cone: Cone, stepDeg = 5): Position[] {
  const ring: Position[] = [cone.apex];
  const n = Math.max(2, Math.ceil((2 * cone.halfAngleDeg) / stepDeg));
  for (let i = 0; i <= n; i++) ring.push(destination(cone.apex, cone.bearingDeg - cone.halfAngleDeg + (2 * cone.halfAngleDeg * i) / n, cone.reachM));
  ring.push(cone.apex);
  return ring;
}

/** Points along a path no further apart than `stepM`, starting and ending at its ends (at most `maxPoints`). */
export function samplePath(path: readonly Position[], stepM: number, maxPoints = 400): Position[] {
  const out: Position[] = [];
  for (let i = 1; i < path.length; i++) {
    const a = path[i - 1]!, b = path[i]!;
    const { distanceM, bearingDeg } = inverse(a, b);
    const n = Math.max(1, Math.ceil(distanceM / stepM));
    for (let k = 0; k < n; k++) out.push(k === 0 ? a : destination(a, bearingDeg, (distanceM * k) / n));
  }
  if (path.length) out.push(path[path.length - 1]!);
  if (out.length <= maxPoints) return out;
  const every = out.length / maxPoints;
  return Array.from({ length: maxPoints }, (_, i) => out[Math.min(out.length - 1, Math.round(i * every))]!);
}

function segmentPointDist(p: XY, a: XY, b: XY): number {
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const q = dx * dx + dy * dy;
  const t = q === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / q));
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
}

/**
 * The shortest distance in metres between a path and an area (0 when the path enters it), in a flat
 * frame around the path's first point: exact along lines from that point, and within centimetres over
 * the few hundred metres a property spans.
 */
export function pathToAreaM(path: readonly Position[], area: Geometry): number {
  if (path.length === 0) return Infinity;
  const origin = path[0]!;
  const line = path.map((p) => localXY(origin, p));
  let best = Infinity;
  for (const part of partsOf(area)) {
    const rings = part.map((ring) => ring.map((p) => localXY(origin, p)));
    if (line.some((p) => pointInRings(p, rings))) return 0;
    for (const ring of rings) {
      for (let i = 1; i < ring.length; i++) {
        for (let j = 1; j < line.length; j++) {
          if (segmentsCross(ring[i - 1]!, ring[i]!, line[j - 1]!, line[j]!)) return 0;
          best = Math.min(
            best,
            segmentPointDist(ring[i - 1]!, line[j - 1]!, line[j]!),
            segmentPointDist(ring[i]!, line[j - 1]!, line[j]!),
            segmentPointDist(line[j - 1]!, ring[i - 1]!, ring[i]!),
            segmentPointDist(line[j]!, ring[i - 1]!, ring[i]!),
          );
        }
      }
    }
    if (line.length === 1) for (const ring of rings) for (let i = 1; i < ring.length; i++) best = Math.min(best, segmentPointDist(line[0]!, ring[i - 1]!, ring[i]!));
  }
  return best;
}

/** The shortest distance in metres from a point to a path (ellipsoidal frame around the point). */
export function pointToPathM(point: Position, path: readonly Position[]): number {
  const line = path.map((p) => localXY(point, p));
  if (line.length === 1) return Math.hypot(line[0]![0], line[0]![1]);
  let best = Infinity;
  for (let j = 1; j < line.length; j++) best = Math.min(best, segmentPointDist([0, 0], line[j - 1]!, line[j]!));
  return best;
}
