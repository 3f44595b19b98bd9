import { describe, expect, it } from 'vitest';
import type { MultiPolygon, Polygon } from 'geojson';
import { drawBoundary } from '../../../../../src/features/properties/components/boundary-preview';

const points = (d: string) => [...d.matchAll(/[ML]([-\d.]+)[ ,]([-\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);

describe('drawBoundary', () => {
  it('fits a square of equal degrees at 60°N into the box as a rectangle half as wide as tall', () => {
    // cos(60°) = 0.5 exactly (trigonometric identity), so one degree of longitude draws half as wide as one of latitude.
    const square: Polygon = { type: 'Polygon', coordinates: [[[10, 59.99], [10.02, 59.99], [10.02, 60.01], [10, 60.01], [10, 59.99]]] };
    const drawing = drawBoundary(square, 200, 200, 0)!;
    const pts = points(drawing.d);
    const xs = pts.map((p) => p[0]);
    const ys = pts.map((p) => p[1]);
    const w = Math.max(...xs) - Math.min(...xs);
    const h = Math.max(...ys) - Math.min(...ys);
    expect(h).toBeCloseTo(200, 0);
    expect(w / h).toBeCloseTo(0.5, 2); // cos(60°) = 0.5 at the mid-latitude, within 2e-4 over ±0.01°
    expect(Math.min(...xs)).toBeCloseTo(50, 0); // centred: (200 − 100) / 2
  });

  it('draws north up: the northern edge gets the smaller y', () => {
    const tri: Polygon = { type: 'Polygon', coordinates: [[[-90, 40], [-89.99, 40], [-89.995, 40.01], [-90, 40]]] };
    const pts = points(drawBoundary(tri, 100, 100, 10)!.d);
    const apex = pts[2];
    expect(apex[1]).toBeCloseTo(10, 0); // the northern apex sits on the top padding
    expect(pts[0][1]).toBeCloseTo(90, 0); // the southern base on the bottom padding
  });

  it('draws every ring of a multipolygon, holes included, as closed subpaths', () => {
    const multi: MultiPolygon = {
      type: 'MultiPolygon',
      coordinates: [
        [
          [[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]],
          [[0.4, 0.4], [0.6, 0.4], [0.6, 0.6], [0.4, 0.6], [0.4, 0.4]],
        ],
        [[[2, 0], [3, 0], [3, 1], [2, 0]]],
      ],
    };
    const d = drawBoundary(multi, 300, 100)!.d;
    expect(d.match(/M/g)).toHaveLength(3);
    expect(d.match(/Z/g)).toHaveLength(3);
  });

  it('answers null for an empty or single-point boundary instead of dividing by zero', () => {
    expect(drawBoundary({ type: 'MultiPolygon', coordinates: [] }, 100, 100)).toBeNull();
    expect(drawBoundary({ type: 'Polygon', coordinates: [[[5, 5], [5, 5], [5, 5], [5, 5]]] }, 100, 100)).toBeNull();
  });
});
