import { describe, expect, it } from 'vitest';
import {
  activitySummary,
  cameraNights,
  correctedPhotoTime,
  eventsPer100CameraNights,
  groupEvents,
  sunRelation,
  sunTimes,
  surveyAreaAcres,
  talliesFromPhotos,
  type TaggedPhoto,
} from '../../../shared/domain/camera-events';

const at = (iso: string) => new Date(iso);
const photo = (id: number, iso: string, tag: TaggedPhoto['tag'], buckId: number | null = null): TaggedPhoto => ({ id, takenAt: at(iso), tag, buckId });

/**
 * NOAA Global Monitoring Laboratory, "General Solar Position Calculations" (the equations behind
 * NOAA's solar calculator, after Spencer 1971): fractional year, equation of time, declination,
 * and the hour angle of sunrise for a zenith of 90.833° (refraction and the Sun's radius).
 * NOAA's simplified equations are good to a minute or two (fastest change near the equinoxes);
 * the tests allow three.
 */
function noaaSunriseSunsetUtcMinutes(year: number, month: number, day: number, lat: number, lon: number): { sunrise: number; sunset: number } {
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const doy = (Date.UTC(year, month - 1, day) - Date.UTC(year, 0, 1)) / 86_400_000 + 1;
  const g = ((2 * Math.PI) / (leap ? 366 : 365)) * (doy - 1);
  const eqtime = 229.18 * (0.000075 + 0.001868 * Math.cos(g) - 0.032077 * Math.sin(g) - 0.014615 * Math.cos(2 * g) - 0.040849 * Math.sin(2 * g));
  const decl = 0.006918 - 0.399912 * Math.cos(g) + 0.070257 * Math.sin(g) - 0.006758 * Math.cos(2 * g) + 0.000907 * Math.sin(2 * g) - 0.002697 * Math.cos(3 * g) + 0.00148 * Math.sin(3 * g);
  const rad = Math.PI / 180;
  const ha = Math.acos(Math.cos(90.833 * rad) / (Math.cos(lat * rad) * Math.cos(decl)) - Math.tan(lat * rad) * Math.tan(decl)) / rad;
  return { sunrise: 720 - 4 * (lon + ha) - eqtime, sunset: 720 - 4 * (lon - ha) - eqtime };
}

const utcMinutes = (d: Date | null) => (d ? d.getUTCHours() * 60 + d.getUTCMinutes() + d.getUTCSeconds() / 60 : NaN);

describe('sun times (suncalc) against NOAA', () => {
  // Columbia, Missouri (38.9517° N, 92.3341° W): a place chosen by us; dates the solstices and an equinox of 2026.
  const place = { lat: 38.9517, lon: -92.3341 };
  for (const [y, m, d] of [[2026, 6, 21], [2026, 12, 21], [2026, 3, 20], [2026, 10, 15]] as const) {
    it(`agrees within 3 minutes on ${y}-${m}-${d}`, () => {
      const noaa = noaaSunriseSunsetUtcMinutes(y, m, d, place.lat, place.lon);
      const ours = sunTimes(new Date(Date.UTC(y, m - 1, d, 18)), place.lat, place.lon);
      expect(Math.abs(utcMinutes(ours.sunrise) - noaa.sunrise)).toBeLessThan(3);
      // Sunset after 0:00 UTC: compare modulo a day.
      const diff = ((utcMinutes(ours.sunset) - noaa.sunset) % 1440 + 1440) % 1440;
      expect(Math.min(diff, 1440 - diff)).toBeLessThan(3);
    });
  }

  it('puts a photo at noon in daylight, one at 2 AM in the night and one just after sunrise at dawn', () => {
    expect(sunRelation(at('2026-10-15T17:30:00Z'), 38.9517, -92.3341)).toMatchObject({ period: 'day', daylight: true });
    expect(sunRelation(at('2026-10-15T07:00:00Z'), 38.9517, -92.3341)).toMatchObject({ period: 'night', daylight: false });
    const { sunrise } = sunTimes(at('2026-10-15T17:00:00Z'), 38.9517, -92.3341);
    const rel = sunRelation(new Date(sunrise!.getTime() + 20 * 60_000), 38.9517, -92.3341);
    expect(rel).toMatchObject({ period: 'dawn', daylight: true, minutesFromSunrise: 20 });
  });
});

describe('photo times from the camera clock', () => {
  // US daylight time ends 2026-11-01 at 2:00 AM (15 U.S.C. § 260a): Central is UTC−5 before, UTC−6 after.
  it('reads the camera clock in the firm’s zone, across daylight time', () => {
    expect(correctedPhotoTime('2026-10-05T06:30:00', null, 'America/Chicago', 0)?.toISOString()).toBe('2026-10-05T11:30:00.000Z');
    expect(correctedPhotoTime('2026-12-05T06:30:00', null, 'America/Chicago', 0)?.toISOString()).toBe('2026-12-05T12:30:00.000Z');
    expect(correctedPhotoTime('2026-07-01T23:59:59', null, 'UTC', 0)?.toISOString()).toBe('2026-07-01T23:59:59.000Z');
  });

  it('uses the offset the camera wrote when there is one', () => {
    expect(correctedPhotoTime('2026-10-05T06:30:00', '-07:00', 'America/Chicago', 0)?.toISOString()).toBe('2026-10-05T13:30:00.000Z');
  });

  it('adds the deployment’s clock offset (a camera 1 h 5 min slow)', () => {
    expect(correctedPhotoTime('2026-10-05T05:25:00', null, 'America/Chicago', 3900)?.toISOString()).toBe('2026-10-05T11:30:00.000Z');
  });
});

