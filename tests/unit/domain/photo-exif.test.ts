import { describe, expect, it } from 'vitest';
import { EXIF_EARLIEST_YEAR, exifDateTimeToLocal, exifInstant, exifOffset, judgePhotoExif } from '../../../shared/domain/photo-exif';
import { readHeifSize } from '../../../shared/domain/heif-size';
import { makeHeicHeader } from '../../support/photo-fixtures';

const now = new Date('2026-12-05T14:00:00Z');
const reading = (over: Partial<Parameters<typeof judgePhotoExif>[0]>) => ({ takenAtLocal: null, takenAtOffset: null, latitude: null, longitude: null, ...over });

describe('EXIF date and time text', () => {
  it('turns EXIF "YYYY:MM:DD HH:MM:SS" into a wall-clock ISO reading (CIPA DC-008 EXIF 2.3 §4.6.5, DateTimeOriginal format)', () => {
    expect(exifDateTimeToLocal('2026:10:14 07:31:05')).toBe('2026-10-14T07:31:05');
    expect(exifDateTimeToLocal('2026:02:30 07:31:05')).toBeNull(); // no February 30th
    expect(exifDateTimeToLocal('    :  :     :  :  ')).toBeNull(); // EXIF's "unknown" is blanks
    expect(exifDateTimeToLocal(undefined)).toBeNull();
  });
  it('keeps only well-formed offsets (EXIF 2.31 OffsetTimeOriginal, "±HH:MM")', () => {
    expect(exifOffset('-05:00')).toBe('-05:00');
    expect(exifOffset('+15:00')).toBeNull();
    expect(exifOffset('5')).toBeNull();
  });
});

describe('judgePhotoExif', () => {
  it('uses a plausible time and position as they are', () => {
    const j = judgePhotoExif(reading({ takenAtLocal: '2026-10-14T07:31:05', latitude: 43.05, longitude: -90.31 }), now);
    expect(j).toEqual({ takenAtLocal: '2026-10-14T07:31:05', takenAtOffset: null, position: [-90.31, 43.05], problems: [] });
  });
  it('refuses a date in 2099 with a sentence naming the date as people write it', () => {
    const j = judgePhotoExif(reading({ takenAtLocal: '2099-01-01T00:00:00' }), now);
    expect(j.takenAtLocal).toBeNull();
    expect(j.problems[0]).toMatchObject({ tag: 'DateTimeOriginal' });
    expect(j.problems[0].message).toContain('Jan 1, 2099');
  });
  it('allows a wall clock up to the tolerance ahead (a zone east of UTC), not beyond (36 h: common practice, no source)', () => {
    expect(judgePhotoExif(reading({ takenAtLocal: '2026-12-06T10:00:00' }), now).takenAtLocal).toBe('2026-12-06T10:00:00'); // +20 h
    expect(judgePhotoExif(reading({ takenAtLocal: '2026-12-07T03:00:00' }), now).takenAtLocal).toBeNull(); // +37 h
  });
  it(`refuses a camera clock before ${EXIF_EARLIEST_YEAR} (a reset camera writes 1970 or 1980; common practice, no source)`, () => {
    const j = judgePhotoExif(reading({ takenAtLocal: '1980-01-01T00:00:12' }), now);
    expect(j.takenAtLocal).toBeNull();
    expect(j.problems[0].message).toContain('1980');
  });
  it('refuses GPS at 0°, 0° (a receiver without a fix) and out of range, and says what to do instead', () => {
    const zero = judgePhotoExif(reading({ latitude: 0, longitude: 0 }), now);
    expect(zero.position).toBeNull();
    expect(zero.problems[0]).toMatchObject({ tag: 'GPS' });
    expect(zero.problems[0].message).toMatch(/tap the map/);
    expect(judgePhotoExif(reading({ latitude: 91, longitude: 10 }), now).position).toBeNull();
    expect(judgePhotoExif(reading({ latitude: 45, longitude: -181 }), now).position).toBeNull();
    // The equator or the prime meridian alone is a real place.
    expect(judgePhotoExif(reading({ latitude: 0, longitude: 32.5 }), now).position).toEqual([32.5, 0]);
  });
});

describe('exifInstant', () => {
  it('reads a zone-less wall clock in the firm\u2019s zone, daylight time included (America/Chicago is UTC−5 in October, UTC−6 in December: IANA tz database)', () => {
    expect(exifInstant('2026-10-14T07:31:05', null, 'America/Chicago')?.toISOString()).toBe('2026-10-14T12:31:05.000Z');
    expect(exifInstant('2026-12-01T07:00:00', null, 'America/Chicago')?.toISOString()).toBe('2026-12-01T13:00:00.000Z');
  });
  it('uses the camera\u2019s own offset when it wrote one', () => {
    expect(exifInstant('2026-10-14T07:31:05', '+02:00', 'America/Chicago')?.toISOString()).toBe('2026-10-14T05:31:05.000Z');
  });
});

describe('readHeifSize', () => {
  it('reads width and height from the ispe box (ISO/IEC 23008-12 §6.5.3) without decoding', () => {
    expect(readHeifSize(makeHeicHeader(4032, 3024))).toEqual({ width: 4032, height: 3024 });
  });
  it('answers null for a header cut short', () => {
    expect(readHeifSize(makeHeicHeader(4032, 3024).subarray(0, 30))).toBeNull();
  });
});
