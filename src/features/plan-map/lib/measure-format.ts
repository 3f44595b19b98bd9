/** How the plan map writes measures: feet and miles for lengths, acres and hectares for areas. */

const num = (v: number, digits: number) => v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

/** "1,234 ft" (whole feet). */
export const formatFeet = (ft: number): string => `${num(Math.round(ft), 0)} ft`;

/** "0.23 mi" (two decimals; three under a tenth of a mile). */
export const formatMiles = (mi: number): string => `${num(mi, mi < 0.1 ? 3 : 2)} mi`;

/** "12.34 ac" (two decimals under 100 acres, one above). */
export const formatAcresShort = (acres: number): string => `${num(acres, acres < 100 ? 2 : 1)} ac`;

/** "4.99 ha". */
export const formatHectares = (ha: number): string => `${num(ha, ha < 100 ? 2 : 1)} ha`;

/** "42.0 %" (one decimal). */
export const formatPct = (pct: number): string => `${num(pct, 1)} %`;
