import { describe, expect, it } from 'vitest';
import type { LineString, MultiPolygon, Point, Polygon } from 'geojson';
import { measureArea, measureLine } from '../../../shared/domain/geometry';
import {
  FOOD_PLOT_MIN_ACRES,
  FOOD_PLOT_MIN_WIDTH_FT,
  inscribedWidthFt,
  planWarnings,
  shareByKind,
  type PlanUnit,
  type PlanWarning,
} from '../../../shared/domain/plan-checks';
import { destination, geodesicLine, rectangleAt, squareAt, squareOfAcres } from '../../support/geo-fixtures';

const LAT = 44;
const LON = -90.5;
const FT = 0.3048; // metres per international foot (NIST Handbook 44, App. C)
const MILE_M = 1609.344; // 5,280 ft (NIST Handbook 44, App. C)

/** A nominal PLSS section, 1 mi × 1 mi (640 acres, BLM Manual of Surveying Instructions), as the property. */
const boundary = squareAt(LAT, LON, MILE_M);
const boundaryEastLon = boundary.coordinates[0][1][0];

let nextId = 0;
function unit(kind: PlanUnit['kind'], geometry: PlanUnit['geometry'], name = `${kind} ${++nextId}`): PlanUnit {
  return { id: `u${++nextId}`, name, kind, geometry };
}
const withCode = (warnings: PlanWarning[], code: PlanWarning['code']) => warnings.filter((w) => w.code === code);

/** A food plot strip 600 ft long (east–west) and `widthFt` wide. */
const strip = (widthFt: number, lat = LAT, lon = LON): Polygon => rectangleAt(lat, lon, 600 * FT, widthFt * FT);

describe('food plot size (NRCS CP12 job sheet: at least 0.25 acre and 40 ft wide)', () => {
  it('uses the CP12 limits', () => {
    expect(FOOD_PLOT_MIN_ACRES).toBe(0.25); // NRCS CRP practice CP12 job sheet
    expect(FOOD_PLOT_MIN_WIDTH_FT).toBe(40); // NRCS CRP practice CP12 job sheet
  });

  it('warns about a 0.2-acre food plot and not a 0.3-acre one', () => {
    const small = unit('food-plot', squareOfAcres(LAT, LON, 0.2), 'Corner clover');
    const fine = unit('food-plot', squareOfAcres(LAT, LON + 0.01, 0.3));
    const warnings = withCode(planWarnings({ boundary, units: [small, fine] }), 'food-plot-small');
    expect(warnings).toHaveLength(1);
    expect(warnings[0].unitIds).toEqual([small.id]);
    expect(warnings[0].acres).toBeCloseTo(0.2, 2); // 0.2 acre by construction, turf within 0.35 % of the ellipsoid
    expect(warnings[0].message).toBe(
      '"Corner clover" is 0.20 acre; a food plot should be at least 0.25 acre (NRCS practice CP12): enlarge it or merge it with a nearby plot.',
    );
  });

  it('warns that a 30 ft wide strip is narrow and estimates its width', () => {
    const narrow = unit('food-plot', strip(30), 'Logging road plot');
    const warnings = planWarnings({ boundary, units: [narrow] });
    const [w] = withCode(warnings, 'food-plot-narrow');
    expect(w.unitIds).toEqual([narrow.id]);
    expect(w.lengthFt).toBeGreaterThan(29); // 30 ft by construction, bisection to 0.25 ft plus buffer projection
    expect(w.lengthFt).toBeLessThan(31);
    expect(w.message).toMatch(/^"Logging road plot" is only about (29|30) ft wide; a food plot should be at least 40 ft wide/);
    expect(withCode(warnings, 'food-plot-small')).toEqual([]); // 30 × 600 = 18,000 ft² = 0.41 acre
  });

  it('does not warn about a 60 ft wide strip', () => {
    expect(withCode(planWarnings({ boundary, units: [unit('food-plot', strip(60))] }), 'food-plot-narrow')).toEqual([]);
  });

  it('draws the line at 40 ft: 38 ft warns, 42 ft does not', () => {
    const warns = (widthFt: number) =>
      withCode(planWarnings({ boundary, units: [unit('food-plot', strip(widthFt))] }), 'food-plot-narrow').length;
    expect(warns(38)).toBe(1);
    expect(warns(42)).toBe(0);
  });

  it('estimates the inscribed width of a strip and caps a wide plot at the cap', () => {
    expect(inscribedWidthFt(strip(24), 40)).toBeCloseTo(24, 0); // 24 ft by construction
    expect(inscribedWidthFt(squareAt(LAT, LON, 100), 40)).toBe(40); // 328 ft square: capped
  });

  it('names the narrow part of a multi-part food plot', () => {
    const wide = squareOfAcres(LAT, LON, 1).coordinates;
    const thin = strip(25, LAT + 0.01).coordinates;
    const plot: MultiPolygon = { type: 'MultiPolygon', coordinates: [wide, thin] };
    const [w] = withCode(planWarnings({ boundary, units: [unit('food-plot', plot, 'Twin plots')] }), 'food-plot-narrow');
    expect(w.message).toMatch(/^Part 2 of "Twin plots" is only about 2[45] ft wide/);
  });

  it('applies the food plot checks to food plots only', () => {
    const thinTimber = unit('timber', strip(20));
    const warnings = planWarnings({ boundary, units: [thinTimber] });
    expect(withCode(warnings, 'food-plot-narrow')).toEqual([]);
    expect(withCode(warnings, 'food-plot-small')).toEqual([]);
  });
});

