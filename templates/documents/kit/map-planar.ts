/**
 * Plane geometry of the plan map's drawing space (points, y downwards): ring and polygon areas,
 * point-in-polygon, rectangles and segments, for placing labels where they fit.
 */

/** A point of the drawing, [x, y] in points, y downwards. */
export type Pt = [number, number];
/** A closed ring of drawing points. */
export type Ring = Pt[];
/** One polygon: outer ring first, then holes. */
export type Poly = Ring[];

/** A rectangle of the drawing: top-left corner, width and height. */
export interface Rect {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Signed area of a ring (shoelace formula); the sign follows the winding. */
export function ringArea(ring: Ring): number {
  let sum = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) sum += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return sum / 2;
}

/** Area of a polygon: its outer ring less its holes, whatever their winding. */
export function polyArea(poly: Poly): number {
  return poly.reduce((acc, ring, i) => acc + (i === 0 ? 1 : -1) * Math.abs(ringArea(ring)), 0);
}

/** Whether a point lies inside a ring (even-odd crossing test). */
export function insideRing(p: Pt, ring: Ring): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Whether a point lies inside a polygon: in its outer ring and in none of its holes. */
export function insidePoly(p: Pt, poly: Poly): boolean {
  return insideRing(p, poly[0]) && !poly.slice(1).some((hole) => insideRing(p, hole));
}

/** Points along a rectangle's edges (corners, then every ~4 pt), for "does it fit inside" tests. */
export function rectSamples(r: Rect): Pt[] {
  const out: Pt[] = [];
  const nx = Math.max(2, Math.ceil(r.w / 4));
  const ny = Math.max(2, Math.ceil(r.h / 4));
  for (let i = 0; i <= nx; i++) {
    const x = r.x + (r.w * i) / nx;
    out.push([x, r.y], [x, r.y + r.h]);
  }
  for (let j = 1; j < ny; j++) {
    const y = r.y + (r.h * j) / ny;
    out.push([r.x, y], [r.x + r.w, y]);
  }
  return out;
}

/** Whether two rectangles overlap. */
export const overlaps = (a: Rect, b: Rect): boolean => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
/** Whether rectangle `a` lies wholly inside rectangle `b`. */
export const within = (a: Rect, b: Rect): boolean => a.x >= b.x && a.y >= b.y && a.x + a.w <= b.x + b.w && a.y + a.h <= b.y + b.h;

// The helpers below run for every label candidate against every line of a large map: they are
// written as plain loops over module-level functions, since a closure made per call (and named by
// the TypeScript loader on each creation) cost a 500-unit plan's PDF most of its time.

/** Twice the signed area of the triangle a, b, c (which side of a–b point c lies on). */
function orientation(a: Pt, b: Pt, c: Pt): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
}

/** Whether segments p1–p2 and p3–p4 cross (touching ends do not count). */
export function segmentsCross(p1: Pt, p2: Pt, p3: Pt, p4: Pt): boolean {
  const d1 = orientation(p3, p4, p1);
  const d2 = orientation(p3, p4, p2);
  const d3 = orientation(p1, p2, p3);
  const d4 = orientation(p1, p2, p4);
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
}

function insideRect(p: Pt, r: Rect): boolean {
  return p[0] >= r.x && p[0] <= r.x + r.w && p[1] >= r.y && p[1] <= r.y + r.h;
}

/** True when the segment a–b touches the rectangle (an end inside it, or crossing an edge). */
export function segmentHitsRect(a: Pt, b: Pt, r: Rect): boolean {
  if (insideRect(a, r) || insideRect(b, r)) return true;
  // Wholly to one side of the rectangle: no crossing (the common case, answered without corners).
  if ((a[0] < r.x && b[0] < r.x) || (a[0] > r.x + r.w && b[0] > r.x + r.w) || (a[1] < r.y && b[1] < r.y) || (a[1] > r.y + r.h && b[1] > r.y + r.h)) return false;
  const c: Pt[] = [[r.x, r.y], [r.x + r.w, r.y], [r.x + r.w, r.y + r.h], [r.x, r.y + r.h]];
  for (let i = 0; i < 4; i += 1) if (segmentsCross(a, b, c[i], c[(i + 1) % 4])) return true;
  return false;
}
