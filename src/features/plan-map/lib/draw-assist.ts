/**
 * Help while drawing on the plan map, kept free of the map so it can be unit-tested: the live
 * measure written next to the cursor, and the index of corners a new corner snaps to.
 */
import type { Geometry, Position } from 'geojson';
import { measureArea, measureLine } from '../../../../shared/domain/geometry';
import { formatAcresShort, formatFeet } from './measure-format';

export interface CursorMeasure {
  /** Where the cursor's point is (the label goes beside it). */
  at: Position;
  /** "2.41 ac · 1,312 ft" for an area (perimeter), "860 ft" for a line. */
  text: string;
  /** Points placed so far, the cursor's own not counted. */
  points: number;
}

/**
 * The live measure of a shape being drawn by terra-draw. A line's last position is the cursor; a
 * polygon's ring is [placed corners…, cursor, first corner]. The numbers come from the same
 * ellipsoidal measure the server stores, so the label agrees with the saved unit.
 */
export function cursorMeasureText(geometry: Geometry): CursorMeasure | null {
  if (geometry.type === 'LineString') {
    const coords = geometry.coordinates;
    if (coords.length < 2) return null;
    return { at: coords[coords.length - 1], text: formatFeet(measureLine(geometry).lengthFt), points: coords.length - 1 };
  }
  if (geometry.type === 'Polygon') {
    const ring = geometry.coordinates[0];
    if (!ring || ring.length < 3) return null;
    const m = measureArea(geometry);
    return { at: ring[ring.length - 2], text: `${formatAcresShort(m.acres)} · ${formatFeet(m.perimeterFt)}`, points: ring.length - 2 };
  }
  return null;
}

type Project = (lon: number, lat: number) => { x: number; y: number };
type Unproject = (x: number, y: number) => [number, number];

/**
 * The corners of the boundary and of every unit, flat in one array so that a pointer move scans
 * them with two comparisons each (a 50,000-corner boundary takes well under a millisecond); only
 * corners inside the pointer's small box are projected to pixels.
 */
export class SnapIndex {
  private coords = new Float64Array(0);

  /** Replaces the corners with those of the geometries (points, lines, rings, all parts). */
  set(geometries: readonly Geometry[]): void {
    const out: number[] = [];
    const add = (p: Position) => out.push(p[0], p[1]);
    for (const g of geometries) {
      switch (g.type) {
        case 'Point':
          add(g.coordinates);
          break;
        case 'MultiPoint':
        case 'LineString':
          g.coordinates.forEach(add);
          break;
        case 'MultiLineString':
        case 'Polygon':
          g.coordinates.forEach((line) => line.forEach(add));
          break;
        case 'MultiPolygon':
          g.coordinates.forEach((rings) => rings.forEach((ring) => ring.forEach(add)));
          break;
        default:
          break;
      }
    }
    this.coords = Float64Array.from(out);
  }

  /** Number of corners held. */
  get size(): number {
    return this.coords.length / 2;
  }

  /**
   * The corner nearest the pointer at screen position `pointer` within `pixels`, or undefined.
   * `project`/`unproject` convert between [lon, lat] and screen pixels (the map's own functions).
   */
  nearest(lon: number, lat: number, pixels: number, project: Project, unproject: Unproject, pointer: [number, number]): Position | undefined {
    if (this.coords.length === 0 || !Number.isFinite(lon) || !Number.isFinite(lat)) return undefined;
    const [x, y] = pointer;
    const a = unproject(x - pixels, y - pixels);
    const b = unproject(x + pixels, y + pixels);
    const west = Math.min(a[0], b[0]);
    const east = Math.max(a[0], b[0]);
    const south = Math.min(a[1], b[1]);
    const north = Math.max(a[1], b[1]);
    let best: Position | undefined;
    let bestD2 = pixels * pixels;
    const c = this.coords;
    for (let i = 0; i < c.length; i += 2) {
      const cx = c[i];
      const cy = c[i + 1];
      if (cx < west || cx > east || cy < south || cy > north) continue;
      const p = project(cx, cy);
      const d2 = (p.x - x) * (p.x - x) + (p.y - y) * (p.y - y);
      if (d2 <= bestD2) {
        bestD2 = d2;
        best = [cx, cy];
      }
    }
    return best;
  }
}