describe('independent events (30-minute rule: O’Brien et al. 2003, from memory; hand-worked cases)', () => {
  it('keeps photos within 30 minutes of the previous one in one event, and starts a new one after a longer gap', () => {
    const events = groupEvents([
      photo(1, '2026-10-05T11:00:00Z', 'doe'),
      photo(2, '2026-10-05T11:20:00Z', 'fawn'),
      photo(3, '2026-10-05T11:50:00Z', 'doe'), // 30 min after #2: same event
      photo(4, '2026-10-05T12:20:01Z', 'doe'), // 30 min 1 s after #3: new event
      photo(5, '2026-10-05T12:25:00Z', 'empty'),
    ]);
    expect(events.map((e) => e.photoIds)).toEqual([[1, 2, 3], [4]]);
    expect(events[0].tags).toEqual({ doe: 2, fawn: 1 });
  });

  it('groups each kind on its own: a raccoon between two deer photos does not split the deer event', () => {
    const events = groupEvents([photo(1, '2026-10-05T11:00:00Z', 'buck', 7), photo(2, '2026-10-05T11:10:00Z', 'other-species'), photo(3, '2026-10-05T11:15:00Z', 'buck', 8)]);
    expect(events.map((e) => [e.kind, e.photoIds])).toEqual([['deer', [1, 3]], ['other-species', [2]]]);
    expect(events[0].buckIds).toEqual([7, 8]);
  });

  it('uses the firm’s gap: with 10 minutes the 20-minute gap splits', () => {
    expect(groupEvents([photo(1, '2026-10-05T11:00:00Z', 'doe'), photo(2, '2026-10-05T11:20:00Z', 'doe')], 10)).toHaveLength(2);
  });

  it('ignores untagged and empty photos', () => {
    expect(groupEvents([photo(1, '2026-10-05T11:00:00Z', null), photo(2, '2026-10-05T11:00:00Z', 'empty')])).toEqual([]);
  });
});

describe('camera-nights (hand-worked)', () => {
  it('counts the nights from the day set to the day taken down', () => {
    expect(cameraNights('2026-10-01', '2026-10-22')).toBe(21);
    expect(cameraNights('2026-10-01', '2026-10-01')).toBe(0);
    // Across the end of February in a non-leap year: Feb 20 → Mar 2 is 10 nights.
    expect(cameraNights('2026-02-20', '2026-03-02')).toBe(10);
  });

  it('counts only the nights inside a survey window', () => {
    // Nights of Oct 10 … Oct 14 (5 nights) of a camera set Oct 1 and pulled Oct 22.
    expect(cameraNights('2026-10-01', '2026-10-22', { from: '2026-10-10', to: '2026-10-14' })).toBe(5);
    expect(cameraNights('2026-10-01', '2026-10-22', { from: '2026-11-01', to: '2026-11-14' })).toBe(0);
  });

  it('gives events per 100 camera-nights: 9 events in 21 nights → 42.86', () => {
    expect(eventsPer100CameraNights(9, 21)).toBeCloseTo(42.857, 3);
    expect(eventsPer100CameraNights(3, 0)).toBeNull();
  });
});

describe('activity and survey inputs', () => {
  it('counts deer events by hour of the firm’s day and their share in daylight', () => {
    const events = groupEvents([photo(1, '2026-10-15T15:00:00Z', 'doe'), photo(2, '2026-10-15T18:00:00Z', 'buck'), photo(3, '2026-10-16T06:00:00Z', 'doe')]);
    const a = activitySummary(events, 'America/Chicago', 38.9517, -92.3341);
    expect(a.byHour[10]).toBe(1); // 15:00 UTC is 10 AM CDT
    expect(a.byHour[13]).toBe(1);
    expect(a.byHour[1]).toBe(1);
    expect(a.daylightShare).toBeCloseTo(2 / 3, 6);
  });

  it('tallies buck, doe and fawn photos and the identified bucks', () => {
    expect(talliesFromPhotos([{ tag: 'buck', buckId: 1 }, { tag: 'buck', buckId: 1 }, { tag: 'buck', buckId: 2 }, { tag: 'buck', buckId: null }, { tag: 'doe' }, { tag: 'fawn' }, { tag: 'person' }])).toEqual({ buckPhotos: 4, uniqueBucks: 2, doePhotos: 1, fawnPhotos: 1 });
  });

  it('states the area a survey speaks for: 100 acres a camera, capped at the property', () => {
    expect(surveyAreaAcres(3, 1000)).toBe(300);
    expect(surveyAreaAcres(12, 640)).toBe(640);
  });
});