describe('overlaps between area units', () => {
  it('reports two 100 m squares overlapping by half with half a square of overlap', () => {
    const a = unit('food-plot', squareAt(LAT, LON, 100), 'East clover');
    const shifted = destination(LAT, LON, 90, 50);
    const b = unit('bedding-area', squareAt(LAT, shifted.lon, 100), 'Thicket');
    const [w, ...rest] = withCode(planWarnings({ boundary, units: [a, b] }), 'overlap');
    expect(rest).toEqual([]);
    expect(w.unitIds).toEqual([a.id, b.id]);
    // Half of one square (geometry): the squares share exactly the east half of the first
    const half = measureArea(a.geometry as Polygon).acres / 2;
    expect(Math.abs(w.acres! / half - 1)).toBeLessThan(0.001);
    // 50 m × 100 m = 5,000 m² = 1.2355 acres (4,046.8564224 m²/acre, NIST HB 44); the squares are
    // built on the ellipsoid (GeographicLib), so the measure agrees within the overlap's own slack
    expect(Math.abs(w.acres! / (5000 / 4046.8564224) - 1)).toBeLessThan(0.001);
    expect(w.message).toBe(
      '"East clover" and "Thicket" overlap by 1.24 acres: trim one of them so that ground is not planned or billed twice.',
    );
  });

  it('ignores squares that only share an edge, and squares far apart', () => {
    const a = unit('timber', squareAt(LAT, LON, 100));
    const east = destination(LAT, LON, 90, 100);
    const b = unit('timber', squareAt(LAT, east.lon, 100)); // shares a's east edge
    const c = unit('water', squareAt(LAT + 0.005, LON + 0.005, 50));
    expect(withCode(planWarnings({ boundary, units: [a, b, c] }), 'overlap')).toEqual([]);
  });

  it('reports overlaps even without a boundary, and skips the boundary checks', () => {
    const a = unit('food-plot', squareAt(LAT, LON, 100));
    const b = unit('sanctuary', squareAt(LAT, LON, 60));
    const warnings = planWarnings({ boundary: null, units: [a, b] });
    expect(warnings.map((w) => w.code)).toEqual(['overlap']);
  });
});

