import { describe, expect, it } from 'vitest';
import { parseCoordinates } from '../../../shared/domain/coordinates';

describe('parseCoordinates', () => {
  it('reads decimal degrees, latitude first', () => {
    expect(parseCoordinates('43.2655, -90.9380')).toEqual({ lat: 43.2655, lon: -90.938 });
    expect(parseCoordinates('43.2655 -90.9380')).toEqual({ lat: 43.2655, lon: -90.938 });
    expect(parseCoordinates('43.2655 N 90.938 W')).toEqual({ lat: 43.2655, lon: -90.938 });
    expect(parseCoordinates('W 90.938, N 43.2655')).toEqual({ lat: 43.2655, lon: -90.938 });
  });

  it('reads degrees-minutes-seconds: 43°15′55.8″N 90°56′16.8″W is 43.2655, −90.938 (43 + 15/60 + 55.8/3600; arithmetic, from memory)', () => {
    expect(parseCoordinates(`43°15'55.8"N 90°56'16.8"W`)).toEqual({ lat: 43.2655, lon: -90.938 });
    expect(parseCoordinates('43 15 55.8 N, 90 56 16.8 W')).toEqual({ lat: 43.2655, lon: -90.938 });
    expect(parseCoordinates('43°15.93′N 90°56.28′W')).toEqual({ lat: 43.2655, lon: -90.938 });
  });

  it('refuses what is not a point on the globe', () => {
    for (const bad of ['Crawford County', '91, 10', '43.2, 181', `43°61'N 90°W`, '43.5°10\'N 90 W', 'N 43 N 90', '43 N, 90 S', '', '1 2 3 4 5 6 7 8', 'x'.repeat(1000)]) {
      expect(parseCoordinates(bad), bad).toBeNull();
    }
  });
});
