/** Dates of proposals as people read them. */

/** A calendar date (YYYY-MM-DD, no time zone) as "Jan 1, 2027", the same day everywhere. */
export function formatDay(isoDate: string | null | undefined): string {
  if (!isoDate) return '—';
  const [y, m, d] = isoDate.split('-').map(Number);
  if (!y || !m || !d) return isoDate;
  return new Date(Date.UTC(y, m - 1, d)).toLocaleDateString('en-US', { timeZone: 'UTC', month: 'short', day: 'numeric', year: 'numeric' });
}

/** A moment (ISO timestamp) as "Dec 2, 2026" in the reader's time zone, or a dash. */
export function formatMomentDay(iso: string | null | undefined): string {
  return iso ? new Date(iso).toLocaleDateString('en-US', { month: 'short', day: 'numeric', year: 'numeric' }) : '—';
}

/** A moment with its time: "Dec 2, 2026 at 3:04 PM". */
export function formatMoment(iso: string): string {
  const date = new Date(iso);
  return `${formatMomentDay(iso)} at ${date.toLocaleTimeString('en-US', { hour: 'numeric', minute: '2-digit' })}`;
}
