/**
 * Stand winds: bearings and destinations against GeographicLib (C. Karney, "Algorithms for
 * geodesics", J. Geodesy 87:43–55, 2013; npm geographiclib-geodesic 2.2.0), the scent cone's
 * geometry, and the 16-wind judgement on constructed layouts. Convention (the example): a
 * wind is named for where it blows FROM, so a wind from the south carries scent north.
 */
import { describe, expect, it } from 'vitest';
import type { LineString, Point, Polygon } from 'geojson';
import { destination, inverse } from '../../../shared/domain/geodesic';
import { coneReaches, METRES_PER_YARD, pathToAreaM } from '../../../shared/domain/scent';
import {
  accessRouteWarnings,
  DEFAULT_HUNTING_SETTINGS,
  downwindBearing,
  huntableShare,
  huntingSettings,
  judgeStandWinds,
  windSector,
  type LayoutUnit,
} from '../../../shared/domain/stand-winds';
import { rectangleAt, WGS84, destination as refDestination } from '../../support/geo-fixtures';

const LAT = 38.9;
const LON = -92.3;
const at = (bearing: number, metres: number) => {
  const p = refDestination(LAT, LON, bearing, metres);
  return [p.lon, p.lat];
};
/** A square area of `sideM` centred `metres` from the stand along `bearing`, built with GeographicLib's Direct. */
const squareAt = (bearing: number, metres: number, sideM: number): Polygon => {
  const [lon, lat] = at(bearing, metres) as [number, number];
  return rectangleAt(lat, lon, sideM, sideM);
};
const stand: Point = { type: 'Point', coordinates: [LON, LAT] };

describe('bearings and destinations on the ellipsoid', () => {
  const cases = [
    { from: [LON, LAT], to: [LON + 0.004, LAT + 0.003] },
    { from: [-100.1, 45.2], to: [-100.05, 45.18] },
    { from: [-81.5, 30.1], to: [-81.5, 30.2] },
    { from: [-120, 60], to: [-119.2, 59.6] },
  ];
  it.each(cases)('inverse matches GeographicLib Inverse to a millimetre and 1e-6°: %o', ({ from, to }) => {
    const ours = inverse(from, to);
    const ref = WGS84.Inverse(from[1]!, from[0]!, to[1]!, to[0]!);
    expect(Math.abs(ours.distanceM - ref.s12!)).toBeLessThan(1e-3);
    const refAz = (ref.azi1! + 360) % 360;
    expect(Math.abs(ours.bearingDeg - refAz)).toBeLessThan(1e-6);
  });

  it.each([0, 22.5, 135, 200.5, 359])('destination matches GeographicLib Direct (bearing %s°, 450 m and 12 km)', (bearing) => {
    for (const d of [450, 12000]) {
      const [lon, lat] = destination([LON, LAT], bearing, d);
      const ref = WGS84.Direct(LAT, LON, bearing, d);
      expect(Math.abs(lat! - ref.lat2!)).toBeLessThan(1e-9);
      expect(Math.abs(lon! - ref.lon2!)).toBeLessThan(1e-9);
    }
  });
});

