/**
 * The plan checks carry the hunting planner's access-route warnings, so the plan map's checks list
 * shows them: a route within the firm's distance (default 100 yd, common practice, no source) of a
 * bedding area or sanctuary, or crossing a food plot. Distances are laid out with GeographicLib's
 * direct problem (tests/support/geo-fixtures, itself checked against GeographicLib).
 */
import { describe, expect, it } from 'vitest';
import type { LineString } from 'geojson';
import { planWarnings, type PlanUnit } from '../../../shared/domain/plan-checks';
import { rectangleAt, destination } from '../../support/geo-fixtures';

const LAT = 43.267;
const LON = -90.935;
/** A north–south route whose nearest point is `eastM` metres east of the centre, 400 m long. */
function routeAt(eastM: number): LineString {
  const p = destination(LAT, LON, 90, eastM);
  const n = destination(p.lat, p.lon, 0, 200);
  const s = destination(p.lat, p.lon, 180, 200);
  return { type: 'LineString', coordinates: [[s.lon, s.lat], [n.lon, n.lat]] };
}
// A 100 m square centred on (LAT, LON): its east edge is 50 m east of the centre.
const bedding: PlanUnit = { id: '1', name: 'North thicket', kind: 'bedding-area', geometry: rectangleAt(LAT, LON, 100, 100) };

describe('access-route warnings in the plan checks', () => {
  it('warns when a route passes 50 m (55 yd) from a bedding area, and not at 150 m (164 yd)', () => {
    const near: PlanUnit = { id: '2', name: 'East lane', kind: 'access-route', geometry: routeAt(100) }; // 100 − 50 = 50 m ≈ 55 yd
    const far: PlanUnit = { id: '3', name: 'Far lane', kind: 'access-route', geometry: routeAt(200) }; // 150 m ≈ 164 yd
    const warnings = planWarnings({ boundary: null, units: [bedding, near, far] }).filter((w) => w.code.startsWith('route-'));
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ code: 'route-near-bedding', unitIds: ['2', '1'] });
    expect(warnings[0]!.message).toMatch(/within 55 yd of the bedding area “North thicket” \(keep at least 100 yd\)/);
  });

  it('uses the firm’s distance: at 200 yd the 164 yd route is warned about too', () => {
    const far: PlanUnit = { id: '3', name: 'Far lane', kind: 'access-route', geometry: routeAt(200) };
    const warnings = planWarnings({ boundary: null, units: [bedding, far], routeBufferYd: 200 });
    expect(warnings.map((w) => w.code)).toEqual(['route-near-bedding']);
  });

  it('warns when a route crosses a food plot, and names the sanctuary kind', () => {
    const plot: PlanUnit = { id: '4', name: 'Clover', kind: 'food-plot', geometry: rectangleAt(LAT, LON, 100, 100) };
    const sanctuary: PlanUnit = { id: '5', name: 'Hollow', kind: 'sanctuary', geometry: rectangleAt(LAT, LON + 0.01, 100, 100) };
    const through: PlanUnit = { id: '6', name: 'Plot path', kind: 'access-route', geometry: routeAt(0) };
    const codes = planWarnings({ boundary: null, units: [plot, sanctuary, through] }).map((w) => w.code);
    expect(codes).toContain('route-crosses-food-plot');
    expect(codes).not.toContain('route-near-sanctuary'); // the sanctuary is ~810 m east
  });

  it('leaves plans without access routes as they were', () => {
    expect(planWarnings({ boundary: null, units: [bedding] }).filter((w) => w.code.startsWith('route-'))).toEqual([]);
  });
});
