/**
 * Judging a photo's EXIF capture time and GPS position before anything trusts them: camera clocks
 * that were never set, a date years in the future, GPS tags at 0°, 0° (a receiver without a fix
 * writes zeros) or out of range. Pure: the server's photo intake reads the tags, this decides
 * which of them are usable and says why the others are not, in a sentence a person can act on.
 */
import { formatDate, zonedReading } from './clock';

/**
 * How far past "now" a capture time may lie and still be believed. EXIF DateTimeOriginal carries no
 * time zone (a wall clock anywhere from UTC−12 to UTC+14) and camera clocks drift, so a day and a
 * half covers every zone with room for drift (common practice, no source).
 */
export const EXIF_FUTURE_TOLERANCE_HOURS = 36;
/** Capture times before this year are a camera whose clock was reset (consumer digital cameras with EXIF date from the mid-1990s; common practice, no source). */
export const EXIF_EARLIEST_YEAR = 1990;

/** What the tags said, before judging: the wall-clock time as written ("YYYY-MM-DDTHH:mm:ss"), its offset when the camera wrote one ("-05:00"), and the GPS position in decimal degrees. */
export interface PhotoExifReading {
  takenAtLocal: string | null;
  takenAtOffset: string | null;
  latitude: number | null;
  longitude: number | null;
}

/** One EXIF value that was not used, with the reason. */
export interface ExifProblem {
  tag: 'DateTimeOriginal' | 'GPS';
  message: string;
}

/** The usable parts of a reading: a capture time and a position, each null when absent or absurd. */
export interface ExifJudgement {
  takenAtLocal: string | null;
  takenAtOffset: string | null;
  /** [lon, lat] in WGS84 degrees. */
  position: [number, number] | null;
  problems: ExifProblem[];
}

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2})$/;
const OFFSET = /^([+-])(\d{2}):(\d{2})$/;

/** "2026:10:14 07:31:05" (EXIF's own form, CIPA DC-008 §4.6.5) → "2026-10-14T07:31:05"; null when not a real date and time. */
export function exifDateTimeToLocal(text: unknown): string | null {
  if (typeof text !== 'string') return null;
  const m = /^\s*(\d{4})[:-](\d{2})[:-](\d{2})[ T](\d{2}):(\d{2}):(\d{2})/.exec(text);
  if (!m) return null;
  const local = `${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}`;
  return parseLocal(local) ? local : null;
}

/** An EXIF OffsetTime value ("-05:00") when well formed, else null. */
export function exifOffset(text: unknown): string | null {
  if (typeof text !== 'string') return null;
  const m = OFFSET.exec(text.trim());
  if (!m || Number(m[2]) > 14 || Number(m[3]) > 59) return null;
  return text.trim();
}

function parseLocal(local: string): number | null {
  const m = LOCAL.exec(local);
  if (!m) return null;
  const [y, mo, d, h, mi, s] = m.slice(1).map(Number) as [number, number, number, number, number, number];
  const ms = Date.UTC(y, mo - 1, d, h, mi, s);
  const back = new Date(ms);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d || h > 23 || mi > 59 || s > 59) return null;
  return ms;
}

/** Decides which EXIF values may be used; `now` is the moment of the upload. */
export function judgePhotoExif(reading: PhotoExifReading, now: Date): ExifJudgement {
  const problems: ExifProblem[] = [];
  let takenAtLocal: string | null = null;
  let takenAtOffset: string | null = null;
  if (reading.takenAtLocal) {
    const wallMs = parseLocal(reading.takenAtLocal);
    const offsetMs = reading.takenAtOffset ? offsetMinutes(reading.takenAtOffset) * 60_000 : null;
    // With an offset the instant is exact; without one, the wall clock read as UTC is within ±14 h of it.
    const instantMs = wallMs === null ? null : offsetMs === null ? wallMs : wallMs - offsetMs;
    const year = wallMs === null ? 0 : new Date(wallMs).getUTCFullYear();
    if (instantMs === null) {
      problems.push({ tag: 'DateTimeOriginal', message: 'The photo\u2019s capture time is not a real date, so it was not used. Give the time yourself.' });
    } else if (instantMs > now.getTime() + EXIF_FUTURE_TOLERANCE_HOURS * 3_600_000) {
      problems.push({ tag: 'DateTimeOriginal', message: `The photo says it was taken on ${formatDate(reading.takenAtLocal.slice(0, 10))}, which is in the future; the camera\u2019s clock is wrong, so that time was not used. Set the camera\u2019s clock, or give the time yourself.` });
    } else if (year < EXIF_EARLIEST_YEAR) {
      problems.push({ tag: 'DateTimeOriginal', message: `The photo says it was taken in ${year}, before ${EXIF_EARLIEST_YEAR}; the camera\u2019s clock was never set, so that time was not used. Set the camera\u2019s clock, or give the time yourself.` });
    } else {
      takenAtLocal = reading.takenAtLocal;
      takenAtOffset = reading.takenAtOffset;
    }
  }
  let position: [number, number] | null = null;
  const { latitude: lat, longitude: lon } = reading;
  if (lat !== null || lon !== null) {
    if (lat === null || lon === null || !Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) {
      problems.push({ tag: 'GPS', message: 'The photo\u2019s GPS position is out of range (latitude must lie within \u00b190\u00b0, longitude within \u00b1180\u00b0), so it was not used. Use the phone\u2019s position or tap the map.' });
    } else if (lat === 0 && lon === 0) {
      problems.push({ tag: 'GPS', message: 'The photo\u2019s GPS position is 0\u00b0, 0\u00b0 (in the ocean off West Africa): the camera had no fix, so it was not used. Use the phone\u2019s position or tap the map.' });
    } else {
      position = [lon, lat];
    }
  }
  return { takenAtLocal, takenAtOffset, position, problems };
}

function offsetMinutes(offset: string): number {
  const m = OFFSET.exec(offset);
  if (!m) return 0;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
}

/**
 * The instant a capture time stands for: exact with the camera's offset, otherwise the wall clock
 * read in `zone` (the firm's; daylight-saving rules of the zone apply).
 */
export function exifInstant(takenAtLocal: string, takenAtOffset: string | null, zone: string): Date | null {
  const wallMs = parseLocal(takenAtLocal);
  if (wallMs === null) return null;
  if (takenAtOffset) return new Date(wallMs - offsetMinutes(takenAtOffset) * 60_000);
  // Guess the instant as if the wall clock were UTC, see what the zone shows then, and correct twice
  // (the second pass settles instants next to a daylight-saving change).
  let guess = wallMs;
  for (let i = 0; i < 2; i++) {
    const r = zonedReading(new Date(guess), zone);
    const shown = Date.UTC(Number(r.date.slice(0, 4)), Number(r.date.slice(5, 7)) - 1, Number(r.date.slice(8, 10)), r.hour, r.minute, new Date(guess).getUTCSeconds());
    guess += wallMs - shown;
  }
  return new Date(guess);
}
