/**
 * The wind record: parsing (CSV and ISD-Lite), the 16-wind rose worked by hand from small fixture
 * files, and the hunting-light filter's sun times against NOAA's solar calculator.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  detectWindFormat,
  filterObservations,
  inHuntingLight,
  normalizeSectors,
  parseWindFile,
  sunTimes,
  WindFileError,
  windRose,
} from '../../../shared/domain/wind-record';

const fixture = (name: string) => readFileSync(new URL(`../../fixtures/wind/${name}`, import.meta.url), 'utf8');
const shareOf = (rose: { from: string; share: number }[], from: string) => rose.find((r) => r.from === from)!.share;

describe('wind files', () => {
  it('reads the CSV fixture and sums the rose worked by hand', () => {
    const { format, observations, skipped } = parseWindFile(fixture('small.csv'));
    expect(format).toBe('csv');
    // By hand: 10 rows; "bad" and 400° are skipped; 270° at speed 0 is calm.
    expect(skipped).toBe(2);
    const { rose, hours, calmHours } = windRose(observations);
    expect(hours).toBe(8);
    expect(calmHours).toBe(1);
    // Directional hours 7: N gets 0°, 10° and 350° (sectors 22.5° wide centred on N) = 3/7; S gets 180°, 190° = 2/7; E 1/7; SW (225°) 1/7.
    expect(shareOf(rose, 'N')).toBe(0.4286);
    expect(shareOf(rose, 'S')).toBe(0.2857);
    expect(shareOf(rose, 'E')).toBe(0.1429);
    expect(shareOf(rose, 'SW')).toBe(0.1429);
    expect(shareOf(rose, 'NNE')).toBe(0);
  });

  it('reads ISD-Lite hourly lines: -9999 missing, direction 0 calm, speed scaled by 10 (NOAA NCEI ISD-Lite format documentation, 2006)', () => {
    const text = fixture('isd-lite.txt');
    expect(detectWindFormat(text)).toBe('isd-lite');
    const { observations, skipped } = parseWindFile(text);
    // By hand: the line with direction -9999 is skipped; 0/0 is calm; 200° and 210° are SSW; 360° is N; 90° with speed missing is E.
    expect(skipped).toBe(1);
    expect(observations[0]!.speedMs).toBe(5.1);
    expect(observations[0]!.at.toISOString()).toBe('2026-10-01T12:00:00.000Z');
    const { rose, hours, calmHours } = windRose(observations);
    expect([hours, calmHours]).toEqual([5, 1]);
    expect(shareOf(rose, 'SSW')).toBe(0.5);
    expect(shareOf(rose, 'N')).toBe(0.25);
    expect(shareOf(rose, 'E')).toBe(0.25);
  });

  it('refuses a file in an unknown format or with no usable rows, naming the problem', () => {
    expect(() => parseWindFile('hello world\nnothing here')).toThrow(WindFileError);
    expect(() => parseWindFile('time,direction\n2026-10-01T12:00Z,999')).toThrow(/no usable wind rows/);
    expect(() => parseWindFile('when,where\n1,2')).toThrow(/time column and a direction column/);
  });

  it('normalises typed sectors to shares that sum to 1', () => {
    const rose = normalizeSectors([{ from: 'N', share: 30 }, { from: 'S', share: 10 }]);
    expect(shareOf(rose, 'N')).toBe(0.75);
    expect(shareOf(rose, 'S')).toBe(0.25);
    expect(() => normalizeSectors([{ from: 'N', share: 0 }])).toThrow(WindFileError);
  });
});

/**
 * NOAA Global Monitoring Laboratory's Solar Calculator, in the equations of its published
 * spreadsheet (NOAA_Solar_Calculations_day.xls, after Meeus, "Astronomical Algorithms"): sunrise and
 * sunset in minutes after 0h UTC for a date, with the 90.833° zenith (refraction and the solar disc).
 */
