import { describe, expect, it } from 'vitest';
import type { Polygon, MultiPolygon } from 'geojson';
import { areaCentroid, centroidOf } from '../../../shared/domain/centroid';

// Shapes a few hundred metres across at the equator, in steps of 0.001°, where the equal-area map is
// the plain lon/lat grid to better than 1e-9°: the centroids below are worked by hand from the
// composite-area rule Σ(Aᵢ·cᵢ)/ΣAᵢ (any statics textbook; common practice, no source for these shapes).
const S = 0.001;
const ring = (pts: [number, number][]) => [...pts, pts[0]!].map(([x, y]) => [x * S, y * S]);

describe('centroidOf', () => {
  it('puts an L-shape at (5/6, 5/6): a 2×1 block at (1, 0.5) plus a 1×1 block at (0.5, 1.5)', () => {
    // Area 3; x = (2·1 + 1·0.5)/3 = 0.8333…, y = (2·0.5 + 1·1.5)/3 = 0.8333…
    const L: Polygon = { type: 'Polygon', coordinates: [ring([[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]])] };
    const c = centroidOf(L);
    expect(c.lon / S).toBeCloseTo(2.5 / 3, 6);
    expect(c.lat / S).toBeCloseTo(2.5 / 3, 6);
  });

  it('moves a 4×4 square with a 1×1 hole at (1.5, 1.5) away from the hole, to 30.5/15', () => {
    // (16·2 − 1·1.5)/15 = 2.0333…; turf's centerOfMass joins the rings and misses this.
    const holed: Polygon = { type: 'Polygon', coordinates: [ring([[0, 0], [4, 0], [4, 4], [0, 4]]), ring([[1, 1], [1, 2], [2, 2], [2, 1]])] };
    const c = centroidOf(holed);
    expect(c.lon / S).toBeCloseTo(30.5 / 15, 6);
    expect(c.lat / S).toBeCloseTo(30.5 / 15, 6);
  });

  it('weighs the parts of a MultiPolygon by area: 1×1 at (0.5, 0.5) and 2×2 at (4, 1) → (3.3, 0.9)', () => {
    const multi: MultiPolygon = { type: 'MultiPolygon', coordinates: [[ring([[0, 0], [1, 0], [1, 1], [0, 1]])], [ring([[3, 0], [5, 0], [5, 2], [3, 2]])]] };
    const c = centroidOf(multi);
    expect(c.lon / S).toBeCloseTo(3.3, 6);
    expect(c.lat / S).toBeCloseTo(0.9, 6);
  });

  it('ignores the winding of rings and keeps the centre of a square far from the equator', () => {
    // A square about 100 m on a side at 43.5° N, drawn clockwise: symmetric, so its centre is its middle.
    const dLon = 0.0009 / Math.cos((43.5 * Math.PI) / 180);
    const sq: Polygon = { type: 'Polygon', coordinates: [[[-90, 43.5], [-90, 43.5009], [-90 + dLon, 43.5009], [-90 + dLon, 43.5], [-90, 43.5]]] };
    const c = centroidOf(sq);
    expect(c.lon).toBeCloseTo(-90 + dLon / 2, 7);
    expect(c.lat).toBeCloseTo(43.50045, 6);
  });

  it('answers the point itself, the vertex mean of a line, and null for no area', () => {
    expect(centroidOf({ type: 'Point', coordinates: [-90.5, 44.1] })).toEqual({ lon: -90.5, lat: 44.1 });
    const line = centroidOf({ type: 'LineString', coordinates: [[0, 0], [2, 0], [2, 2]] });
    expect(line.lon).toBeCloseTo(4 / 3, 9);
    expect(line.lat).toBeCloseTo(2 / 3, 9);
    expect(areaCentroid([])).toBeNull();
    expect(areaCentroid([[[[0, 0], [1, 0], [2, 0], [0, 0]]]])).toBeNull(); // a ring along the equator has no area
  });
});
