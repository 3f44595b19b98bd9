import { describe, expect, it } from 'vitest';
import { DEFAULT_OBSERVATION_SNAP_FT, FEET_PER_METRE, OBSERVATION_FAR_AWAY_FT, observationSnapFt, placeObservation, type PlacementMeasures } from '../../../shared/domain/observations';

const measures = (over: Partial<PlacementMeasures>): PlacementMeasures => ({ containingUnitId: null, nearestUnitId: null, nearestUnitM: null, hasBoundary: true, boundaryDistanceM: 0, ...over });

describe('placing an observation', () => {
  it('uses 0.3048 m to the foot (international foot, 1959 agreement)', () => {
    expect(100 / FEET_PER_METRE).toBeCloseTo(30.48, 10);
  });
  it('goes to the unit that contains it', () => {
    expect(placeObservation(measures({ containingUnitId: 7, nearestUnitId: 7, nearestUnitM: 0 }), 50)).toEqual({ unitId: 7, how: 'inside', insideBoundary: true, farAwayFt: null });
  });
  it('goes to the nearest unit within the snap distance, inclusive (50 ft = 15.24 m; the default is the issue\u2019s 50 ft)', () => {
    expect(DEFAULT_OBSERVATION_SNAP_FT).toBe(50);
    expect(placeObservation(measures({ nearestUnitId: 3, nearestUnitM: 15.24 }), 50)).toMatchObject({ unitId: 3, how: 'nearest' });
    expect(placeObservation(measures({ nearestUnitId: 3, nearestUnitM: 15.25 }), 50)).toMatchObject({ unitId: null, how: 'none' });
  });
  it('is kept without a unit when the plan has none, and counts as inside when the property has no boundary', () => {
    expect(placeObservation(measures({ hasBoundary: false, boundaryDistanceM: null }), 50)).toEqual({ unitId: null, how: 'none', insideBoundary: true, farAwayFt: null });
  });
  it('flags a position outside the boundary, and asks to confirm beyond a quarter mile (1,320 ft; common practice, no source)', () => {
    expect(OBSERVATION_FAR_AWAY_FT).toBe(1320);
    expect(placeObservation(measures({ boundaryDistanceM: 100 }), 50)).toMatchObject({ insideBoundary: false, farAwayFt: null });
    expect(placeObservation(measures({ boundaryDistanceM: 1000 }), 50)).toMatchObject({ insideBoundary: false, farAwayFt: 3281 }); // 1000 m = 3280.84 ft
  });
  it('without a boundary, measures "far" from the nearest unit', () => {
    expect(placeObservation(measures({ hasBoundary: false, boundaryDistanceM: null, nearestUnitId: 1, nearestUnitM: 2000 }), 50).farAwayFt).toBe(6562);
  });
  it('reads the firm\u2019s snap distance, falling back to the default for a missing or broken value', () => {
    expect(observationSnapFt({ observationSnapFt: 100 })).toBe(100);
    expect(observationSnapFt({ observationSnapFt: -1 })).toBe(50);
    expect(observationSnapFt(null)).toBe(50);
  });
});
