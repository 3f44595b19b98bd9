import { afterEach, describe, expect, it } from 'vitest';
import { firmToday, firmZone, formatDay, formatTime, setFirmZone } from '../../../src/lib/firm-clock';

afterEach(() => setFirmZone(null));

describe('the client’s firm clock', () => {
  it('reads today and times in the signed-in firm’s zone, not the browser’s', () => {
    // 05:30 UTC on Dec 1, 2026 is 11:30 PM CST on Nov 30 in Chicago (UTC−6) and 9:30 PM PST in Los Angeles (UTC−8) (15 U.S.C. § 260a).
    const instant = new Date('2026-12-01T05:30:00Z');
    setFirmZone('America/Chicago');
    expect(firmToday(instant)).toBe('2026-11-30');
    expect(formatTime(instant)).toBe('Nov 30, 2026, 11:30 PM CST');
    expect(formatDay(instant.toISOString())).toBe('Nov 30, 2026');
    setFirmZone('America/Los_Angeles');
    expect(formatTime(instant)).toBe('Nov 30, 2026, 9:30 PM PST');
  });

  it('writes a stored date the same in every zone, and falls back to Central time for an unknown zone', () => {
    setFirmZone('Pacific/Kiritimati');
    expect(formatDay('2026-12-05')).toBe('Dec 5, 2026');
    setFirmZone('Nowhere/Special');
    expect(firmZone()).toBe('America/Chicago');
  });
});
