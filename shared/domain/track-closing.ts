/**
 * A walked GPS track around a field or a property line comes back as an open line whose ends lie
 * a few steps apart. When the gap is small enough it can be closed into an area: the boundary or
 * an area unit.
 */
import type { LineString, Polygon, Position } from 'geojson';
import { measureLine } from './geometry';

/** Distance between a line's first and last positions, metres (the shared line measure). */
export function trackEndGapM(line: LineString): number {
  const c = line.coordinates;
  if (c.length < 2) return 0;
  const first = c[0];
  const last = c[c.length - 1];
  if (first[0] === last[0] && first[1] === last[1]) return 0;
  return measureLine({ type: 'LineString', coordinates: [first, last] }).lengthM;
}

const distinctCorners = (positions: Position[]): number => new Set(positions.map((p) => `${p[0]},${p[1]}`)).size;

/**
 * The gap (metres) of a line that may be closed into an area: a single LineString with at least
 * three distinct corners whose ends lie at most `maxGapM` apart; null otherwise.
 */
export function closableTrackGapM(geometry: { type: string; coordinates?: unknown }, maxGapM: number): number | null {
  if (geometry.type !== 'LineString') return null;
  const line = geometry as LineString;
  const c = line.coordinates;
  if (c.length < 3) return null;
  // A quick flat-earth look first (1° of latitude ≈ 111 km): ends far apart need no geodesic.
  const first = c[0];
  const last = c[c.length - 1];
  const roughM = 111_000 * Math.hypot(last[1] - first[1], (last[0] - first[0]) * Math.cos((first[1] * Math.PI) / 180));
  if (roughM > 2 * maxGapM + 1) return null;
  if (distinctCorners(c) < 3) return null;
  const gap = trackEndGapM(line);
  return gap <= maxGapM ? gap : null;
}

/** The line closed into a polygon by joining its last position back to its first. */
export function closeTrack(line: LineString): Polygon {
  const ring = line.coordinates.map((p) => [p[0], p[1]]);
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (first[0] !== last[0] || first[1] !== last[1]) ring.push([first[0], first[1]]);
  return { type: 'Polygon', coordinates: [ring] };
}
