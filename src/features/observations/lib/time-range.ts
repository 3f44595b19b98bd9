/**
 * The observation layer's time slider: calendar weeks (Monday to Sunday, ISO 8601) or months that
 * span the observations, and which observations fall in one. Dates are "YYYY-MM-DD" days.
 */
import { formatDate, formatMonthDayOf } from '../../../../shared/domain/clock';

export type RangeMode = 'all' | 'week' | 'month';

export interface RangeBucket {
  key: string;
  label: string;
  /** First and last day, both included. */
  from: string;
  to: string;
}

const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const msOf = (iso: string) => Date.UTC(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)) - 1, Number(iso.slice(8, 10)));
const DAY_MS = 86_400_000;

/** The Monday of the ISO week a day falls in. */
export function mondayOf(iso: string): string {
  const ms = msOf(iso);
  const weekday = (new Date(ms).getUTCDay() + 6) % 7; // Monday 0 … Sunday 6
  return day(ms - weekday * DAY_MS);
}

/** Every week or month from the earliest to the latest day (none for no days). */
export function rangeBuckets(days: readonly string[], mode: 'week' | 'month'): RangeBucket[] {
  if (days.length === 0) return [];
  const sorted = [...days].sort();
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  const out: RangeBucket[] = [];
  if (mode === 'week') {
    for (let ms = msOf(mondayOf(first)); ms <= msOf(last); ms += 7 * DAY_MS) {
      const from = day(ms);
      const to = day(ms + 6 * DAY_MS);
      out.push({ key: from, label: `Week of ${formatMonthDayOf(from)}, ${from.slice(0, 4)}`, from, to });
    }
    return out;
  }
  let y = Number(first.slice(0, 4));
  let m = Number(first.slice(5, 7));
  const endKey = last.slice(0, 7);
  for (;;) {
    const key = `${y}-${String(m).padStart(2, '0')}`;
    const lastDay = new Date(Date.UTC(y, m, 0)).getUTCDate();
    out.push({ key, label: formatDate(`${key}-01`).replace(/ 1,/, ''), from: `${key}-01`, to: `${key}-${String(lastDay).padStart(2, '0')}` });
    if (key >= endKey) break;
    m += 1;
    if (m > 12) {
      m = 1;
      y += 1;
    }
  }
  return out;
}

/** True when a day lies in the bucket (or no bucket is chosen). */
export const inBucket = (iso: string, bucket: RangeBucket | null) => !bucket || (iso >= bucket.from && iso <= bucket.to);
