/**
 * An invented property for document tests: "Coulee Bend" (~150 acres, irregular boundary) near
 * 43.27° N, 90.93° W, with a food plot, timber, a sanctuary, an access route, a stand site, a
 * camera site and a mock scrape (and a small plot inside the timber, too small to label). Shapes are laid out in metres east/north of the centre on the
 * WGS84 ellipsoid (GeographicLib); acres and lengths are measured the way the server does (turf).
 */
import type { LineString, Point, Polygon, Position } from 'geojson';
import { measureArea, measureLine } from '../../shared/domain/geometry';
import type { UnitKind } from '../../shared/domain/unit-kinds';
import type { PlanSummaryInput } from '../../templates/documents/plan-summary';
import { destination } from './geo-fixtures';

export const CENTRE = { lat: 43.27, lon: -90.93 };

/** The position `eastM` metres east and `northM` metres north of the centre (two geodesic steps). */
export function offset(eastM: number, northM: number): Position {
  const north = destination(CENTRE.lat, CENTRE.lon, northM >= 0 ? 0 : 180, Math.abs(northM));
  const end = destination(north.lat, north.lon, eastM >= 0 ? 90 : 270, Math.abs(eastM));
  return [end.lon, end.lat];
}

function polygon(pointsM: Array<[number, number]>): Polygon {
  const ring = pointsM.map(([e, n]) => offset(e, n));
  return { type: 'Polygon', coordinates: [[...ring, ring[0]]] };
}

/** The property boundary, counter-clockwise, with a notch on its east side. */
export const BOUNDARY = polygon([
  [-425, -310], [-50, -385], [310, -340], [455, -130], [270, -15], [440, 130],
  [385, 350], [65, 425], [-245, 385], [-455, 195], [-495, -75],
]);

export interface FixtureUnit {
  name: string;
  kind: UnitKind;
  geometry: Polygon | LineString | Point;
}

export const UNITS: FixtureUnit[] = [
  { name: 'North Ridge Timber', kind: 'timber', geometry: polygon([[-235, 120], [50, 100], [340, 165], [360, 325], [65, 400], [-230, 360], [-425, 205]]) },
  { name: 'Hollow Sanctuary', kind: 'sanctuary', geometry: polygon([[-455, -50], [-205, -75], [-145, -270], [-400, -285]]) },
  { name: 'Ridgetop Plot', kind: 'food-plot', geometry: polygon([[150, 230], [205, 235], [200, 280], [150, 275]]) },
  { name: 'Clover Plot', kind: 'food-plot', geometry: polygon([[75, -100], [210, -80], [205, -185], [80, -205]]) },
  {
    name: 'Ridge access',
    kind: 'access-route',
    geometry: { type: 'LineString', coordinates: [offset(-45, -378), offset(-5, -250), offset(55, -200), offset(60, -90), offset(40, 50), offset(30, 110)] },
  },
  { name: 'Oak Flat stand', kind: 'stand-site', geometry: { type: 'Point', coordinates: offset(35, -170) } },
  { name: 'Creek camera', kind: 'camera-site', geometry: { type: 'Point', coordinates: offset(-100, -210) } },
  { name: 'Ridge scrape', kind: 'mock-scrape', geometry: { type: 'Point', coordinates: offset(-50, 60) } },
];

/** Acres of an area unit or feet of a line, as the server computes and stores them. */
export function measured(unit: FixtureUnit): { acres: number | null; lengthFt: number | null } {
  if (unit.geometry.type === 'Polygon') return { acres: measureArea(unit.geometry).acres, lengthFt: null };
  if (unit.geometry.type === 'LineString') return { acres: null, lengthFt: measureLine(unit.geometry).lengthFt };
  return { acres: null, lengthFt: null };
}

/** The plan summary input for Coulee Bend, optionally with extra units. */
export function couleeBendSummary(extraUnits: FixtureUnit[] = []): PlanSummaryInput {
  return {
    firm: { name: 'Driftless Habitat Works', phone: '(608) 555-0142', email: 'plans@driftless-habitat.example' },
    client: { name: 'Marta and Jon Lindqvist' },
    property: { name: 'Coulee Bend', acres: measureArea(BOUNDARY).acres, boundary: BOUNDARY },
    planLabel: '2026 season, version 1',
    preparedOn: '2026-05-04',
    units: [...UNITS, ...extraUnits].map((u) => ({ ...u, ...measured(u) })),
  };
}
