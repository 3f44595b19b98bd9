import { describe, expect, it } from 'vitest';
import type { LineString, Polygon } from 'geojson';
import { cursorMeasureText, SnapIndex } from '../../../../src/features/plan-map/lib/draw-assist';
import { isLargeAreaRefusal } from '../../../../src/features/plan-map/lib/large-area-answer';
import { ApiError } from '../../../../src/lib/api-client';
import { measureArea } from '../../../../shared/domain/geometry';
import { squareOfAcres } from '../../../support/geo-fixtures';

/** A flat test screen: 1e-5 degree per pixel, origin at (-90, 44), y growing southwards. */
const project = (lon: number, lat: number) => ({ x: (lon + 90) / 1e-5, y: (44 - lat) / 1e-5 });
const unproject = (x: number, y: number): [number, number] => [x * 1e-5 - 90, 44 - y * 1e-5];

describe('the measure beside the cursor', () => {
  it('writes acres and perimeter for a polygon being drawn, at the cursor corner, from the stored measure', () => {
    const square = squareOfAcres(44, -90, 10); // 10 acres by construction (GeographicLib square, NIST acre)
    const [a, b, c] = square.coordinates[0];
    // terra-draw's ring while drawing: placed corners, the cursor, then the first corner again
    const drawing: Polygon = { type: 'Polygon', coordinates: [[a, b, c, square.coordinates[0][3], a]] };
    const m = cursorMeasureText(drawing)!;
    expect(m.at).toEqual(square.coordinates[0][3]);
    expect(m.points).toBe(3);
    expect(m.text).toBe(`10.00 ac · ${Math.round(measureArea(square).perimeterFt).toLocaleString('en-US')} ft`);
  });

  it('writes feet for a line and counts the placed points without the cursor', () => {
    const line: LineString = { type: 'LineString', coordinates: [[-90, 44], [-90, 44.001], [-90.001, 44.001]] };
    const m = cursorMeasureText(line)!;
    expect(m.at).toEqual([-90.001, 44.001]);
    expect(m.points).toBe(2);
    expect(m.text).toMatch(/^\d{3} ft$/); // about 111 m + 80 m ≈ 628 ft (1° of latitude ≈ 111 km, from memory)
    expect(cursorMeasureText({ type: 'LineString', coordinates: [[-90, 44]] })).toBeNull();
  });
});

describe('snapping to the plan’s corners', () => {
  const index = new SnapIndex();
  index.set([
    { type: 'Polygon', coordinates: [[[-90, 44], [-89.999, 44], [-89.999, 43.999], [-90, 44]]] },
    { type: 'Point', coordinates: [-89.9995, 43.9995] },
  ]);

  it('answers the nearest corner within the pixel tolerance and nothing farther away', () => {
    expect(index.size).toBe(5);
    const near = project(-89.999, 44);
    expect(index.nearest(-89.999, 44, 10, project, unproject, [near.x + 4, near.y - 3])).toEqual([-89.999, 44]);
    expect(index.nearest(-89.999, 44, 10, project, unproject, [near.x + 40, near.y])).toBeUndefined();
    const point = project(-89.9995, 43.9995);
    expect(index.nearest(-89.9995, 43.9995, 10, project, unproject, [point.x, point.y + 2])).toEqual([-89.9995, 43.9995]);
  });

  it('holds nothing after an empty set', () => {
    const empty = new SnapIndex();
    empty.set([]);
    expect(empty.nearest(-90, 44, 10, project, unproject, [0, 0])).toBeUndefined();
  });
});

describe('the server’s large-area refusal', () => {
  it('is a 422 naming confirmLargeArea, alone or for one unit of a batch', () => {
    expect(isLargeAreaRefusal(new ApiError(422, 'The boundary measures …', 'unprocessable', [{ path: 'confirmLargeArea', message: '…' }]))).toBe(true);
    expect(isLargeAreaRefusal(new ApiError(422, '…', 'unprocessable', [{ path: 'units.3.confirmLargeArea', message: '…' }]))).toBe(true);
    expect(isLargeAreaRefusal(new ApiError(422, '…', 'validation', [{ path: 'geometry', message: '…' }]))).toBe(false);
    expect(isLargeAreaRefusal(new ApiError(409, '…', 'conflict', [{ path: 'confirmLargeArea', message: '…' }]))).toBe(false);
    expect(isLargeAreaRefusal(new Error('network'))).toBe(false);
  });
});
