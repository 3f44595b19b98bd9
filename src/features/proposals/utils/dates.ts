/** Dates of proposals as people read them, in the firm's time zone (src/lib/firm-clock.ts). */
import { formatDay as formatAny, formatTime } from '../../../lib/firm-clock';

/** A calendar date (YYYY-MM-DD, no time zone) as "Jan 1, 2027", the same day everywhere. */
export function formatDay(isoDate: string | null | undefined): string {
  if (!isoDate) return '—';
  return /^\d{4}-\d{2}-\d{2}$/.test(isoDate) ? formatAny(isoDate) : isoDate;
}

/** A moment (ISO timestamp) as "Dec 2, 2026" in the firm's time zone, or a dash. */
export function formatMomentDay(iso: string | null | undefined): string {
  return iso ? formatAny(iso) : '—';
}

/** A moment with its time in the firm's zone: "Dec 2, 2026, 3:04 PM CST". */
export function formatMoment(iso: string): string {
  return formatTime(iso);
}
