/**
 * ISO calendar dates (UTC days): parse, format, add, compare. Their own small module so the field
 * sheet and the portal can use them without the planting-window tables (planting-windows.ts
 * re-exports them; import from either).
 */
import { DomainValidationError } from './errors';

/** A calendar date as "YYYY-MM-DD". */
export type IsoDate = string;

/** Short month names, January first. */
export const MONTH_NAMES = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const DAY_MS = 86_400_000;

/** Parse "YYYY-MM-DD" into a day number (days since 1970-01-01); throws DomainValidationError on bad input. */
export function parseIsoDate(value: IsoDate, field = 'date'): number {
  const match = typeof value === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(value) : null;
  if (match) {
    const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
    const ms = Date.UTC(year, month - 1, day);
    const check = new Date(ms);
    if (check.getUTCFullYear() === year && check.getUTCMonth() === month - 1 && check.getUTCDate() === day) {
      return Math.round(ms / DAY_MS);
    }
  }
  throw new DomainValidationError(field, 'Enter a whole, real date: month, day and year.');
}

/** Format a day number as "YYYY-MM-DD". */
export function formatIsoDate(dayNumber: number): IsoDate {
  return new Date(dayNumber * DAY_MS).toISOString().slice(0, 10);
}

/** Add days to an ISO date. */
export function addDays(date: IsoDate, days: number): IsoDate {
  return formatIsoDate(parseIsoDate(date) + days);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return parseIsoDate(to) - parseIsoDate(from);
}

/** "Aug 15" for an ISO date. */
export function formatMonthDay(date: IsoDate): string {
  const day = parseIsoDate(date);
  const d = new Date(day * DAY_MS);
  return `${MONTH_NAMES[d.getUTCMonth()]} ${d.getUTCDate()}`;
}

