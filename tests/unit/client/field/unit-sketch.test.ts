import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { geoUri, sketchUnit } from '../../../../src/features/field/lib/unit-sketch';

/** The x/y extent of the numbers in an SVG path. */
function extent(d: string) {
  const nums = [...d.matchAll(/[ML](-?[\d.]+)[ ,](-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
  const xs = nums.map((p) => p[0]);
  const ys = nums.map((p) => p[1]);
  return { w: Math.max(...xs) - Math.min(...xs), h: Math.max(...ys) - Math.min(...ys), nums };
}

const box = (lon: number, lat: number, dLon: number, dLat: number): Polygon => ({
  type: 'Polygon',
  coordinates: [[[lon, lat], [lon + dLon, lat], [lon + dLon, lat + dLat], [lon, lat + dLat], [lon, lat]]],
});

describe('the geo URI for the phone’s maps app', () => {
  it('puts latitude first, as RFC 5870 does', () => {
    // RFC 5870 section 1: "geo:13.4125,103.8667" is latitude 13.4125, longitude 103.8667.
    expect(geoUri([103.8667, 13.4125])).toBe('geo:13.4125,103.8667');
    // A western-hemisphere point keeps its minus sign on the longitude (RFC 5870 section 3.3).
    expect(geoUri([-90.93748, 43.26571])).toBe('geo:43.26571,-90.93748');
  });

  it('rounds to six decimals and can carry a label for Android’s maps apps', () => {
    // Six decimals of a degree are about 0.11 m of latitude (common practice, no source).
    expect(geoUri([-90.9374812345, 43.2657098765], 'Club plot')).toBe('geo:43.26571,-90.937481?q=43.26571,-90.937481(Club%20plot)');
  });

  it('answers null for no position or one out of range', () => {
    expect(geoUri(null)).toBeNull();
    expect(geoUri([10, 95])).toBeNull(); // latitude beyond 90° (RFC 5870 section 3.4.2, the WGS-84 ranges; section number from memory)
    expect(geoUri([190, 10])).toBeNull();
  });
});

describe('the unit’s small map', () => {
  it('draws a square of ground as a square at 60° N: longitude shrinks by cos(latitude)', () => {
    // Equirectangular projection about a standard parallel: x = λ·cos φ1 (Snyder, Map Projections —
    // A Working Manual, USGS PP 1395, 1987, ch. 12, equidistant cylindrical). cos 60° = 0.5, so 0.002° of longitude spans
    // the same ground as 0.001° of latitude.
    const sketch = sketchUnit(box(10, 59.9995, 0.002, 0.001), 300, 300, [], 0)!;
    const { w, h } = extent(sketch.areaPath);
    expect(w / h).toBeCloseTo(1, 2);
  });

  it('keeps north up and fits the box with its padding', () => {
    const sketch = sketchUnit(box(-90.938, 43.2655, 0.0015, 0.0007), 320, 200, [], 16)!;
    const { nums } = extent(sketch.areaPath);
    // The ring starts at the south-west corner and goes east, then north: the north edge has the smaller y.
    expect(nums[2][1]).toBeLessThan(nums[1][1]);
    expect(nums[1][0]).toBeGreaterThan(nums[0][0]);
    for (const [x, y] of nums) {
      expect(x).toBeGreaterThanOrEqual(16);
      expect(x).toBeLessThanOrEqual(304);
      expect(y).toBeGreaterThanOrEqual(16);
      expect(y).toBeLessThanOrEqual(184);
    }
    expect(sketch.linePath).toBe('');
  });

  it('places photo positions near the unit and counts those far away', () => {
    const plot = box(-90.938, 43.2655, 0.0015, 0.0007);
    const inside = { id: 1, position: [-90.93725, 43.26585] as [number, number] };
    const farAway = { id: 2, position: [-89.4, 43.07] as [number, number] }; // about 125 km east
    const sketch = sketchUnit(plot, 320, 200, [inside, farAway])!;
    expect(sketch.placed.map((p) => p.id)).toEqual([1]);
    expect(sketch.offMap).toEqual([2]);
    // The photo in the middle of the plot lands in the middle of the drawing.
    expect(sketch.placed[0].x).toBeCloseTo(160, 0);
    expect(sketch.placed[0].y).toBeCloseTo(100, 0);
  });

  it('draws a point unit in the middle of a frame about 220 m across, and lines as lines', () => {
    const stand = sketchUnit({ type: 'Point', coordinates: [-90.8815, 43.5495] }, 200, 200, [], 0)!;
    expect(stand.points).toEqual([{ x: 100, y: 100 }]);
    const trail = sketchUnit({ type: 'LineString', coordinates: [[-90.9395, 43.27], [-90.936, 43.2697], [-90.933, 43.2696]] }, 320, 200)!;
    expect(trail.areaPath).toBe('');
    expect(trail.linePath.startsWith('M')).toBe(true);
    expect(trail.linePath).not.toContain('Z');
  });

  it('answers null when there is nothing to draw', () => {
    expect(sketchUnit(null, 320, 200)).toBeNull();
    expect(sketchUnit({ type: 'Polygon', coordinates: [] }, 320, 200)).toBeNull();
  });
});
