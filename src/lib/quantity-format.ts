/** Display of quantities and dates for the practice library and prescriptions. */
import { formatMonthDay } from '../../shared/domain/iso-dates';

/** A number with thousands separators and at most `maxDigits` decimals ("1,234.5"). */
export const formatQuantity = (value: number | null | undefined, maxDigits = 2): string =>
  value === null || value === undefined || !Number.isFinite(value) ? '—' : value.toLocaleString('en-US', { maximumFractionDigits: maxDigits });

/** "1 bag" / "3 bags": a count with its noun, plural when not one. */
export const plural = (count: number, one: string, many = `${one}s`): string => `${formatQuantity(count, 2)} ${count === 1 ? one : many}`;

/** "Jul 13 – Jul 20, 2027", or with both years when the range crosses a new year. */
export function formatDateRange(earliest: string, latest: string): string {
  const [y1, y2] = [earliest.slice(0, 4), latest.slice(0, 4)];
  if (earliest === latest) return `${formatMonthDay(earliest)}, ${y1}`;
  if (y1 === y2) return `${formatMonthDay(earliest)} – ${formatMonthDay(latest)}, ${y1}`;
  return `${formatMonthDay(earliest)}, ${y1} – ${formatMonthDay(latest)}, ${y2}`;
}

/** A typed number, or undefined for an empty box, or NaN for text that is not a number. */
export function parseNumberInput(text: string): number | undefined {
  const trimmed = text.trim().replace(/,/g, '');
  if (trimmed === '') return undefined;
  return /^[+-]?(\d+\.?\d*|\.\d+)$/.test(trimmed) ? Number(trimmed) : Number.NaN;
}
