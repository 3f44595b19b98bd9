/** Display helpers for the client. */
import { feetToMiles } from '../../shared/units';
import { formatDay } from './firm-clock';

export const formatAcres = (acres: number | null | undefined, digits = 1): string =>
  acres === null || acres === undefined ? '—' : `${acres.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits })} ac`;

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

/** Feet, with miles beside them from a mile up. */
export const formatFeet = (ft: number | null | undefined): string => {
  if (ft === null || ft === undefined) return '—';
  const miles = feetToMiles(ft);
  return miles >= 1 ? `${formatNumber(ft)} ft (${formatNumber(miles, 2)} mi)` : `${formatNumber(ft)} ft`;
};
