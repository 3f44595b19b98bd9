/**
 * The stands-and-wind map draws through the shared projection. Its drawing must stay where the old
 * spherical Mercator fit (d3 `geoMercator().fitExtent`, 12 px padding in 640 × 420) put it: the two
 * differ only by the ellipsoid's shape (WGS84 meridian vs prime-vertical radius, about 0.4 % in the
 * north–south scale at 43.5° N; Snyder 1987, USGS PP 1395, ch. 4), a pixel or two on this map.
 */
import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { geoMercator } from 'd3-geo';
import type { Feature, FeatureCollection, Geometry, Point, Position } from 'geojson';
import { StandWindMap } from '../../../../src/features/hunting/components/stand-wind-map';
import type { StandWindsAnswer } from '../../../../shared/schemas/hunting';

// An invented farm in southwestern Wisconsin, about 1.2 km × 1 km. Rings wound clockwise, as d3's
// spherical paths need (a counter-clockwise ring there stands for the whole globe outside it).
const LON = -90.9;
const LAT = 43.5;
const ring = (pts: [number, number][]): Position[] => [...pts.map(([x, y]) => [LON + x, LAT + y]), [LON + pts[0]![0], LAT + pts[0]![1]]];
const cw = (pts: [number, number][]): Geometry => ({ type: 'Polygon', coordinates: [ring(pts)] });
const ccw = (g: Geometry): Geometry => (g.type === 'Polygon' ? { type: 'Polygon', coordinates: g.coordinates.map((r) => [...r].reverse()) } : g);
const boundary = cw([[0, 0], [0, 0.009], [0.015, 0.009], [0.015, 0.004], [0.012, 0]]);
const layout = [
  { id: 1, name: 'Ridge plot', kind: 'food-plot', geometry: cw([[0.002, 0.006], [0.002, 0.008], [0.005, 0.0078], [0.0048, 0.0058]]) },
  { id: 2, name: 'South bedding', kind: 'bedding-area', geometry: cw([[0.003, 0.001], [0.003, 0.003], [0.008, 0.0029], [0.0079, 0.0009]]) },
  { id: 3, name: 'East walk-in', kind: 'access-route', geometry: { type: 'LineString', coordinates: [[LON + 0.0148, LAT + 0.005], [LON + 0.01, LAT + 0.006], [LON + 0.006, LAT + 0.007]] } as Geometry },
  { id: 4, name: 'Ridge stand', kind: 'stand-site', geometry: { type: 'Point', coordinates: [LON + 0.0055, LAT + 0.007] } as Geometry },
  { id: 5, name: 'Hollow stand', kind: 'stand-site', geometry: { type: 'Point', coordinates: [LON + 0.01, LAT + 0.0035] } as Geometry },
];
const answer = (windingOf: (g: Geometry) => Geometry = (g) => g): StandWindsAnswer => ({
  data: [],
  meta: {
    settings: { coneHalfAngleDeg: 30, coneReachYd: 150, routeBufferYd: 100, routeToStandYd: 50, maxSitsPerWeek: 2 },
    routeWarnings: [],
    cautions: [],
    hasWindRecord: false,
    mayLogSits: true,
    layout: layout.map((u) => ({ ...u, geometry: windingOf(u.geometry) })),
    boundary: windingOf(boundary),
  },
});

const svgOf = (a: StandWindsAnswer) => renderToStaticMarkup(<StandWindMap answer={a} title="Stands" />);
// Stand groups (the north arrow's group is aria-hidden, so its tag does not close right after the transform).
const stands = (svg: string) => [...svg.matchAll(/<g transform="translate\(([-\d.]+),([-\d.]+)\)">/g)].map((m) => [Number(m[1]), Number(m[2])]);
const pathPoints = (svg: string) =>
  [...svg.matchAll(/<path d="(M[^"]*)"/g)]
    .map((m) => m[1]!)
    .filter((d) => !d.startsWith('M0,'))
    .map((d) => [...d.matchAll(/(-?[\d.]+),(-?[\d.]+)/g)].map((p) => [Number(p[1]), Number(p[2])]));

describe('the stands-and-wind map on the shared projection', () => {
  it('puts the stands and every vertex within 2 px of the old Mercator fit', () => {
    const features: Feature[] = [...layout.map((u) => ({ type: 'Feature' as const, properties: {}, geometry: u.geometry })), { type: 'Feature', properties: {}, geometry: boundary }];
    const old = geoMercator().fitExtent([[12, 12], [628, 408]], { type: 'FeatureCollection', features } as FeatureCollection);
    const svg = svgOf(answer());
    // Stands: the old projection of each point against the drawn translate.
    const drawn = stands(svg);
    const expected = layout.filter((u) => u.kind === 'stand-site').map((u) => old((u.geometry as Point).coordinates as [number, number])!);
    expect(drawn).toHaveLength(2);
    drawn.forEach(([x, y], i) => {
      expect(Math.abs(x! - expected[i]![0])).toBeLessThan(2);
      expect(Math.abs(y! - expected[i]![1])).toBeLessThan(2);
    });
    // Boundary, areas and the route: the same vertices, each within 2 px of the old place.
    const sources = [boundary, layout[0]!.geometry, layout[1]!.geometry, layout[2]!.geometry];
    const paths = pathPoints(svg);
    expect(paths).toHaveLength(sources.length);
    let worst = 0;
    sources.forEach((g, i) => {
      const coords = (g.type === 'Polygon' ? g.coordinates[0]!.slice(0, -1) : (g as { coordinates: Position[] }).coordinates).map((p) => old(p as [number, number])!);
      expect(paths[i]).toHaveLength(coords.length);
      paths[i]!.forEach(([x, y], j) => (worst = Math.max(worst, Math.abs(x! - coords[j]![0]), Math.abs(y! - coords[j]![1]))));
    });
    expect(worst).toBeLessThan(2);
    // Still fitted with the old padding: the boundary spans the height from 12 to 408 (it is the taller side here).
    const ys = paths[0]!.map(([, y]) => y!);
    expect(Math.min(...ys)).toBeCloseTo(12, 1);
    expect(Math.max(...ys)).toBeCloseTo(408, 1);
  });

  it('draws rings the same whichever way they are wound (GeoJSON’s counter-clockwise outer rings included)', () => {
    const a = svgOf(answer());
    const b = svgOf(answer(ccw));
    expect(stands(b)).toEqual(stands(a));
    const sorted = (svg: string) => pathPoints(svg).map((pts) => pts.map((p) => p.join(',')).sort());
    expect(sorted(b)).toEqual(sorted(a));
  });

  it('still draws a lone stand (no boundary, nothing else) on a small map instead of failing', () => {
    const lone: StandWindsAnswer = { ...answer(), meta: { ...answer().meta, boundary: null, layout: [layout[3]!] } };
    expect(stands(svgOf(lone))).toEqual([[320, 210]]);
  });
});
