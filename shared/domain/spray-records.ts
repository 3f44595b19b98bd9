/**
 * Spray records: what 7 CFR Part 110 (USDA pesticide recordkeeping) asks of a restricted-use
 * pesticide application — product name, EPA registration number, total amount applied, location,
 * crop or site, size of the area treated, date, and the certified applicator's name and
 * certification number (7 CFR 110.3) — plus wind and air temperature at the time. Records are kept
 * at least two years from the application (7 CFR 110.5). Pure: the CSV rows and the retention day.
 */

/** Years a record must be kept after the application (7 CFR 110.5). */
export const SPRAY_RECORD_RETENTION_YEARS = 2;

/** Compass points for the wind direction (the direction the wind blows from). */
export const WIND_DIRECTIONS = ['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW', 'calm'] as const;
export type WindDirection = (typeof WIND_DIRECTIONS)[number];

/** Units a product amount is written in. */
export const SPRAY_AMOUNT_UNITS = ['gal', 'qt', 'pt', 'fl-oz', 'lb', 'oz'] as const;
export type SprayAmountUnit = (typeof SPRAY_AMOUNT_UNITS)[number];

/** The caution printed on every spray-record export. */
export const SPRAY_RECORD_CAUTION =
  'The label is the law: apply every product only as its label directs, with the protective equipment it names. ' +
  'Keep these records at least two years from each application (7 CFR 110.5) and show them to the state or USDA when asked. ' +
  'Your state may ask for more than this record holds; follow its rules and your licence.';

/** True when a task is a herbicide step: a spray step, or one carrying the herbicide caution. */
export function isHerbicideTask(task: { kind: string; cautions?: readonly { id: string }[] | null }): boolean {
  return task.kind === 'spray' || (task.cautions ?? []).some((c) => c.id === 'herbicide');
}

/** One stored application of one product, as exports read it. */
export interface SprayRecordRow {
  appliedOn: string;
  propertyName: string;
  unitName: string;
  latitude: number | null;
  longitude: number | null;
  cropOrSite: string;
  areaTreated: number;
  areaUnit: string;
  productName: string;
  epaRegNo: string | null;
  restrictedUse: boolean;
  amount: number;
  amountUnit: string;
  applicatorName: string;
  applicatorCertNo: string | null;
  windMph: number;
  windDirection: string;
  airTempF: number;
}

/** Column headings of the CSV export, in order. */
export const SPRAY_CSV_COLUMNS = [
  'Date',
  'Property',
  'Unit',
  'Latitude',
  'Longitude',
  'Crop or site',
  'Area treated',
  'Area unit',
  'Product',
  'EPA Reg. No.',
  'Restricted use',
  'Total amount applied',
  'Amount unit',
  'Applicator',
  'Certification No.',
  'Wind (mph)',
  'Wind from',
  'Air temperature (°F)',
] as const;

/** A CSV field: quoted when it holds a comma, quote or line break; a leading =+-@ is defused for spreadsheets. */
function csvField(value: string | number | boolean | null): string {
  if (value === null) return '';
  let text = typeof value === 'boolean' ? (value ? 'yes' : 'no') : String(value);
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The CSV export (RFC 4180, CRLF line ends) of spray records, one row per product applied. */
export function sprayRecordsCsv(rows: readonly SprayRecordRow[]): string {
  const lines = [SPRAY_CSV_COLUMNS.map(csvField).join(',')];
  for (const r of rows) {
    lines.push(
      [r.appliedOn, r.propertyName, r.unitName, r.latitude, r.longitude, r.cropOrSite, r.areaTreated, r.areaUnit, r.productName, r.epaRegNo, r.restrictedUse, r.amount, r.amountUnit, r.applicatorName, r.applicatorCertNo, r.windMph, r.windDirection, r.airTempF]
        .map(csvField)
        .join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** The first day a record applied on `appliedOn` (YYYY-MM-DD) may be discarded: two years on (Feb 29 → Mar 1). */
export function keepUntil(appliedOn: string): string {
  const [y, m, d] = appliedOn.split('-').map(Number);
  const date = new Date(Date.UTC(y + SPRAY_RECORD_RETENTION_YEARS, m - 1, d));
  return date.toISOString().slice(0, 10);
}
