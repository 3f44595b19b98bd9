import { afterEach, describe, expect, it } from 'vitest';
import { setFirmUnits } from '../../../src/lib/firm-units';
import { formatAcres, formatFeet } from '../../../src/lib/format';
import { formatAcresShort, formatFeet as formatMapFeet, showsImperial } from '../../../src/features/plan-map/lib/measure-format';

afterEach(() => setFirmUnits(null));

describe('screens write areas and lengths in the firm’s units', () => {
  it('acres and feet by default, and for an unknown unit', () => {
    setFirmUnits({ firmAreaUnit: 'furlongs', firmLengthUnit: null });
    expect(formatAcres(133.12)).toBe('133.1 ac');
    expect(formatFeet(1250)).toBe('1,250 ft');
    expect(formatAcresShort(12.345)).toBe('12.35 ac');
    expect(formatMapFeet(1250)).toBe('1,250 ft');
    expect(showsImperial()).toBe(true);
  });

  it('hectares and metres once the firm chose them (1 ac = 0.40468564224 ha, 1 ft = 0.3048 m exactly, NIST Handbook 44 App. C)', () => {
    setFirmUnits({ firmAreaUnit: 'hectares', firmLengthUnit: 'metres' });
    // 133.12 ac × 0.40468564224 = 53.872 ha.
    expect(formatAcres(133.12)).toBe('53.9 ha');
    expect(formatAcresShort(12.345)).toBe('5.00 ha'); // 4.9958 ha
    // 1,250 ft × 0.3048 = 381 m; 10,560 ft = 3,218.688 m.
    expect(formatFeet(1250)).toBe('381 m');
    expect(formatFeet(10_560)).toBe('3.22 km (3,219 m)');
    expect(formatMapFeet(1250)).toBe('381 m');
    expect(showsImperial()).toBe(false);
    expect(formatAcres(null)).toBe('—');
  });
});
