/**
 * The product's own ellipsoidal measure (shared/domain/ellipsoid.ts, used through geometry.ts)
 * against the reference: GeographicLib (C. Karney, "Algorithms for geodesics", J. Geodesy 87:43–55,
 * 2013; npm geographiclib-geodesic 2.2.0), PolygonArea for areas and perimeters, Inverse for lengths.
 * The goal is 0.01 % for any shape of 0.1 to 50,000 acres between 20° and 65° latitude.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { LineString, MultiLineString, MultiPolygon, Polygon, Position } from 'geojson';
import { measureArea, measureLine } from '../../../shared/domain/geometry';
import { measureRing, pathLengthM } from '../../../shared/domain/ellipsoid';
import { destination, ellipsoidAreaSqM, ellipsoidLengthM, reversedRing, WGS84 } from '../../support/geo-fixtures';

/** The goal: within 0.01 % of GeographicLib. */
const TOLERANCE = 1e-4;
/** Square metres per international acre: 43,560 ft² × 0.3048² (NIST Handbook 44, App. C). */
const SQ_M_PER_ACRE = 4046.8564224;
/** Metres per statute mile: 5,280 × 0.3048 (NIST Handbook 44, App. C). */
const METRES_PER_MILE = 1609.344;

const relDiff = (value: number, reference: number): number => value / reference - 1;

/** GeographicLib's perimeter of every ring (geodesic edges), metres. */
function referencePerimeterM(rings: Position[][]): number {
  let total = 0;
  for (const ring of rings) {
    const p = WGS84.Polygon(false);
    for (const [lon, lat] of ring.slice(0, -1)) p.AddPoint(lat, lon);
    total += p.Compute(false, true).perimeter!;
  }
  return total;
}

/**
 * A random star-shaped ring around (lat, lon): `n` corners at increasing bearings, each at a random
 * share of the radius that gives roughly `acres`, stretched east–west by `aspect` (long thin strips).
 * Corners are placed with GeographicLib's Direct, so the shape is defined on the ellipsoid.
 */
function starRing(lat: number, lon: number, acres: number, n: number, radii: number[], aspect: number): Position[] {
  const meanRadius = Math.sqrt((acres * SQ_M_PER_ACRE) / Math.PI / aspect);
  const ring: Position[] = [];
  for (let i = 0; i < n; i++) {
    const bearing = (360 * i) / n;
    const stretch = 1 + (aspect - 1) * Math.abs(Math.sin((bearing * Math.PI) / 180));
    const p = destination(lat, lon, bearing, meanRadius * radii[i % radii.length] * stretch);
    ring.push([p.lon, p.lat]);
  }
  ring.reverse(); // bearings run clockwise; GeoJSON outer rings are counter-clockwise
  ring.push(ring[0]);
  return ring;
}

const latitude = fc.double({ min: 20, max: 65, noNaN: true });
const longitude = fc.double({ min: -125, max: -67, noNaN: true });
/** 0.1 to 50,000 acres, spread evenly on a log scale. */
const acreage = fc.double({ min: Math.log(0.1), max: Math.log(50000), noNaN: true }).map(Math.exp);
const radii = fc.array(fc.double({ min: 0.5, max: 1.5, noNaN: true }), { minLength: 3, maxLength: 60 });
const aspect = fc.oneof(fc.constant(1), fc.double({ min: 1, max: 25, noNaN: true }));

describe('area and perimeter against GeographicLib PolygonArea', () => {
  it('agree within 0.01 % on random polygons of 0.1–50,000 acres at 20–65°N', () => {
    fc.assert(
      fc.property(latitude, longitude, acreage, radii, aspect, (lat, lon, acres, rs, stretch) => {
        const ring = starRing(lat, lon, acres, rs.length, rs, stretch);
        const polygon: Polygon = { type: 'Polygon', coordinates: [ring] };
        const m = measureArea(polygon);
        // Reference: GeographicLib PolygonArea (Karney 2013), area and perimeter
        expect(Math.abs(relDiff(m.sqM, ellipsoidAreaSqM(polygon)))).toBeLessThan(TOLERANCE);
        expect(Math.abs(relDiff(m.perimeterFt * 0.3048, referencePerimeterM([ring])))).toBeLessThan(TOLERANCE);
      }),
      { numRuns: 400 },
    );
  });

  it('agree within 0.01 % on random polygons with holes', () => {
    fc.assert(
      fc.property(latitude, longitude, acreage, radii, fc.double({ min: 0.1, max: 0.45, noNaN: true }), (lat, lon, acres, rs, holeShare) => {
        const outer = starRing(lat, lon, acres, rs.length, rs, 1);
        // A hole of a smaller star well inside the outer ring (every outer corner is at least half the radius out)
        const hole = reversedRing(starRing(lat, lon, acres * holeShare * holeShare * 0.2, 7, [1, 0.9, 1.1], 1));
        const polygon: Polygon = { type: 'Polygon', coordinates: [outer, hole] };
        const m = measureArea(polygon);
        expect(Math.abs(relDiff(m.sqM, ellipsoidAreaSqM(polygon)))).toBeLessThan(TOLERANCE); // GeographicLib, outer − hole
        expect(Math.abs(relDiff(m.perimeterFt * 0.3048, referencePerimeterM([outer, hole])))).toBeLessThan(TOLERANCE);
      }),
      { numRuns: 150 },
    );
  });

  it('agree within 0.01 % on random multipolygons whose parts lie up to 50 km apart', () => {
    fc.assert(
      fc.property(latitude, longitude, fc.array(fc.tuple(acreage, radii, fc.double({ min: 0, max: 50000, noNaN: true }), fc.double({ min: 0, max: 360, noNaN: true })), { minLength: 2, maxLength: 5 }), (lat, lon, parts) => {
        const polygons = parts.map(([acres, rs, offsetM, bearing]) => {
          const centre = destination(lat, lon, bearing, offsetM);
          return [starRing(centre.lat, centre.lon, acres / parts.length, rs.length, rs, 1)];
        });
        const multi: MultiPolygon = { type: 'MultiPolygon', coordinates: polygons };
        const m = measureArea(multi);
        expect(Math.abs(relDiff(m.sqM, ellipsoidAreaSqM(multi)))).toBeLessThan(TOLERANCE); // GeographicLib, sum of parts
        expect(Math.abs(relDiff(m.perimeterFt * 0.3048, referencePerimeterM(polygons.flat())))).toBeLessThan(TOLERANCE);
      }),
      { numRuns: 100 },
    );
  });

  it('gives the same area whatever the winding and whether the ring is closed', () => {
    const ring = starRing(45, -93, 160, 9, [1, 0.8, 1.2], 1);
    const open = ring.slice(0, -1);
    expect(measureRing(reversedRing(ring)).areaSqM).toBeCloseTo(measureRing(ring).areaSqM, 6);
    expect(measureRing(open).areaSqM).toBeCloseTo(measureRing(ring).areaSqM, 6);
    expect(measureRing(open).perimeterM).toBeCloseTo(measureRing(ring).perimeterM, 6);
  });
});

