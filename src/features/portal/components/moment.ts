import { formatDay } from '../../../lib/firm-clock';

/** A moment (ISO timestamp) as "Dec 2, 2026" in the firm's time zone, or a dash. */
export function formatMomentDay(iso: string | null | undefined): string {
  return iso ? formatDay(iso) : '—';
}
