/**
 * The firm's clock: "today" and "now" in the firm's own time zone, and the one way dates and times
 * are written for people ("Dec 5, 2026", "Dec 5, 2026, 7:42 PM CST").
 *
 * Pure: every function takes the instant and the IANA zone it needs; the server's wrapper
 * (server/services/clock.ts) and the client's hook (src/lib/firm-clock.ts) supply them. Built on
 * Intl.DateTimeFormat, which both Node and the browser carry with the IANA time-zone database, so
 * daylight-saving changes follow the zone's rules.
 */
import { DomainValidationError } from './errors';

/** A calendar date as "YYYY-MM-DD" (the stored and wire form; never shown to people). */
export type IsoDate = string;

/** The zone a firm starts with (the demo firm works in southwestern Wisconsin). */
export const DEFAULT_TIME_ZONE = 'America/Chicago';

const MONTHS_SHORT = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const MONTHS_LONG = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

const formatters = new Map<string, Intl.DateTimeFormat>();
function partsFormatter(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'short',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** Intl's supported zones as a set, made once (building the list of some 400 names on every call cost each signed-in request). */
let supportedZones: ReadonlySet<string> | null | undefined;

/** True when `zone` is an IANA time zone this runtime knows (Intl's supported zones, plus "UTC"). */
export function isTimeZone(zone: unknown): zone is string {
  if (typeof zone !== 'string' || zone.length === 0 || zone.length > 64) return false;
  if (zone === 'UTC') return true;
  supportedZones ??= typeof Intl.supportedValuesOf === 'function' ? new Set(Intl.supportedValuesOf('timeZone')) : null;
  if (supportedZones) return supportedZones.has(zone);
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/** A usable zone: the firm's, or the default when a stored value is missing or unknown. */
export function usableZone(zone: string | null | undefined): string {
  return zone && isTimeZone(zone) ? zone : DEFAULT_TIME_ZONE;
}

/** Every zone a firm may choose, US zones first (the product's market), then the rest A–Z. */
export function timeZoneChoices(): string[] {
  const all = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [DEFAULT_TIME_ZONE];
  const us = ['America/New_York', 'America/Chicago', 'America/Denver', 'America/Phoenix', 'America/Los_Angeles', 'America/Anchorage', 'Pacific/Honolulu'].filter((z) => all.includes(z));
  return [...us, ...all.filter((z) => !us.includes(z)), 'UTC'];
}

function requireZone(zone: string): string {
  if (!isTimeZone(zone)) throw new DomainValidationError('timezone', `"${zone}" is not a time zone; choose one such as America/Chicago.`);
  return zone;
}

/** The wall-clock reading of an instant in a zone. */
export interface ZonedReading {
  date: IsoDate;
  hour: number;
  minute: number;
  /** The zone's short name at that instant: "CST", "CDT", or "GMT+1" where English has none. */
  abbreviation: string;
}

/** What a clock on the wall in `zone` shows at `instant`. */
export function zonedReading(instant: Date, zone: string): ZonedReading {
  const parts = partsFormatter(requireZone(zone)).formatToParts(instant);
  const get = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return {
    date: `${get('year')}-${get('month')}-${get('day')}`,
    hour: Number(get('hour')),
    minute: Number(get('minute')),
    abbreviation: get('timeZoneName'),
  };
}

/** The calendar date ("today") in `zone` at `instant`. */
export function todayIn(zone: string, instant: Date): IsoDate {
  return zonedReading(instant, zone).date;
}

function splitIso(date: IsoDate): [number, number, number] {
  const m = typeof date === 'string' ? /^(\d{4})-(\d{2})-(\d{2})/.exec(date) : null;
  if (!m) throw new DomainValidationError('date', `Dates must be real calendar dates (got ${JSON.stringify(date)}).`);
  return [Number(m[1]), Number(m[2]), Number(m[3])];
}

/** A date as people write it: "Dec 5, 2026" (or "December 5, 2026" with `long`). */
export function formatDate(date: IsoDate, options: { long?: boolean } = {}): string {
  const [y, m, d] = splitIso(date);
  return `${(options.long ? MONTHS_LONG : MONTHS_SHORT)[m - 1]} ${d}, ${y}`;
}

/** A date with its weekday: "Saturday, Dec 5, 2026". */
export function formatDateWithWeekday(date: IsoDate): string {
  const [y, m, d] = splitIso(date);
  return `${WEEKDAYS[new Date(Date.UTC(y, m - 1, d)).getUTCDay()]}, ${formatDate(date)}`;
}

/** A date without its year: "Dec 5". */
export function formatMonthDayOf(date: IsoDate): string {
  const [, m, d] = splitIso(date);
  return `${MONTHS_SHORT[m - 1]} ${d}`;
}

/** Two dates as a span: "Dec 5, 2026", "Dec 5 – 9, 2026", "Dec 28, 2026 – Jan 3, 2027". */
export function formatDateSpan(from: IsoDate, to: IsoDate): string {
  if (from === to) return formatDate(from);
  const [y1, m1] = splitIso(from);
  const [y2, m2, d2] = splitIso(to);
  if (y1 !== y2) return `${formatDate(from)} – ${formatDate(to)}`;
  if (m1 === m2) return `${formatMonthDayOf(from)} – ${d2}, ${y2}`;
  return `${formatMonthDayOf(from)} – ${formatMonthDayOf(to)}, ${y2}`;
}

/** The calendar date of an instant in `zone`, as people write it: "Dec 5, 2026". */
export function formatDayOf(instant: Date | string, zone: string, options: { long?: boolean } = {}): string {
  return formatDate(todayIn(zone, typeof instant === 'string' ? new Date(instant) : instant), options);
}

/** An instant in the firm's zone with the zone's abbreviation: "Dec 5, 2026, 7:42 PM CST". */
export function formatMoment(instant: Date | string, zone: string, options: { long?: boolean } = {}): string {
  const at = typeof instant === 'string' ? new Date(instant) : instant;
  if (Number.isNaN(at.getTime())) throw new DomainValidationError('instant', `Not a time: ${JSON.stringify(instant)}.`);
  const r = zonedReading(at, zone);
  const hour12 = r.hour % 12 === 0 ? 12 : r.hour % 12;
  return `${formatDate(r.date, options)}, ${hour12}:${String(r.minute).padStart(2, '0')} ${r.hour < 12 ? 'AM' : 'PM'} ${r.abbreviation}`;
}
