/** A moment (ISO timestamp) as "Dec 2, 2026" in the reader's time zone, or a dash. */
export function formatMomentDay(iso: string | null | undefined): string {
  return iso ? new Date(iso).toLocaleDateString('en-US', { month: 'short', day: 'numeric', year: 'numeric' }) : '—';
}