describe('lengths against GeographicLib Inverse', () => {
  it('agree within 0.01 % on random lines, edges from 1 m to 200 km, at 20–65°N', () => {
    const leg = fc.tuple(fc.double({ min: 0, max: 360, noNaN: true }), fc.double({ min: Math.log(1), max: Math.log(200000), noNaN: true }).map(Math.exp));
    fc.assert(
      fc.property(latitude, longitude, fc.array(leg, { minLength: 1, maxLength: 30 }), (lat, lon, legs) => {
        const coordinates: Position[] = [[lon, lat]];
        for (const [bearing, metres] of legs) {
          const [lastLon, lastLat] = coordinates[coordinates.length - 1];
          if (lastLat > 66 || lastLat < 19) break; // keep the walk inside the latitudes of the goal
          const p = destination(lastLat, lastLon, bearing, metres);
          coordinates.push([p.lon, p.lat]);
        }
        if (coordinates.length < 2) return;
        const line: LineString = { type: 'LineString', coordinates };
        expect(Math.abs(relDiff(measureLine(line).lengthM, ellipsoidLengthM(line)))).toBeLessThan(TOLERANCE); // GeographicLib Inverse s12
      }),
      { numRuns: 400 },
    );
  });

  it('sums the parts of a multi-line and measures a single point as zero', () => {
    const a = { type: 'LineString', coordinates: [[-90, 44], [-89.9, 44.05]] } satisfies LineString;
    const b = { type: 'LineString', coordinates: [[-91, 40], [-91.2, 40.3], [-91.1, 40.6]] } satisfies LineString;
    const multi: MultiLineString = { type: 'MultiLineString', coordinates: [a.coordinates, b.coordinates] };
    expect(Math.abs(relDiff(measureLine(multi).lengthM, ellipsoidLengthM(a) + ellipsoidLengthM(b)))).toBeLessThan(TOLERANCE); // GeographicLib Inverse
    expect(pathLengthM([[-90, 44]])).toBe(0);
  });
});

describe('legal definitions and the figures of the issue', () => {
  /** A square one statute mile on a side along the meridian and the geodesic east, built with GeographicLib. */
  function mileSquare(lat: number, lon: number): Polygon {
    const ne = destination(lat, lon, 90, METRES_PER_MILE);
    const nw = destination(lat, lon, 0, METRES_PER_MILE);
    const ring: Position[] = [[lon, lat], [ne.lon, ne.lat], [ne.lon, nw.lat], [nw.lon, nw.lat], [lon, lat]];
    return { type: 'Polygon', coordinates: [ring] };
  }

  it('reads a one-mile section at 48°N and at 61.5°N as 640 acres, like GeographicLib', () => {
    for (const lat of [48, 61.5]) {
      const section = mileSquare(lat, -100);
      const reference = ellipsoidAreaSqM(section) / SQ_M_PER_ACRE; // GeographicLib PolygonArea
      // 1 mi² = 640 acres (BLM Manual of Surveying Instructions; NIST HB 44): a section
      expect(Math.abs(reference / 640 - 1), `the fixture at ${lat}°N`).toBeLessThan(1e-3);
      // Before this change turf's sphere read 638.0 acres at 48°N (−0.29 %) and −0.59 % at 61.5°N
      expect(Math.abs(relDiff(measureArea(section).acres, reference)), `${lat}°N`).toBeLessThan(TOLERANCE);
    }
  });

  it('reads a mile due east at 36.5°N as 5,280 ft (not 5,267.8 ft)', () => {
    const end = destination(36.5, -90, 90, METRES_PER_MILE);
    const mile: LineString = { type: 'LineString', coordinates: [[-90, 36.5], [end.lon, end.lat]] };
    // 1 mi = 5,280 ft (NIST Handbook 44, App. C); the line is a geodesic mile by GeographicLib Direct
    expect(Math.abs(relDiff(measureLine(mile).lengthFt, 5280))).toBeLessThan(TOLERANCE);
    expect(measureLine(mile).lengthFt.toFixed(1)).toBe('5280.0');
  });

  it('converts with the international acre of 4,046.8564224 m² (NIST Handbook 44, App. C)', () => {
    const m = measureArea(mileSquare(40, -95));
    expect(m.acres).toBeCloseTo(m.sqM / 4046.8564224, 9);
  });
});