describe('units and the property boundary', () => {
  it('reports the acres of a unit that straddles the boundary', () => {
    const straddling = unit('cover-planting', squareAt(LAT, boundaryEastLon, 100), 'Switchgrass block');
    const [w, ...rest] = withCode(planWarnings({ boundary, units: [straddling] }), 'partly-outside-boundary');
    expect(rest).toEqual([]);
    // Centred on the east boundary line, so half is outside (geometry)
    const half = measureArea(straddling.geometry as Polygon).acres / 2;
    expect(Math.abs(w.acres! / half - 1)).toBeLessThan(0.001);
    expect(w.message).toBe(
      '"Switchgrass block" extends 1.24 acres outside the property boundary: trim it to the boundary, or correct the boundary.',
    );
  });

  it('reports a unit entirely outside', () => {
    const away = unit('food-plot', squareOfAcres(LAT + 0.1, LON, 1), 'Neighbour plot');
    const [w] = withCode(planWarnings({ boundary, units: [away] }), 'outside-boundary');
    expect(w.unitIds).toEqual([away.id]);
    expect(w.acres).toBeCloseTo(measureArea(away.geometry as Polygon).acres, 9);
    expect(w.message).toContain('lies entirely outside the property boundary');
  });

  it('does not warn about a unit inside or one touching the boundary from inside', () => {
    const inside = unit('timber', squareAt(LAT, LON, 500));
    const westOfEdge = destination(LAT, boundaryEastLon, 270, 50);
    const touching = unit('timber', squareAt(LAT, westOfEdge.lon, 100)); // east edge on the boundary
    const warnings = planWarnings({ boundary, units: [inside, touching] });
    expect(withCode(warnings, 'partly-outside-boundary')).toEqual([]);
    expect(withCode(warnings, 'outside-boundary')).toEqual([]);
  });

  it('reports the length of a line that runs out of the property', () => {
    const line = geodesicLine(LAT, LON, 90, 1200); // centre to 1,200 m east; the edge is 804.672 m (½ mi) east
    const trail = unit('access-route', line, 'Ridge trail');
    const [w] = withCode(planWarnings({ boundary, units: [trail] }), 'partly-outside-boundary');
    // 1,200 − 804.672 = 395.328 m of 1,200 m outside (geometry), as a share of turf's length
    const expectedFt = measureLine(line as LineString).lengthFt * (395.328 / 1200);
    expect(Math.abs(w.lengthFt! / expectedFt - 1)).toBeLessThan(0.01);
    expect(w.message).toMatch(/^"Ridge trail" runs 1,29\d ft outside the property boundary/);
  });

  it('reports a point outside', () => {
    const stand: Point = { type: 'Point', coordinates: [boundaryEastLon + 0.001, LAT] };
    const inStand: Point = { type: 'Point', coordinates: [LON, LAT] };
    const warnings = planWarnings({ boundary, units: [unit('stand-site', stand, 'Stand 4'), unit('stand-site', inStand)] });
    expect(warnings.map((w) => w.message)).toEqual([
      '"Stand 4" is outside the property boundary: move it inside, or correct the boundary.',
    ]);
  });
});

describe('food plots as a share of the property (1–10 %, Georgia DNR biologist; weak source)', () => {
  const plots = (...acres: number[]) => acres.map((a, i) => unit('food-plot', squareOfAcres(LAT + 0.004 * i, LON, a)));

  it('warns below 1 %', () => {
    const [w] = withCode(planWarnings({ boundary, units: plots(2, 2) }), 'food-plot-share-low');
    expect(w.acres).toBeCloseTo(4, 1); // 4 of ~640 acres: 0.6 %
    expect(w.unitIds).toHaveLength(2);
    expect(w.message).toMatch(/^Food plots total (3\.99|4\.00) acres, 0\.6 % of the property; 1–10 % is common practice/);
  });

  it('warns above 10 %', () => {
    const warnings = planWarnings({ boundary, units: plots(40, 40) });
    expect(warnings.map((w) => w.code)).toEqual(['food-plot-share-high']); // the plots neither overlap nor leave the boundary
    const [w] = warnings;
    // 40 + 40 acres built on the ellipsoid; 80 / 640 = 12.5 %, which rounds either way at the last digit
    expect(w.message).toMatch(/^Food plots total 80\.0 acres, 1[23] % of the property/);
  });

  it('is quiet between 1 and 10 %, and when there are no food plots', () => {
    const within = planWarnings({ boundary, units: plots(10, 10) }); // 20 / 640 = 3.1 %
    expect(within.filter((w) => w.code.startsWith('food-plot-share'))).toEqual([]);
    expect(planWarnings({ boundary, units: [unit('timber', squareAt(LAT, LON, 100))] })).toEqual([]);
  });
});

