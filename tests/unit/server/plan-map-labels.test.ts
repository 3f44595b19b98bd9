import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { areaCentroid } from '../../../shared/domain/centroid';
import { renderPlanMap } from '../../../templates/documents/kit/map-svg';
import { offset } from '../../support/document-fixtures';

const ring = (pointsM: Array<[number, number]>) => {
  const r = pointsM.map(([e, n]) => offset(e, n));
  return [...r, r[0]];
};

describe('the plan map’s area labels', () => {
  // An invented 800 m square timber stand with a 300 m × 600 m opening in its west half: the
  // area-weighted centre lies east of the square's middle (common practice, no source: the
  // centroid of a shape with a hole is the area-weighted difference of the two centroids).
  const stand: Polygon = {
    type: 'Polygon',
    coordinates: [ring([[-400, -400], [400, -400], [400, 400], [-400, 400]]), ring([[-350, -300], [-50, -300], [-50, 300], [-350, 300]])],
  };

  it('start from the one shared centroid (shared/domain/centroid.ts), so a hole moves the label', () => {
    const map = renderPlanMap({ units: [{ name: 'Opening stand', kind: 'timber', geometry: stand }], widthPt: 504, heightPt: 430 });
    const [label] = map.layout.labels;
    const centre = areaCentroid([stand.coordinates])!;
    const [x, y] = map.layout.projection.project(centre.lon, centre.lat);
    expect(label.xPt).toBeCloseTo(x, 6);
    expect(label.yPt).toBeCloseTo(y, 6);
    // Outer 640,000 m² at x = 0 less the opening's 180,000 m² at x = −200 m: (0 + 200 × 180,000) / 460,000 = 78.3 m east.
    const [middleX] = map.layout.projection.project(offset(0, 0)[0], offset(0, 0)[1]);
    expect((label.xPt - middleX) / map.layout.projection.unitsPerMetre).toBeCloseTo(78.3, 0);
  });
});
