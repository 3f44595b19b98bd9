/**
 * The client's side of the firm's clock (shared/domain/clock.ts). The firm's zone comes with the
 * signed-in user (`/api/auth/me`, `firmTimezone`); "today" and every time on screen are read in it,
 * whatever zone the browser is in. The signed-in user is read before any page renders, so the zone
 * is known by the time a page asks for today.
 */
import { DEFAULT_TIME_ZONE, formatDate, formatDayOf, formatMoment, isTimeZone, todayIn, type IsoDate } from '../../shared/domain/clock';

let currentZone = DEFAULT_TIME_ZONE;

/** Records the signed-in firm's zone (called when the signed-in user is read). */
export function setFirmZone(zone: string | null | undefined): void {
  currentZone = zone && isTimeZone(zone) ? zone : DEFAULT_TIME_ZONE;
}

/** The firm's zone as last read from the server. */
export function firmZone(): string {
  return currentZone;
}

/** Today in the firm's zone. */
export function firmToday(now: Date = new Date()): IsoDate {
  return todayIn(currentZone, now);
}

/** A date ("2026-12-05") or an instant (read in the firm's zone) as people write it: "Dec 5, 2026". */
export function formatDay(value: string | Date, options: { long?: boolean } = {}): string {
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value)) return formatDate(value, options);
  return formatDayOf(value, currentZone, options);
}

/** An instant in the firm's zone with its abbreviation: "Dec 5, 2026, 7:42 PM CST". */
export function formatTime(value: string | Date): string {
  return formatMoment(value, currentZone);
}

