import { describe, expect, it } from 'vitest';
import type { Polygon, Position } from 'geojson';
import { extentOfPositions, fitProjection, metresPerDegree, positionsOf } from '../../../shared/domain/map-projection';

/**
 * Lengths of one degree on the WGS84 ellipsoid by the usual series (from memory; as tabulated with
 * the "length of a degree" tables, e.g. Wikipedia "Latitude"): of latitude
 * 111132.954 − 559.822·cos 2φ + 1.175·cos 4φ m, of longitude 111412.84·cos φ − 93.5·cos 3φ + 0.118·cos 5φ m.
 */
function seriesDegreeLengths(latDeg: number): { lon: number; lat: number } {
  const f = (latDeg * Math.PI) / 180;
  return {
    lat: 111132.954 - 559.822 * Math.cos(2 * f) + 1.175 * Math.cos(4 * f),
    lon: 111412.84 * Math.cos(f) - 93.5 * Math.cos(3 * f) + 0.118 * Math.cos(5 * f),
  };
}

/** The subpaths of path data written by d3-geo's geoPath ("M x,y L x,y … Z"), as lists of points. */
function subpaths(d: string): Array<{ points: Array<[number, number]>; closed: boolean }> {
  return d
    .split('M')
    .filter(Boolean)
    .map((part) => ({
      closed: part.endsWith('Z'),
      points: part
        .replace('Z', '')
        .split('L')
        .map((xy) => xy.split(',').map(Number) as [number, number]),
    }));
}

