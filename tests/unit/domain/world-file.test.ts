import { describe, expect, it } from 'vitest';
import { parseWorldFile, worldFileCorners } from '../../../shared/domain/world-file';

describe('world files', () => {
  // ESRI, "World files for raster datasets": lines A, D, B, E, C, F; C/F are the centre of the top-left pixel.
  const text = '0.5\n0.0\n0.0\n-0.5\n500000.25\n4800000.75\n';

  it('reads the six numbers in ESRI order', () => {
    expect(parseWorldFile(text)).toEqual({ a: 0.5, d: 0, b: 0, e: -0.5, c: 500000.25, f: 4800000.75 });
  });

  it('puts the corners on the pixel edges, half a pixel out from the centres (ESRI convention)', () => {
    const w = parseWorldFile(text);
    if ('error' in w) throw new Error(w.error);
    // 200 × 100 pixels at 0.5 m: 100 m wide, 50 m tall; top-left edge at C − A/2, F − E/2.
    expect(worldFileCorners(w, 200, 100)).toEqual([
      [500000, 4800001],
      [500100, 4800001],
      [500100, 4799951],
      [500000, 4799951],
    ]);
  });

  it('follows the rotation terms', () => {
    // A pixel (col, row) maps to x = A·col + B·row + C, y = D·col + E·row + F (ESRI).
    const corners = worldFileCorners({ a: 1, d: 1, b: 1, e: -1, c: 0, f: 0 }, 2, 2);
    expect(corners[0]).toEqual([-1, 0]);
    expect(corners[2]).toEqual([3, 0]); // (1.5, 1.5): x = 1.5 + 1.5, y = 1.5 − 1.5
  });

  it('refuses text that is not six numbers, with a sentence', () => {
    expect(parseWorldFile('1\n2\n3')).toEqual({ error: expect.stringContaining('six lines') });
    expect(parseWorldFile('0.5\n0\n0\n-0.5\nabc\n1')).toEqual({ error: expect.stringContaining('Line 5') });
    expect(parseWorldFile('0\n0\n0\n0\n1\n1')).toEqual({ error: expect.stringContaining('zero') });
  });
});
