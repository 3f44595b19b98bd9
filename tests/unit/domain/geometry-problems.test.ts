import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import type { Geometry, LineString, MultiPolygon, Point, Polygon, Position } from 'geojson';
import { findGeometryProblems } from '../../../shared/domain/geometry-problems';
import { reversedRing, sphereCircle, squareAt } from '../../support/geo-fixtures';

const opts = { maxVertices: 1000 };
const codes = (geom: unknown, options = opts) => findGeometryProblems(geom as Geometry, options).map((p) => p.code);

// A bow-tie whose two edges cross exactly at 44.1234 N, 90.5678 W (by construction: the
// diagonals of a square centred there).
const CROSS_LON = -90.5678;
const CROSS_LAT = 44.1234;
const D = 0.001;
const bowTie: Polygon = {
  type: 'Polygon',
  coordinates: [[
    [CROSS_LON - D, CROSS_LAT - D],
    [CROSS_LON + D, CROSS_LAT + D],
    [CROSS_LON + D, CROSS_LAT - D],
    [CROSS_LON - D, CROSS_LAT + D],
    [CROSS_LON - D, CROSS_LAT - D],
  ]],
};

describe('findGeometryProblems', () => {
  it('finds nothing wrong with a plain square, a square with a hole, a line and a point', () => {
    const outer = squareAt(44, -90.5, 400);
    const hole = squareAt(44, -90.5, 100);
    const donut: Polygon = { type: 'Polygon', coordinates: [outer.coordinates[0], reversedRing(hole.coordinates[0])] };
    const line: LineString = { type: 'LineString', coordinates: [[-90.5, 44], [-90.49, 44.01]] };
    const point: Point = { type: 'Point', coordinates: [-90.5, 44] };
    for (const g of [outer, donut, line, point]) expect(findGeometryProblems(g, opts)).toEqual([]);
  });

  it('finds a bow-tie and says where it crosses itself', () => {
    const problems = findGeometryProblems(bowTie, opts);
    expect(problems).toHaveLength(1);
    const [p] = problems;
    expect(p.code).toBe('self-intersection');
    // RFC 7946 §3.1.6 requires linear rings to follow the right-hand rule and not self-cross (OGC Simple Features)
    expect(p.where!.lon).toBeCloseTo(CROSS_LON, 9);
    expect(p.where!.lat).toBeCloseTo(CROSS_LAT, 9);
    expect(p.message).toBe(
      'The outline crosses itself near 44.1234 N, 90.5678 W: move a corner so the edges do not cross.',
    );
    expect(p.path).toEqual(['coordinates']);
  });

  it('names the part of a MultiPolygon that crosses itself', () => {
    const multi: MultiPolygon = { type: 'MultiPolygon', coordinates: [squareAt(44, -90, 100).coordinates, bowTie.coordinates] };
    const [p] = findGeometryProblems(multi, opts);
    expect(p.code).toBe('self-intersection');
    expect(p.message).toMatch(/^Part 2 of the outline crosses itself near 44\.1234 N, 90\.5678 W/);
    expect(p.path).toEqual(['coordinates', 1]);
  });

  it('does not mistake a doubled corner (double click) for a crossing', () => {
    const ring = squareAt(44, -90.5, 100).coordinates[0];
    const doubled: Polygon = { type: 'Polygon', coordinates: [[ring[0], ring[1], ring[1], ring[2], ring[3], ring[4]]] };
    expect(findGeometryProblems(doubled, opts)).toEqual([]);
  });

  it('refuses an unclosed ring and shows both ends', () => {
    const ring = squareAt(44, -90.5, 100).coordinates[0].slice(0, 4);
    const problems = findGeometryProblems({ type: 'Polygon', coordinates: [[...ring, [-90.5, 44.0001]]] }, opts);
    expect(problems.map((p) => p.code)).toEqual(['ring-not-closed']); // RFC 7946 §3.1.6: first and last positions equal
    expect(problems[0].path).toEqual(['coordinates', 0, 4]);
    expect(problems[0].message).toMatch(/^The outline is not closed: its last point \(44\.0001 N, 90\.5000 W\) must repeat its first point/);
  });

  it('refuses a ring with fewer than 4 positions', () => {
    const tri: Polygon = { type: 'Polygon', coordinates: [[[-90.5, 44], [-90.4, 44], [-90.5, 44]]] };
    const [p] = findGeometryProblems(tri, opts);
    expect(p.code).toBe('too-few-positions'); // RFC 7946 §3.1.6: a linear ring has four or more positions
    expect(p.message).toContain('needs at least 4');
    const stub: LineString = { type: 'LineString', coordinates: [[-90.5, 44]] };
    expect(codes(stub)).toEqual(['too-few-positions']); // RFC 7946 §3.1.4: two or more positions
  });

  it('refuses out-of-range coordinates and points at the position', () => {
    const ring = squareAt(44, -90.5, 100).coordinates[0].map((p) => [...p]);
    ring[2] = [190.25, 44];
    const [p] = findGeometryProblems({ type: 'Polygon', coordinates: [ring] }, opts);
    // WGS84 longitude −180..180, latitude −90..90 (RFC 7946 §4)
    expect(p.code).toBe('longitude-out-of-range');
    expect(p.path).toEqual(['coordinates', 0, 2]);
    expect(p.message).toBe('Point 3 of the outline has longitude 190.25, outside −180 to 180: correct that point.');
    expect(codes({ type: 'Point', coordinates: [-90.5, 91] })).toEqual(['latitude-out-of-range']);
  });

  it('suggests longitude/latitude order when the numbers look swapped', () => {
    const [p] = findGeometryProblems({ type: 'Point', coordinates: [44.1, -90.5] }, opts);
    expect(p.code).toBe('latitude-out-of-range');
    expect(p.message).toContain('GeoJSON puts longitude first'); // RFC 7946 §3.1.1: longitude, latitude
  });

  it('reports the first five bad positions and summarises the rest', () => {
    // Projected coordinates (metres, e.g. UTM) mistaken for degrees
    const ring: Position[] = [[500000, 4880000], [500100, 4880000], [500100, 4880100], [500000, 4880100], [500000, 4880000]];
    const line: LineString = { type: 'LineString', coordinates: [...ring, ...ring] };
    const problems = findGeometryProblems(line, opts);
    expect(problems).toHaveLength(6);
    expect(problems[5].message).toBe(
      "5 more points are not valid longitude, latitude positions: check the file's coordinate system is WGS84 longitude/latitude (EPSG:4326).",
    );
  });

  it('refuses positions that are not numbers without crashing', () => {
    const problems = findGeometryProblems(
      { type: 'Polygon', coordinates: [[[-90.5, 44], [-90.4, Number.NaN], [-90.4, '44.1'], [-90.5, 44.1], [-90.5, 44]]] } as unknown as Polygon,
      opts,
    );
    expect(problems.map((p) => p.code)).toEqual(['bad-structure', 'bad-structure']);
    expect(problems[0].path).toEqual(['coordinates', 0, 1]);
    expect(problems[1].message).toBe('Point 3 of the outline is not a longitude, latitude pair of numbers: fix or delete that point.');
    expect(codes({ type: 'Polygon', coordinates: [[[-90.5, 44], null, [-90.5, 44.1], [-90.5, 44]]] })).toEqual(['bad-structure']);
    expect(codes({ type: 'Polygon', coordinates: 'nope' })).toEqual(['bad-structure']);
    expect(codes({ type: 'GeometryCollection', geometries: [] })).toEqual(['unsupported-type']);
    expect(codes(null)).toEqual(['unsupported-type']);
  });

  it('refuses more vertices than the cap, with both numbers', () => {
    const circle = sphereCircle(44, -90.5, 200, 1200);
    const problems = findGeometryProblems(circle, { maxVertices: 1000 });
    expect(problems.map((p) => p.code)).toEqual(['too-many-vertices']);
    expect(problems[0].message).toContain('1,200 corners; the limit is 1,000');
    // The closing repeat is not a corner: exactly at the cap passes.
    expect(findGeometryProblems(circle, { maxVertices: 1200 })).toEqual([]);
  });

  it('refuses a hole outside its outer ring and says where', () => {
    const outer = squareAt(44, -90.5, 100).coordinates[0];
    const away = squareAt(44.01, -90.5, 20).coordinates[0];
    const problems = findGeometryProblems({ type: 'Polygon', coordinates: [outer, reversedRing(away)] }, opts);
    expect(problems.map((p) => p.code)).toEqual(['hole-outside-outer-ring']); // RFC 7946 §3.1.6 / OGC: holes lie inside
    expect(problems[0].path).toEqual(['coordinates', 1]);
    expect(problems[0].message).toMatch(/^Hole 1 of the outline lies outside its outer edge near 44\.0\d{3} N, 90\.5\d{3} W/);
  });

  it('reports a hole that crosses the outer edge as a crossing', () => {
    const outer = squareAt(44, -90.5, 100).coordinates[0];
    const straddling = squareAt(44, -90.4994, 40).coordinates[0]; // centred 48 m east, reaches 68 m: past the 50 m edge
    const [p] = findGeometryProblems({ type: 'Polygon', coordinates: [outer, reversedRing(straddling)] }, opts);
    expect(p.code).toBe('self-intersection');
    expect(p.message).toContain('keep holes inside it');
  });

  it('refuses Multi- shapes without parts', () => {
    expect(codes({ type: 'MultiPolygon', coordinates: [] })).toEqual(['too-few-positions']);
    expect(codes({ type: 'MultiLineString', coordinates: [] })).toEqual(['too-few-positions']);
    expect(codes({ type: 'MultiPoint', coordinates: [] })).toEqual(['too-few-positions']);
    expect(codes({ type: 'Polygon', coordinates: [] })).toEqual(['too-few-positions']);
  });

  it('refuses an outline whose corners lie on one line', () => {
    const flat: Polygon = { type: 'Polygon', coordinates: [[[-90.5, 44], [-90.49, 44], [-90.48, 44], [-90.5, 44]]] };
    expect(codes(flat)).toEqual(['no-area']);
  });

  it('feeds zod refinements with paths relative to the geometry', () => {
    const Schema = z.object({
      name: z.string(),
      geometry: z.custom<Geometry>((v) => typeof v === 'object' && v !== null).superRefine((geom, ctx) => {
        for (const p of findGeometryProblems(geom, opts)) ctx.addIssue({ code: 'custom', message: p.message, path: p.path });
      }),
    });
    const result = Schema.safeParse({ name: 'North plot', geometry: bowTie });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].path).toEqual(['geometry', 'coordinates']);
    expect(result.error!.issues[0].message).toContain('44.1234 N, 90.5678 W');
    expect(Schema.safeParse({ name: 'North plot', geometry: squareAt(44, -90.5, 100) }).success).toBe(true);
  });
});
