/** GPX 1.1 export: point units as waypoints, line units as tracks, areas as closed track outlines. */
import type { Position } from 'geojson';
import { KIND_STYLES, kindFamily } from '../../../shared/domain/unit-kinds';
import { escapeXml, formatCoordinate, linesOf, polygonsOf, prepareGeometry } from './export-helpers';
import type { AreaGeometry, ExportUnit, PlanExport } from './types';

export const GPX_NAMESPACE = 'http://www.topografix.com/GPX/1/1';

const latLon = (p: Position): string => `lat="${formatCoordinate(p[1])}" lon="${formatCoordinate(p[0])}"`;

function describe(unit: ExportUnit): string {
  const figures: string[] = [];
  if (typeof unit.acres === 'number' && Number.isFinite(unit.acres)) figures.push(`${unit.acres.toFixed(2)} acres`);
  if (typeof unit.lengthFt === 'number' && Number.isFinite(unit.lengthFt)) figures.push(`${unit.lengthFt.toFixed(0)} ft`);
  const text = [KIND_STYLES[unit.kind].label + (figures.length ? ` (${figures.join(', ')})` : ''), unit.notes ?? ''].filter(Boolean).join(' — ');
  return `<desc>${escapeXml(text)}</desc>`;
}

const segment = (line: Position[]): string => `<trkseg>${line.map((p) => `<trkpt ${latLon(p)}/>`).join('')}</trkseg>`;

/** Each ring of each polygon as its own closed segment: outer ring first, then its holes. */
const areaSegments = (area: AreaGeometry): string => polygonsOf(area).flatMap((rings) => rings.map(segment)).join('');

/** The plan as a GPX 1.1 document; element order follows the GPX 1.1 schema (wpt, then trk). */
export function writeGpx(plan: PlanExport): string {
  const waypoints: string[] = [];
  const tracks: string[] = [];
  if (plan.boundary) {
    tracks.push(`<trk><name>${escapeXml(plan.propertyName)}</name><desc>Property boundary</desc><type>boundary</type>${areaSegments(prepareGeometry(plan.boundary))}</trk>`);
  }
  for (const unit of plan.units) {
    const geometry = prepareGeometry(unit.geometry);
    const family = kindFamily(unit.kind);
    if (geometry.type === 'Point') {
      waypoints.push(
        `<wpt ${latLon(geometry.coordinates)}><name>${escapeXml(unit.name)}</name>${describe(unit)}` +
          `<sym>${escapeXml(KIND_STYLES[unit.kind].label)}</sym><type>${unit.kind}</type></wpt>`,
      );
    } else {
      const segments = family === 'area' ? areaSegments(geometry as AreaGeometry) : linesOf(geometry).map(segment).join('');
      tracks.push(`<trk><name>${escapeXml(unit.name)}</name>${describe(unit)}<type>${unit.kind}</type>${segments}</trk>`);
    }
  }
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<gpx version="1.1" creator="Browseline" xmlns="${GPX_NAMESPACE}">`,
    `<metadata><name>${escapeXml(plan.propertyName)}</name></metadata>`,
    ...waypoints,
    ...tracks,
    '</gpx>',
    '',
  ].join('\n');
}
