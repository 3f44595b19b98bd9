/** Display helpers for the client. */
import { areaIn, feetToMiles, formatLength } from '../../shared/units';
import { firmUnits } from './firm-units';
import { formatDay } from './firm-clock';

/** An area kept in acres in the firm's unit: "12.3 ac", or "5.0 ha" when the firm shows hectares. */
export const formatAcres = (acres: number | null | undefined, digits = 1): string => {
  if (acres === null || acres === undefined) return '—';
  const hectares = firmUnits().areaUnit === 'hectares';
  const value = hectares ? areaIn(acres, 'hectares') : acres;
  return `${value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })} ${hectares ? 'ha' : 'ac'}`;
};

/** A date or an instant (read in the firm's time zone) as people write it: "Dec 5, 2026". */
export const formatDate = (iso: string): string => formatDay(iso);

export const formatRelative = (iso: string): string => {
  const minutes = Math.round((Date.now() - new Date(iso).getTime()) / 60000);
  if (minutes < 1) return 'just now';
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 24) return `${hours} h ago`;
  return formatDate(iso);
};

/** A figure with thousands separators and a fixed number of decimals. */
export const formatNumber = (n: number, digits = 0): string => n.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

/** Hectares, or a dash when there is no figure. */
export const formatHectares = (ha: number | null | undefined, digits = 1): string => (ha === null || ha === undefined ? '—' : `${formatNumber(ha, digits)} ha`);

/** Feet, with miles beside them from a mile up; metres (and kilometres) when the firm shows metres. */
export const formatFeet = (ft: number | null | undefined): string => {
  if (ft === null || ft === undefined) return '—';
  if (firmUnits().lengthUnit === 'metres') return formatLength(ft, 'metres');
  const miles = feetToMiles(ft);
  return miles >= 1 ? `${formatNumber(ft)} ft (${formatNumber(miles, 2)} mi)` : `${formatNumber(ft)} ft`;
};