function noaaSunriseSunsetUtcMin(year: number, month: number, day: number, lat: number, lon: number): [number, number] {
  const rad = (d: number) => (d * Math.PI) / 180;
  const deg = (r: number) => (r * 180) / Math.PI;
  const jd = Date.UTC(year, month - 1, day, 12) / 86400000 + 2440587.5 - lon / 360;
  const jc = (jd - 2451545) / 36525;
  const l0 = (280.46646 + jc * (36000.76983 + jc * 0.0003032)) % 360;
  const m = 357.52911 + jc * (35999.05029 - 0.0001537 * jc);
  const e = 0.016708634 - jc * (0.000042037 + 0.0000001267 * jc);
  const c = Math.sin(rad(m)) * (1.914602 - jc * (0.004817 + 0.000014 * jc)) + Math.sin(rad(2 * m)) * (0.019993 - 0.000101 * jc) + Math.sin(rad(3 * m)) * 0.000289;
  const appLong = l0 + c - 0.00569 - 0.00478 * Math.sin(rad(125.04 - 1934.136 * jc));
  const obliq0 = 23 + (26 + (21.448 - jc * (46.815 + jc * (0.00059 - jc * 0.001813))) / 60) / 60;
  const obliq = obliq0 + 0.00256 * Math.cos(rad(125.04 - 1934.136 * jc));
  const decl = deg(Math.asin(Math.sin(rad(obliq)) * Math.sin(rad(appLong))));
  const y = Math.tan(rad(obliq / 2)) ** 2;
  const eqTime = 4 * deg(y * Math.sin(2 * rad(l0)) - 2 * e * Math.sin(rad(m)) + 4 * e * y * Math.sin(rad(m)) * Math.cos(2 * rad(l0)) - 0.5 * y * y * Math.sin(4 * rad(l0)) - 1.25 * e * e * Math.sin(2 * rad(m)));
  const ha = deg(Math.acos(Math.cos(rad(90.833)) / (Math.cos(rad(lat)) * Math.cos(rad(decl))) - Math.tan(rad(lat)) * Math.tan(rad(decl))));
  const noon = 720 - 4 * lon - eqTime;
  return [noon - 4 * ha, noon + 4 * ha];
}

describe('sun times for the hunting-light filter', () => {
  const places = [
    { name: 'central Missouri, mid-November', lat: 38.9, lon: -92.3, y: 2026, m: 11, d: 15 },
    { name: 'Minnesota, 1 October', lat: 45.0, lon: -93.0, y: 2026, m: 10, d: 1 },
    { name: 'south Georgia, 10 January', lat: 31.0, lon: -84.0, y: 2027, m: 1, d: 10 },
    { name: 'Texas hill country, 21 December', lat: 30.1, lon: -99.2, y: 2026, m: 12, d: 21 },
  ];
  it.each(places)('suncalc agrees with NOAA’s solar calculator equations within a minute: $name', ({ lat, lon, y, m, d }) => {
    const localNoonUtc = new Date(Date.UTC(y, m - 1, d, 12) - (lon / 15) * 3600_000);
    const { sunrise, sunset } = sunTimes(localNoonUtc, lat, lon);
    const [riseMin, setMin] = noaaSunriseSunsetUtcMin(y, m, d, lat, lon);
    const midnight = Date.UTC(y, m - 1, d);
    expect(Math.abs((sunrise!.getTime() - midnight) / 60000 - riseMin)).toBeLessThan(1);
    expect(Math.abs((sunset!.getTime() - midnight) / 60000 - setMin)).toBeLessThan(1);
  });

  it('keeps 30 minutes before sunrise to 30 minutes after sunset (common practice, no source; states differ)', () => {
    const [riseMin, setMin] = noaaSunriseSunsetUtcMin(2026, 11, 15, 38.9, -92.3);
    const midnight = Date.UTC(2026, 10, 15);
    const atMin = (min: number) => new Date(midnight + min * 60000);
    expect(inHuntingLight(atMin(riseMin - 28), 38.9, -92.3)).toBe(true);
    expect(inHuntingLight(atMin(riseMin - 33), 38.9, -92.3)).toBe(false);
    expect(inHuntingLight(atMin(setMin + 28), 38.9, -92.3)).toBe(true);
    expect(inHuntingLight(atMin(setMin + 33), 38.9, -92.3)).toBe(false);
  });

  it('filters by the months in the firm’s zone and by hunting light', () => {
    const obs = [
      { at: new Date('2026-11-15T18:00:00Z'), fromDeg: 180, speedMs: 3 }, // midday, November
      { at: new Date('2026-11-15T06:00:00Z'), fromDeg: 180, speedMs: 3 }, // night
      { at: new Date('2026-06-15T18:00:00Z'), fromDeg: 180, speedMs: 3 }, // June
      { at: new Date('2026-11-01T03:00:00Z'), fromDeg: 180, speedMs: 3 }, // 31 October, 22:00 in Chicago
    ];
    const kept = filterObservations(obs, { months: [11], hours: 'all', lat: 38.9, lon: -92.3, timeZone: 'America/Chicago' });
    expect(kept.length).toBe(2);
    const light = filterObservations(obs, { months: [11], hours: 'hunting', lat: 38.9, lon: -92.3, timeZone: 'America/Chicago' });
    expect(light).toEqual([obs[0]]);
  });
});
