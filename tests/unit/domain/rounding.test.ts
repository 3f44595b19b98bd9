import { describe, expect, it } from 'vitest';
import { ceilWhole, lineAmountCents, packagesFor, roundHalfUp, roundHalfUpCents, roundLineQuantity, sumCents } from '../../../shared/domain/rounding';

describe('money rounding (one rule: half up, once per line)', () => {
  it('rounds halves of a cent up and everything else to the nearest cent', () => {
    expect(roundHalfUpCents(49.5)).toBe(50); // worked example: 1.5 × 33 ¢ = 49.5 ¢ → 50 ¢ (half up)
    expect(roundHalfUpCents(49.49)).toBe(49); // common practice, no source
    expect(roundHalfUpCents(-49.5)).toBe(-50); // halves go away from zero (documented rule)
  });

  it('is not fooled by binary floating-point noise', () => {
    // 1.005 × 100 is 100.49999999999999 in binary; the amount is really 100.5 ¢ → 101 ¢ (half up).
    expect(1.005 * 100).toBeLessThan(100.5);
    expect(lineAmountCents(1.005, 100)).toBe(101);
    // 2.345 is stored as 2.34499…; to 2 decimals half up it is 2.35 (worked example).
    expect(roundLineQuantity(2.345)).toBe(2.35);
    expect(roundHalfUp(0.125, 2)).toBe(0.13); // worked example
  });

  it('rounds package counts up without float noise', () => {
    expect(ceilWhole(0.1 * 3 * 10)).toBe(3); // 0.30000000000000004 × 10 → 3 whole packages, not 4 (worked example)
    expect(ceilWhole(3.01)).toBe(4);
    expect(packagesFor(24, 10)).toEqual({ packages: 3, leftover: 6 }); // 24 lb in 10-lb bags: 3 bags, 6 lb left (worked example)
    expect(packagesFor(0, 10)).toEqual({ packages: 0, leftover: 0 });
  });

  it('sums integer cents exactly and refuses fractions', () => {
    expect(sumCents([10, 20, 30])).toBe(60);
    expect(() => sumCents([10, 0.5])).toThrow(/integers/);
  });
});