describe('the downwind scent cone', () => {
  const cone = (fromDeg: number, halfAngleDeg = 30, reachM = 300) => ({ apex: [LON, LAT], bearingDeg: downwindBearing(fromDeg), halfAngleDeg, reachM });

  it('a wind from the south (180°) carries scent north (0°), and from the west (270°) east (90°)', () => {
    expect(downwindBearing(180)).toBe(0);
    expect(downwindBearing(270)).toBe(90);
    expect(windSector(11.2)).toBe('N');
    expect(windSector(11.3)).toBe('NNE');
    expect(windSector(348.8)).toBe('N');
  });

  it('reaches a small square just inside its edge and not one just outside its half-angle or reach', () => {
    // Points placed with GeographicLib Direct at bearings relative to the cone's axis (north).
    const tiny = 4;
    expect(coneReaches(cone(180), squareAt(28, 200, tiny))).toBe(true);
    expect(coneReaches(cone(180), squareAt(33, 200, tiny))).toBe(false);
    expect(coneReaches(cone(180), squareAt(0, 296, tiny))).toBe(true);
    expect(coneReaches(cone(180), squareAt(0, 305, tiny))).toBe(false);
    expect(coneReaches(cone(180), squareAt(180, 100, tiny))).toBe(false);
  });

  it('reaches an area whose corners are all outside it when an edge crosses it (a wide strip across the axis)', () => {
    const strip = squareAt(0, 250, 2000);
    expect(coneReaches(cone(180), strip)).toBe(true);
  });

  it('measures a route’s distance to an area on the ellipsoid (GeographicLib Inverse for the expected gap)', () => {
    const area = squareAt(0, 200, 100); // its south edge is 150 m north of the stand
    const route: LineString = { type: 'LineString', coordinates: [at(270, 100), at(90, 100)] };
    const expected = WGS84.Inverse(LAT, LON, refDestination(LAT, LON, 0, 150).lat, LON).s12!;
    expect(Math.abs(pathToAreaM(route.coordinates, area) - expected)).toBeLessThan(0.5);
  });
});

describe('the 16-wind judgement', () => {
  const unit = (id: number, kind: LayoutUnit['kind'], name: string, geometry: LayoutUnit['geometry']): LayoutUnit => ({ id, kind, name, geometry });

  it('bedding area due north: a wind from the south is not suitable, a wind from the north is (the issue’s example)', () => {
    const units = [unit(2, 'bedding-area', 'North bedding', squareAt(0, 150, 80))];
    const [result] = judgeStandWinds([{ id: 1, name: 'Oak stand', geometry: stand }], units);
    const s = result!.winds.find((w) => w.from === 'S')!;
    const n = result!.winds.find((w) => w.from === 'N')!;
    expect(s.suitable).toBe(false);
    expect(s.reasons).toEqual([{ kind: 'bedding-area', unitId: 2, name: 'North bedding' }]);
    expect(n.suitable).toBe(true);
    expect(n.reasons).toEqual([]);
    // With a 30° half-angle, only winds whose downwind bearing lies within about ±45° of north reach it.
    const bad = result!.winds.filter((w) => !w.suitable).map((w) => w.from);
    expect(bad).toEqual(expect.arrayContaining(['SSW', 'S', 'SSE']));
    expect(bad).not.toContain('E');
    expect(bad).not.toContain('W');
  });

  it('names a sanctuary to the east for a west wind, and the watched plot’s approach side', () => {
    const units = [
      unit(3, 'sanctuary', 'Creek sanctuary', squareAt(90, 200, 60)),
      unit(4, 'food-plot', 'Clover', squareAt(180, 120, 60)),
    ];
    const [result] = judgeStandWinds([{ id: 1, name: 'Plot stand', geometry: stand, watchedUnitId: 4, approachFrom: 'W' }], units);
    const w = result!.winds.find((x) => x.from === 'W')!;
    expect(w.reasons.map((r) => r.kind)).toContain('sanctuary');
    // Deer come to the plot from its west side; a wind from the north-east lays scent to the south-west, over that side.
    const ne = result!.winds.find((x) => x.from === 'NE')!;
    expect(ne.reasons).toContainEqual({ kind: 'approach-side', unitId: 4, name: 'Clover' });
    // A wind from the south-west lays scent north-east, away from both.
    expect(result!.winds.find((x) => x.from === 'SW')!.suitable).toBe(true);
  });

  it('a stand suits a wind only when some route to it does too', () => {
    const bedding = unit(2, 'bedding-area', 'East bedding', squareAt(90, 250, 80));
    // One route comes in from the west, far from the bedding area.
    const west = unit(5, 'access-route', 'West trail', { type: 'LineString', coordinates: [at(270, 500), at(270, 10)] });
    const [alone] = judgeStandWinds([{ id: 1, name: 'S1', geometry: stand }], [bedding, west]);
    expect(alone!.routeIds).toEqual([5]);
    // A wind from the east: neither the stand's cone nor the trail's (both laid west) reaches the bedding area.
    expect(alone!.winds.find((x) => x.from === 'E')!.suitable).toBe(true);
    // A wind from the west lays both the stand's and the trail's scent east over it.
    expect(alone!.winds.find((x) => x.from === 'W')!.reasons.map((r) => r.kind)).toEqual(['bedding-area', 'route']);
    // A route walked in from the south along the bedding area's west edge: a west wind carries its scent over the bedding.
    const south = unit(6, 'access-route', 'South trail', { type: 'LineString', coordinates: [at(135, 400), at(150, 10)] });
    const [both] = judgeStandWinds([{ id: 1, name: 'S1', geometry: stand }], [bedding, south]);
    const nw = both!.winds.find((x) => x.from === 'SW')!;
    expect(nw.reasons).toContainEqual({ kind: 'route', unitId: 6, name: 'South trail' });
    // With the west trail as a second way in, the wind from the south-west is judged on the stand alone.
    const [either] = judgeStandWinds([{ id: 1, name: 'S1', geometry: stand }], [bedding, south, west]);
    expect(either!.winds.find((x) => x.from === 'SW')!.reasons.filter((r) => r.kind === 'route')).toEqual([]);
  });

  it('huntable share adds the rose’s shares of the suitable winds', () => {
    const units = [unit(2, 'bedding-area', 'North bedding', squareAt(0, 150, 80))];
    const [result] = judgeStandWinds([{ id: 1, name: 'Oak', geometry: stand }], units);
    // Worked by hand: half the hours from N (suitable), half from S (not).
    expect(huntableShare(result!.winds, [{ from: 'N', share: 0.5 }, { from: 'S', share: 0.5 }])).toBe(0.5);
  });
});

