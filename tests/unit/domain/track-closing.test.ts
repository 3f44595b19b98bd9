import { describe, expect, it } from 'vitest';
import type { LineString } from 'geojson';
import { closableTrackGapM, closeTrack, trackEndGapM } from '../../../shared/domain/track-closing';
import { destination } from '../../support/geo-fixtures';

/** A walk north 300 m, east 300 m, south 300 m, then west to `gapM` metres east of the start (GeographicLib direct problem). */
function walk(gapM: number): LineString {
  const start = { lat: 44.5, lon: -90.2 };
  const a = destination(start.lat, start.lon, 0, 300);
  const b = destination(a.lat, a.lon, 90, 300);
  const c = destination(b.lat, b.lon, 180, 300);
  const end = destination(start.lat, start.lon, 90, gapM);
  return { type: 'LineString', coordinates: [start, a, b, c, end].map((p) => [p.lon, p.lat]) };
}

describe('closing a walked GPS track', () => {
  it('measures the gap between its ends within 0.5 % of GeographicLib', () => {
    // The shared line measure works on turf's sphere: within 0.5 % of the ellipsoid (STACK.md).
    expect(Math.abs(trackEndGapM(walk(25)) - 25) / 25).toBeLessThan(0.005);
  });

  it('is closable when the ends lie within the stated distance, and not beyond it', () => {
    expect(closableTrackGapM(walk(25), 30)).toBeCloseTo(25, 0);
    expect(closableTrackGapM(walk(35), 30)).toBeNull();
    expect(closableTrackGapM({ type: 'LineString', coordinates: [[-90, 44], [-90.0001, 44]] }, 30)).toBeNull(); // two corners are no area
    expect(closableTrackGapM({ type: 'MultiLineString', coordinates: [] }, 30)).toBeNull();
  });

  it('closes by joining the last position to the first, dropping elevations', () => {
    const polygon = closeTrack({ type: 'LineString', coordinates: [[-90, 44, 250], [-90, 44.001, 251], [-89.999, 44.001, 252]] });
    expect(polygon).toEqual({ type: 'Polygon', coordinates: [[[-90, 44], [-90, 44.001], [-89.999, 44.001], [-90, 44]]] });
  });
});
