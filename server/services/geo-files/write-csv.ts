/** CSV export (RFC 4180) of the plan's units with centroids, guarded against spreadsheet formula injection. */
import { centroidOf } from '../../../shared/domain/centroid';
import { kindFamily } from '../../../shared/domain/unit-kinds';
import { formatCoordinate } from './export-helpers';
import type { ExportUnit, PlanExport } from './types';

export const CSV_COLUMNS = ['id', 'name', 'kind', 'family', 'acres', 'lengthFt', 'centroidLat', 'centroidLon', 'notes', 'observedAt'] as const;

/**
 * A text cell that a spreadsheet would run as a formula (starting with = + - @, tab or carriage
 * return; OWASP "CSV Injection") gets a leading single quote.
 */
export function guardFormula(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** One RFC 4180 field: quoted when it holds a comma, quote or line break, quotes doubled. */
export function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A unit's centroid as [lon, lat]: the shared one (area-weighted for areas, the vertex mean for lines, the point itself). */
export function unitCentroid(unit: ExportUnit): [number, number] {
  const { lon, lat } = centroidOf(unit.geometry);
  return [lon, lat];
}

const fixed = (value: number | null | undefined, decimals: number): string =>
  typeof value === 'number' && Number.isFinite(value) ? value.toFixed(decimals) : '';

/** The units (then any observations) as CSV text: a header row, CRLF line ends, a UTF-8 byte-order mark for spreadsheets. */
export function writeCsv(plan: PlanExport): string {
  const rows = [CSV_COLUMNS.join(',')];
  for (const unit of plan.units) {
    const [lon, lat] = unitCentroid(unit);
    const text = (value: string) => csvField(guardFormula(value));
    rows.push(
      [
        text(String(unit.id)),
        text(unit.name),
        unit.kind,
        kindFamily(unit.kind),
        fixed(unit.acres, 2),
        fixed(unit.lengthFt, 0),
        formatCoordinate(lat),
        formatCoordinate(lon),
        text(unit.notes ?? ''),
        '',
      ].join(','),
    );
  }
  // Observations: one row each, family "observation", the position in the centroid columns.
  for (const o of plan.observations ?? []) {
    const text = (value: string) => csvField(guardFormula(value));
    rows.push([text(`observation-${o.id}`), text(o.label), text(o.kind), 'observation', '', '', formatCoordinate(o.position[1]), formatCoordinate(o.position[0]), text(o.notes ?? ''), o.observedAt].join(','));
  }
  return `\uFEFF${rows.join('\r\n')}\r\n`;
}
