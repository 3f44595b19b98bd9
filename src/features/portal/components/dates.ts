import { formatDate } from '../../../../shared/domain/clock';

/** A calendar date (YYYY-MM-DD, no time zone) as "Apr 3, 2026", the same day everywhere. */
export function dayText(isoDate: string | null | undefined): string {
  if (!isoDate) return '—';
  return /^\d{4}-\d{2}-\d{2}$/.test(isoDate) ? formatDate(isoDate) : isoDate;
}