describe('access route plan checks', () => {
  it('warns within the firm distance of a bedding area and when crossing a food plot (100 yd default: common practice, no source)', () => {
    const units: LayoutUnit[] = [
      { id: 1, kind: 'bedding-area', name: 'Bed', geometry: squareAt(0, 200, 100) }, // south edge 150 m north
      { id: 2, kind: 'food-plot', name: 'Plot', geometry: squareAt(180, 100, 60) },
      { id: 3, kind: 'access-route', name: 'Lane', geometry: { type: 'LineString', coordinates: [at(270, 200), at(90, 200)] } },
      { id: 4, kind: 'access-route', name: 'Cut', geometry: { type: 'LineString', coordinates: [at(180, 300), at(0, 60)] } },
    ];
    const warnings = accessRouteWarnings(units);
    // Lane is 150 m = 164 yd from the bedding: no warning at 100 yd; with a 200 yd setting it is warned.
    expect(warnings.filter((w) => w.unitIds[0] === 3)).toEqual([]);
    expect(warnings.find((w) => w.unitIds[0] === 4 && w.code === 'route-crosses-food-plot')).toBeTruthy();
    expect(warnings.find((w) => w.unitIds[0] === 4 && w.code === 'route-near-bedding')?.distanceYd).toBe(Math.round(90 / METRES_PER_YARD));
    const wider = accessRouteWarnings(units, { ...DEFAULT_HUNTING_SETTINGS, routeBufferYd: 200 });
    expect(wider.find((w) => w.unitIds[0] === 3)?.distanceYd).toBe(Math.round(150 / METRES_PER_YARD));
  });

  it('reads the firm’s settings with defaults for what is unset or nonsense', () => {
    expect(huntingSettings({ hunting: { coneReachYd: 200, coneHalfAngleDeg: -3 } })).toEqual({ ...DEFAULT_HUNTING_SETTINGS, coneReachYd: 200 });
  });
});