/** Even-odd fill test over every subpath (as SVG's fill-rule="evenodd" does). */
function filledEvenOdd(d: string, [x, y]: [number, number]): boolean {
  let inside = false;
  for (const { points } of subpaths(d)) {
    for (let i = 0, j = points.length - 1; i < points.length; j = i++) {
      const [xi, yi] = points[i];
      const [xj, yj] = points[j];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

describe('metres per degree on the WGS84 ellipsoid', () => {
  it('agrees with the degree-length series at 0°, 45° and 60°', () => {
    for (const lat of [0, 45, 60]) {
      const got = metresPerDegree(lat);
      const want = seriesDegreeLengths(lat);
      // The series are truncated; they agree with the closed forms to a few centimetres.
      expect(Math.abs(got.lat - want.lat)).toBeLessThan(0.05);
      expect(Math.abs(got.lon - want.lon)).toBeLessThan(0.05);
    }
    // Worked example at 45°: 111,131.78 m of latitude, 78,846.8 m of longitude (the series above).
    expect(metresPerDegree(45).lat).toBeCloseTo(111131.78, 1);
    expect(metresPerDegree(45).lon).toBeCloseTo(78846.8, 0);
  });
});

describe('fitting an extent into a box (d3-geo geoIdentity.reflectY(true).fitExtent)', () => {
  // Worked example: ±0.01° about 90° W, 45° N into a 220 × 120 box with 10 of padding.
  // Ground: 0.02° × 78,846.8 m = 1,576.94 m wide, 0.02° × 111,131.78 m = 2,222.64 m tall (series above).
  // The room inside the padding is 200 × 100, so the height limits: 100 / 2,222.64 = 0.044992 per metre.
  const deg = seriesDegreeLengths(45);
  const widthM = 0.02 * deg.lon;
  const heightM = 0.02 * deg.lat;
  const k = 100 / heightM;
  const p = fitProjection([-90.01, 44.99, -89.99, 45.01], { x: 0, y: 0, width: 220, height: 120 }, { padding: 10 });

  it('uses one scale on both axes, set by the limiting axis', () => {
    expect(p.unitsPerMetre).toBeCloseTo(k, 6);
  });

  it('centres the extent in the box and puts north up (fitExtent centres the object; reflectY flips y)', () => {
    expect(p.project(-90, 45)[0]).toBeCloseTo(110, 9);
    expect(p.project(-90, 45)[1]).toBeCloseTo(60, 9);
    // South-west corner: half the ground width left of the centre, on the bottom padding.
    const sw = p.project(-90.01, 44.99);
    expect(sw[0]).toBeCloseTo(110 - (widthM / 2) * k, 2);
    expect(sw[1]).toBeCloseTo(110, 6);
    // North-east corner: on the top padding, with the smaller y.
    const ne = p.project(-89.99, 45.01);
    expect(ne[0]).toBeCloseTo(110 + (widthM / 2) * k, 2);
    expect(ne[1]).toBeCloseTo(10, 6);
  });

  it('inverts what it projects', () => {
    const [lon, lat] = p.invert(...p.project(-89.995, 45.004));
    expect(lon).toBeCloseTo(-89.995, 10);
    expect(lat).toBeCloseTo(45.004, 10);
  });

  it('widens a point to the minimum span and refuses an extent with no size without one', () => {
    const point = fitProjection([10, 50, 10, 50], { x: 0, y: 0, width: 200, height: 100 }, { minSpanM: 200 });
    expect(point.project(10, 50)).toEqual([100, 50]);
    // 200 m across the 100-unit height: half a unit per metre.
    expect(point.unitsPerMetre).toBeCloseTo(0.5, 12);
    expect(() => fitProjection([10, 50, 10, 50], { x: 0, y: 0, width: 200, height: 100 })).toThrow(RangeError);
    expect(() => fitProjection([10, 50, 11, 51], { x: 0, y: 0, width: 20, height: 20 }, { padding: 10 })).toThrow(RangeError);
  });
});

describe('SVG path data (d3-geo geoPath)', () => {
  const outer: Position[] = [[-90.01, 44.99], [-89.99, 44.99], [-89.99, 45.01], [-90.01, 45.01], [-90.01, 44.99]];
  const hole: Position[] = [[-90.002, 44.998], [-90.002, 45.002], [-89.998, 45.002], [-89.998, 44.998], [-90.002, 44.998]];
  const p = fitProjection([-90.01, 44.99, -89.99, 45.01], { x: 0, y: 0, width: 220, height: 120 }, { padding: 10 });

  it('draws each ring as a closed subpath, and a hole stays a hole under even-odd fill', () => {
    const d = p.path({ type: 'Polygon', coordinates: [outer, hole] });
    const parts = subpaths(d);
    expect(parts).toHaveLength(2);
    expect(parts.every((s) => s.closed)).toBe(true);
    // geoPath leaves out a ring's repeated closing position: four corners each.
    expect(parts.map((s) => s.points.length)).toEqual([4, 4]);
    expect(filledEvenOdd(d, p.project(-90, 45))).toBe(false); // the middle of the hole
    expect(filledEvenOdd(d, p.project(-90.006, 45))).toBe(true); // between the hole and the outer edge
  });

  it('draws the same bounded figure whatever the winding (planar, so never "the whole globe outside the ring")', () => {
    const ccw: Polygon = { type: 'Polygon', coordinates: [outer] };
    const cw: Polygon = { type: 'Polygon', coordinates: [[...outer].reverse()] };
    const box = (d: string) => {
      const pts = subpaths(d).flatMap((s) => s.points);
      return [Math.min(...pts.map((q) => q[0])), Math.min(...pts.map((q) => q[1])), Math.max(...pts.map((q) => q[0])), Math.max(...pts.map((q) => q[1]))];
    };
    expect(box(p.path(ccw))).toEqual(box(p.path(cw)));
    expect(box(p.path(ccw))).toEqual([74.53, 10, 145.47, 110]);
  });

  it('writes lines open, rounds to the asked digits, and leaves points out', () => {
    const d = p.path({ type: 'LineString', coordinates: [[-90.01, 44.99], [-89.99, 45.01]] });
    expect(d).toBe('M74.53,110L145.47,10');
    const coarse = fitProjection([-90.01, 44.99, -89.99, 45.01], { x: 0, y: 0, width: 220, height: 120 }, { padding: 10, digits: 1 });
    expect(coarse.path({ type: 'LineString', coordinates: [[-90.01, 44.99], [-89.99, 45.01]] })).toBe('M74.5,110L145.5,10');
    expect(p.path({ type: 'Point', coordinates: [-90, 45] })).toBe('');
    expect(p.path({ type: 'GeometryCollection', geometries: [{ type: 'Point', coordinates: [-90, 45] }] })).toBe('');
  });
});

describe('extents', () => {
  it('spans every position of a geometry and skips numbers that are not finite', () => {
    const collection = { type: 'GeometryCollection' as const, geometries: [{ type: 'Point' as const, coordinates: [3, 4] }, { type: 'LineString' as const, coordinates: [[1, 2], [5, -1], [Number.NaN, 9]] }] };
    expect(extentOfPositions(positionsOf(collection))).toEqual([1, -1, 5, 4]);
    expect(extentOfPositions([])).toBeNull();
  });
});
