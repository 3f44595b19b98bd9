/** CSV export (RFC 4180) of the plan's units with centroids, guarded against spreadsheet formula injection. */
import { centroid } from '@turf/turf';
import type { Position } from 'geojson';
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

/**
 * Area-weighted centroid of polygons with holes, planar in lon/lat (an affine change of scale
 * such as cos(latitude) moves a centroid with the shape, so a local map projection gives the same
 * point). turf's centerOfMass joins the rings of a polygon with holes into one and takes the
 * convex hull of a MultiPolygon, so it is not used for areas.
 */
export function areaCentroid(polygons: Position[][][]): [number, number] | null {
  const origin = polygons[0]?.[0]?.[0];
  if (!origin) return null;
  let sumArea = 0;
  let sumX = 0;
  let sumY = 0;
  for (const rings of polygons) {
    rings.forEach((ring, i) => {
      // Shoelace terms relative to the origin, to keep the products small.
      let a = 0;
      let cx = 0;
      let cy = 0;
      for (let k = 0; k < ring.length - 1; k += 1) {
        const x0 = ring[k][0] - origin[0];
        const y0 = ring[k][1] - origin[1];
        const x1 = ring[k + 1][0] - origin[0];
        const y1 = ring[k + 1][1] - origin[1];
        const cross = x0 * y1 - x1 * y0;
        a += cross;
        cx += (x0 + x1) * cross;
        cy += (y0 + y1) * cross;
      }
      // Exterior rings add, holes subtract, whatever their winding.
      const sign = (i === 0 ? 1 : -1) * Math.sign(a);
      sumArea += sign * a;
      sumX += sign * cx;
      sumY += sign * cy;
    });
  }
  if (sumArea === 0) return null;
  return [origin[0] + sumX / (3 * sumArea), origin[1] + sumY / (3 * sumArea)];
}

/** A unit's centroid: area-weighted for areas, turf's centroid (mean of vertices) for lines, the point itself. */
export function unitCentroid(unit: ExportUnit): [number, number] {
  const geometry = unit.geometry;
  if (geometry.type === 'Point') return [geometry.coordinates[0], geometry.coordinates[1]];
  if (geometry.type === 'Polygon' || geometry.type === 'MultiPolygon') {
    const c = areaCentroid(geometry.type === 'Polygon' ? [geometry.coordinates] : geometry.coordinates);
    if (c) return c;
  }
  const point = centroid(geometry);
  return [point.geometry.coordinates[0], point.geometry.coordinates[1]];
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
