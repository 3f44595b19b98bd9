import { describe, expect, it } from 'vitest';
import {
  formatDate,
  formatDateSpan,
  formatDateWithWeekday,
  formatDayOf,
  formatMoment,
  isTimeZone,
  todayIn,
  zonedReading,
} from '../../../shared/domain/clock';

// US daylight saving time: it starts on the second Sunday of March at 2:00 AM and ends on the first
// Sunday of November at 2:00 AM local time (Energy Policy Act of 2005, 15 U.S.C. § 260a). In 2026
// those are March 8 and November 1. Central time is UTC−6 (CST) and UTC−5 (CDT); Pacific is UTC−8/−7.

describe('today in the firm’s time zone', () => {
  it('at 23:30 on the last day of a month in Chicago it is still that day, though UTC is in the next month', () => {
    const instant = new Date('2026-02-01T05:30:00Z'); // Jan 31, 11:30 PM CST (UTC−6)
    expect(instant.toISOString().slice(0, 10)).toBe('2026-02-01'); // what the old UTC clock said
    expect(todayIn('America/Chicago', instant)).toBe('2026-01-31');
    expect(formatMoment(instant, 'America/Chicago')).toBe('Jan 31, 2026, 11:30 PM CST');
  });

  it('at 23:30 on New Year’s Eve in Los Angeles it is still the old year', () => {
    const instant = new Date('2027-01-01T07:30:00Z'); // Dec 31, 11:30 PM PST (UTC−8)
    expect(todayIn('America/Los_Angeles', instant)).toBe('2026-12-31');
    expect(todayIn('UTC', instant)).toBe('2027-01-01');
  });

  it('at 23:30 on the last day of a summer month (CDT, UTC−5) the day turns at local midnight', () => {
    expect(todayIn('America/Chicago', new Date('2026-07-01T04:30:00Z'))).toBe('2026-06-30'); // 11:30 PM CDT
    expect(todayIn('America/Chicago', new Date('2026-07-01T05:00:00Z'))).toBe('2026-07-01'); // midnight CDT
  });

  it('follows the spring change: 1:59 AM CST is followed by 3:00 AM CDT on March 8, 2026', () => {
    expect(formatMoment(new Date('2026-03-08T07:59:00Z'), 'America/Chicago')).toBe('Mar 8, 2026, 1:59 AM CST');
    expect(formatMoment(new Date('2026-03-08T08:00:00Z'), 'America/Chicago')).toBe('Mar 8, 2026, 3:00 AM CDT');
    // Late that evening the zone is five hours behind UTC, not six: 11:30 PM CDT is 04:30 UTC on March 9.
    expect(todayIn('America/Chicago', new Date('2026-03-09T04:30:00Z'))).toBe('2026-03-08');
    expect(todayIn('America/Chicago', new Date('2026-03-09T05:00:00Z'))).toBe('2026-03-09');
  });

  it('follows the fall change: 1:30 AM happens twice on November 1, 2026, first CDT then CST', () => {
    expect(formatMoment(new Date('2026-11-01T06:30:00Z'), 'America/Chicago')).toBe('Nov 1, 2026, 1:30 AM CDT');
    expect(formatMoment(new Date('2026-11-01T07:30:00Z'), 'America/Chicago')).toBe('Nov 1, 2026, 1:30 AM CST');
    // 11:30 PM CST on November 1 is 05:30 UTC on November 2.
    expect(todayIn('America/Chicago', new Date('2026-11-02T05:30:00Z'))).toBe('2026-11-01');
  });

  it('reads a zone without an English abbreviation with its offset', () => {
    const r = zonedReading(new Date('2026-12-05T18:42:00Z'), 'Europe/Berlin');
    expect(r).toEqual({ date: '2026-12-05', hour: 19, minute: 42, abbreviation: 'GMT+1' });
  });

  it('writes noon and midnight as 12 PM and 12 AM (common practice, no source)', () => {
    expect(formatMoment('2026-12-05T18:00:00Z', 'America/Chicago')).toBe('Dec 5, 2026, 12:00 PM CST');
    expect(formatMoment('2026-12-05T06:05:00Z', 'America/Chicago')).toBe('Dec 5, 2026, 12:05 AM CST');
  });

  it('knows the zones Intl knows and refuses others', () => {
    expect(isTimeZone('America/Chicago')).toBe(true);
    expect(isTimeZone('UTC')).toBe(true);
    expect(isTimeZone('America/Springfield')).toBe(false);
    expect(isTimeZone('')).toBe(false);
    expect(isTimeZone(42)).toBe(false);
    expect(() => todayIn('Mars/Olympus_Mons', new Date())).toThrow(/not a time zone/);
  });
});

describe('dates as people write them', () => {
  it('writes a stored date as “Dec 5, 2026”, never 2026-12-05', () => {
    expect(formatDate('2026-12-05')).toBe('Dec 5, 2026');
    expect(formatDate('2026-12-05', { long: true })).toBe('December 5, 2026');
    expect(formatDateWithWeekday('2026-12-05')).toBe('Saturday, Dec 5, 2026'); // Dec 5, 2026 is a Saturday (from memory; the calendar)
  });

  it('writes the day of an instant in the firm’s zone', () => {
    expect(formatDayOf('2026-12-06T03:00:00Z', 'America/Chicago')).toBe('Dec 5, 2026');
  });

  it('writes spans compactly', () => {
    expect(formatDateSpan('2026-08-01', '2026-08-01')).toBe('Aug 1, 2026');
    expect(formatDateSpan('2026-08-01', '2026-08-20')).toBe('Aug 1 – 20, 2026');
    expect(formatDateSpan('2026-07-20', '2026-08-31')).toBe('Jul 20 – Aug 31, 2026');
    expect(formatDateSpan('2026-12-28', '2027-01-03')).toBe('Dec 28, 2026 – Jan 3, 2027');
  });
});
