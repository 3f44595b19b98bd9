import { describe, expect, it } from 'vitest';
import { areaIn, formatArea, formatLength, HECTARES_PER_ACRE, lengthIn } from '../../../shared/units';

describe('areas and lengths in the firm’s units', () => {
  it('converts with the exact legal factors', () => {
    // 1 acre = 0.40468564224 ha exactly; 1 ft = 0.3048 m exactly (NIST Handbook 44, Appendix C).
    expect(HECTARES_PER_ACRE).toBeCloseTo(0.40468564224, 12);
    expect(areaIn(100, 'hectares')).toBeCloseTo(40.468564224, 9);
    expect(areaIn(100, 'acres')).toBe(100);
    expect(lengthIn(1000, 'metres')).toBeCloseTo(304.8, 9);
  });

  it('writes areas in acres or hectares', () => {
    expect(formatArea(0.2)).toBe('0.20 acre');
    expect(formatArea(1)).toBe('1.00 acre');
    expect(formatArea(3.454)).toBe('3.45 acres');
    expect(formatArea(133.12)).toBe('133.1 acres');
    expect(formatArea(12_345.6)).toBe('12,345.6 acres');
    expect(formatArea(133.12, 'acres', { short: true })).toBe('133.1 ac');
    // 133.12 ac × 0.40468564224 = 53.87 ha (from the factor above).
    expect(formatArea(133.12, 'hectares')).toBe('53.9 ha');
    expect(formatArea(2, 'hectares')).toBe('0.81 ha');
  });

  it('writes lengths in feet or metres, with miles or kilometres when long', () => {
    expect(formatLength(1250)).toBe('1,250 ft');
    expect(formatLength(1250, 'metres')).toBe('381 m');
    expect(formatLength(10_560)).toBe('2.00 mi (10,560 ft)');
    // 10,560 ft × 0.3048 = 3,218.688 m.
    expect(formatLength(10_560, 'metres')).toBe('3.22 km (3,219 m)');
  });
});
