/**
 * Camera numbers per site, worked by hand. Summing camera-nights over a site's deployments and
 * expressing events per 100 camera-nights: common practice, no source. Hours are read on the
 * America/Chicago clock (CDT = UTC−5 until 1 Nov 2026, CST = UTC−6 after: the US rule, 15 U.S.C. 260a).
 */
import { describe, expect, it } from 'vitest';
import { hourlyActivity, siteCameraNights, summarizeSite } from '../../../shared/domain/camera-sites';
import { groupEvents, type TaggedPhoto } from '../../../shared/domain/camera-events';

const ZONE = 'America/Chicago';
const photo = (id: number, iso: string, tag: TaggedPhoto['tag']): TaggedPhoto => ({ id, takenAt: new Date(iso), tag });

// Site "Hollow camera site": Cam 1 set Oct 1, moved away Oct 22 (21 nights: the evenings of Oct 1 … Oct 21);
// Cam 2 set the same day and taken down Nov 5 (14 nights: Oct 22 … Nov 4). 21 + 14 = 35 camera-nights.
const deployments = [
  { startedOn: '2026-10-01', endOn: '2026-10-22' },
  { startedOn: '2026-10-22', endOn: '2026-11-05' },
];
const photos: TaggedPhoto[] = [
  photo(1, '2026-10-03T11:10:00Z', 'doe'), // 06:10 CDT — event 1 (deer)
  photo(2, '2026-10-03T11:25:00Z', 'fawn'), // 06:25, 15 min later — still event 1
  photo(3, '2026-10-03T12:30:00Z', 'doe'), // 07:30, 65 min after 06:25 — event 2
  photo(4, '2026-10-05T17:00:00Z', 'other-species'), // 12:00 CDT — an other-species event
  photo(5, '2026-10-26T00:00:00Z', 'buck'), // 19:00 CDT Oct 25 on Cam 2 — event 3
  photo(6, '2026-10-26T00:20:00Z', 'buck'), // 19:20 — event 3
  photo(7, '2026-11-03T02:15:00Z', 'doe'), // 20:15 CST on Nov 2 — event 4
  photo(8, '2026-11-03T02:20:00Z', 'empty'), // empty photos make no event
];

describe('camera-nights per site', () => {
  it('adds each deployment’s nights: 21 + 14 = 35 (worked by hand above)', () => {
    expect(siteCameraNights(deployments)).toBe(35);
  });
  it('counts two cameras side by side as two camera-nights a night (Oct 1–8 twice: 7 + 7 = 14)', () => {
    expect(siteCameraNights([{ startedOn: '2026-10-01', endOn: '2026-10-08' }, { startedOn: '2026-10-01', endOn: '2026-10-08' }])).toBe(14);
  });
  it('counts a deployment set and taken down the same day, or recorded backwards, as 0', () => {
    expect(siteCameraNights([{ startedOn: '2026-10-01', endOn: '2026-10-01' }, { startedOn: '2026-10-05', endOn: '2026-10-02' }])).toBe(0);
  });
});

describe('a site’s events and rate per 100 camera-nights', () => {
  const s = summarizeSite({ unitId: 9, deployments, photos, position: null }, 30, ZONE);

  it('groups deer events over both deployments: 4 deer, 1 other species, 0 people', () => {
    expect(s.eventsByKind).toEqual({ deer: 4, 'other-species': 1, person: 0 });
    expect(s.deploymentCount).toBe(2);
    expect(s.cameraNights).toBe(35);
  });
  it('gives 4 ÷ 35 × 100 = 11.43 deer events and 1 ÷ 35 × 100 = 2.86 other-species events per 100 camera-nights', () => {
    expect(s.per100ByKind.deer).toBeCloseTo(11.4286, 3);
    expect(s.per100ByKind['other-species']).toBeCloseTo(2.8571, 3);
    expect(s.per100ByKind.person).toBe(0);
  });
  it('puts deer events at 6, 7, 19 and 20 o’clock on the firm’s clock, across the change to CST', () => {
    const hours = s.byHour.deer;
    expect(hours).toHaveLength(24);
    expect(hours.reduce((a, b) => a + b, 0)).toBe(4);
    expect([6, 7, 19, 20].map((h) => hours[h])).toEqual([1, 1, 1, 1]);
    expect(s.byHour['other-species'][12]).toBe(1);
  });
  it('answers no rate when the site ran no night', () => {
    const none = summarizeSite({ unitId: 1, deployments: [{ startedOn: '2026-10-01', endOn: '2026-10-01' }], photos: [], position: null }, 30, ZONE);
    expect(none.per100ByKind.deer).toBeNull();
    expect(none.byHour.deer).toEqual(Array(24).fill(0));
  });
  it('reads the hour in the zone given: 11:10Z is 06 in Chicago and 11 in UTC', () => {
    const events = groupEvents([photo(1, '2026-10-03T11:10:00Z', 'doe')], 30);
    expect(hourlyActivity(events, ZONE, 'deer')[6]).toBe(1);
    expect(hourlyActivity(events, 'UTC', 'deer')[11]).toBe(1);
  });
  it('gives the deer events’ share in daylight at a place (Soldiers Grove, WI, 43.40 N 90.77 W: sunrise ~07:05 CDT on Oct 3; from memory)', () => {
    const withPlace = summarizeSite({ unitId: 9, deployments, photos, position: [-90.77, 43.4] }, 30, ZONE);
    // 06:10 and 07:30 on Oct 3: only 07:30 is after sunrise; 19:00 on Oct 25 is after sunset (~18:00 CDT); 20:15 is night: 1 of 4.
    expect(withPlace.deerDaylightShare).toBeCloseTo(0.25, 5);
  });
});