describe('bad unit geometry', () => {
  it('gives a check-failed warning instead of throwing', () => {
    const wrong = unit('food-plot', geodesicLine(LAT, LON, 0, 100), 'Scribble');
    const warnings = planWarnings({ boundary, units: [wrong] });
    expect(warnings).toHaveLength(1);
    expect(warnings[0].code).toBe('check-failed');
    expect(warnings[0].message).toBe(
      'Could not check "Scribble": A food plot must be drawn as an area (Polygon), not a LineString. Redraw the shape if the problem stays.',
    );
  });
});

describe('invalid shapes', () => {
  const D = 0.001;
  const bowTie: Polygon = {
    type: 'Polygon',
    coordinates: [[[LON - D, LAT - D], [LON + D, LAT + D], [LON + D, LAT - D], [LON - D, LAT + D], [LON - D, LAT - D]]],
  };

  it('leaves a self-crossing unit out of the checks and says where to fix it', () => {
    // A bow-tie's two lobes cancel in a signed area sum, so measuring it would report about 0 acres.
    const warnings = planWarnings({ boundary, units: [unit('food-plot', bowTie, 'Bow tie'), unit('timber', squareAt(LAT, LON, 300))] });
    expect(warnings).toEqual([
      {
        code: 'invalid-geometry',
        unitIds: [expect.any(String)],
        message: '"Bow tie" cannot be checked until its shape is fixed: The outline crosses itself near 44.0000 N, 90.5000 W: move a corner so the edges do not cross.',
      },
    ]);
  });

  it('skips the boundary checks when the boundary itself is invalid', () => {
    const away = unit('food-plot', squareOfAcres(LAT + 0.1, LON, 1));
    const warnings = planWarnings({ boundary: bowTie, units: [away] });
    expect(warnings.map((w) => w.code)).toEqual(['invalid-geometry']);
    expect(warnings[0].unitIds).toEqual([]);
    expect(warnings[0].message).toMatch(/^The property boundary cannot be used for checks/);
  });

  it('reports a shape over the vertex cap instead of spending seconds on it', () => {
    const warnings = planWarnings({ boundary, units: [unit('timber', squareAt(LAT, LON, 300))], maxVertices: 3 });
    expect(warnings.map((w) => w.code)).toEqual(['invalid-geometry', 'invalid-geometry']); // boundary and unit: 4 corners each
  });
});

describe('shareByKind', () => {
  const boundaryAcres = 640; // nominal section (BLM Manual of Surveying Instructions)

  it('gives acres and percent per area kind in palette order, then the unassigned rest', () => {
    const units = [
      unit('timber', squareOfAcres(LAT, LON, 100)),
      unit('food-plot', squareOfAcres(LAT + 0.02, LON, 10)),
      unit('food-plot', squareOfAcres(LAT - 0.02, LON, 6)),
      unit('access-route', geodesicLine(LAT, LON, 0, 500)),
    ];
    const rows = shareByKind(boundaryAcres, units);
    expect(rows.map((r) => r.kind)).toEqual(['food-plot', 'timber', 'unassigned']);
    expect(rows.map((r) => r.label)).toEqual(['Food plot', 'Timber', 'Unassigned']);
    const [food, timber, rest] = rows;
    expect(food.acres).toBeCloseTo(16, 1); // 10 + 6 acres by construction, within 0.35 %
    expect(food.pctOfProperty).toBeCloseTo((food.acres / 640) * 100, 9);
    expect(timber.pctOfProperty).toBeCloseTo(15.6, 1); // 100 / 640 = 15.625 %, less turf's −0.2 % at 44°N
    expect(rest.acres).toBeCloseTo(640 - food.acres - timber.acres, 9);
    expect(rows.reduce((s, r) => s + r.pctOfProperty, 0)).toBeCloseTo(100, 9);
  });

  it('counts overlapping units once each and never gives a negative remainder', () => {
    const big = squareOfAcres(LAT, LON, 400);
    const rows = shareByKind(boundaryAcres, [unit('timber', big), unit('sanctuary', big)]);
    expect(rows.find((r) => r.kind === 'unassigned')!.acres).toBe(0);
    expect(rows.reduce((s, r) => s + r.pctOfProperty, 0)).toBeGreaterThan(100);
  });

  it('refuses a boundary without area', () => {
    expect(() => shareByKind(0, [])).toThrow('draw the boundary before computing shares by kind');
    expect(() => shareByKind(Number.NaN, [])).toThrow(RangeError);
  });
});
