/**
 * Formatting for the proposal document (no money arithmetic: amounts come from the input).
 */
import { formatDate, formatMoment } from '../../../shared/domain/clock';
import { KIND_STYLES, type UnitKind } from '../../../shared/domain/unit-kinds';
import { DEFAULT_DISPLAY_UNITS, formatArea, formatLength, type DisplayUnits } from '../../../shared/units';
import { kindSwatchSvg } from '../kit/map-svg';
import type { Column, Content } from 'pdfmake/interfaces';
import { fail, type DocData, type DocGroup } from './input';

/** "May 4, 2026" from "2026-05-04", read as a calendar date (no time zone shift). */
export function formatCalendarDate(isoDate: string, field: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const date = new Date(Date.UTC(y, m - 1, d));
  if (date.getUTCMonth() !== m - 1 || date.getUTCDate() !== d) fail(field, `${isoDate} is not a calendar date`);
  return formatDate(isoDate, { long: true });
}

/** "March 14, 2027, 10:42 AM CDT" from an ISO date-time, in the firm's zone; the date alone from a date. */
export function formatSignedAt(value: string, timeZone: string): string {
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return formatCalendarDate(value, 'approval.signedAt');
  const instant = new Date(/(Z|[+-]\d{2}:?\d{2})$/.test(value) ? value : `${value}Z`);
  if (Number.isNaN(instant.getTime())) fail('approval.signedAt', `${value} is not a date-time`);
  return formatMoment(instant, timeZone, { long: true });
}

/** "1,200" from "1200.0000", "2.37" from "2.3700": the decimal string as written, grouped, zeros trimmed. */
export function formatQuantity(quantity: string): string {
  const [whole, fraction = ''] = quantity.split('.');
  const grouped = whole.replace(/^0+(?=\d)/, '').replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const trimmed = fraction.replace(/0+$/, '');
  return trimmed ? `${grouped}.${trimmed}` : grouped;
}

/** Count nouns whose plural is a plain "s"; other units ("lb", "gal", "each") read the same either way. */
const PLURAL_NOUNS = new Set(['acre', 'hour', 'ton', 'day', 'bag', 'trip', 'load', 'visit', 'tree', 'sign', 'post']);

/** "2.37 acres", "1 acre", "3 50-lb bags", "12.5 lb". */
export function quantityWithUnit(quantity: string, unit: string): string {
  const shown = formatQuantity(quantity);
  const trimmedUnit = unit.trim();
  if (!trimmedUnit) return shown;
  const match = /^(.*?)([A-Za-z]+)$/.exec(trimmedUnit);
  const plural = shown !== '1' && match !== null && PLURAL_NOUNS.has(match[2].toLowerCase());
  return `${shown} ${plural ? `${trimmedUnit}s` : trimmedUnit}`;
}

/** "5.5%", "7.25%", "30%" — up to four decimals, trailing zeros dropped. */
export function formatPct(pct: number): string {
  return `${Number(pct.toFixed(4))}%`;
}

/** Paragraphs split on blank lines; single line breaks kept inside a paragraph. */
export function paragraphs(body: string, style: Record<string, unknown> = {}): Content[] {
  return body
    .replace(/\r\n?/g, '\n')
    .split(/\n\s*\n/)
    .map((p) => p.replace(/^\n+|\n+$/g, ''))
    .filter((p) => p.trim() !== '')
    .map((p, i, all) => ({ text: p, margin: [0, 0, 0, i === all.length - 1 ? 0 : 6], ...style }) as Content);
}

/** A unit kind's small map key for a table cell (empty when the line has no kind). */
export function swatch(kind: UnitKind | null | undefined, marginTopPt = 1.5): Column {
  if (!kind) return { text: '', width: 16 };
  return { svg: kindSwatchSvg(kind, 16, 10), width: 16, margin: [0, marginTopPt, 0, 0] };
}

/** The firm's units as the document's firm carries them (acres and feet when it chose none). */
export function unitsOf(data: DocData): DisplayUnits {
  return { areaUnit: data.firm.areaUnit ?? DEFAULT_DISPLAY_UNITS.areaUnit, lengthUnit: data.firm.lengthUnit ?? DEFAULT_DISPLAY_UNITS.lengthUnit };
}

/** A unit's size in the firm's units: area for areas, length for lines, nothing for points. */
export function sizeOf(group: Pick<DocGroup, 'kind' | 'acres' | 'lengthFt'>, units: DisplayUnits): string {
  const family = group.kind ? KIND_STYLES[group.kind].family : null;
  if (family !== 'line' && group.acres != null) return formatArea(group.acres, units.areaUnit);
  if (family !== 'area' && group.lengthFt != null) return formatLength(group.lengthFt, units.lengthUnit);
  return '';
}
