/** Export entry point: the plan's units as GeoJSON, KML, GPX or CSV with a safe file name. */
import { GeoFileError } from './geo-file-error';
import { checkPlanExport, slugify } from './export-helpers';
import { writeCsv } from './write-csv';
import { writeGeoJson } from './write-geojson';
import { writeGpx } from './write-gpx';
import { writeKml } from './write-kml';
import type { ExportFormat, GeoFileOutput, PlanExport } from './types';
import { GEO_EXPORT_FORMATS } from '../../../shared/schemas/geo-import';

export const EXPORT_FORMATS: readonly ExportFormat[] = GEO_EXPORT_FORMATS;

const WRITERS: Record<ExportFormat, { contentType: string; extension: string; write: (plan: PlanExport) => string }> = {
  geojson: { contentType: 'application/geo+json', extension: 'geojson', write: writeGeoJson }, // RFC 7946 §12
  kml: { contentType: 'application/vnd.google-earth.kml+xml', extension: 'kml', write: writeKml }, // IANA media type
  gpx: { contentType: 'application/gpx+xml', extension: 'gpx', write: writeGpx }, // common practice, not IANA-registered
  csv: { contentType: 'text/csv; charset=utf-8', extension: 'csv', write: writeCsv }, // RFC 4180 / RFC 7111
};

/** True when the string names an export format. */
export function isExportFormat(value: string): value is ExportFormat {
  return (EXPORT_FORMATS as readonly string[]).includes(value);
}

/** Write the plan's units in the requested format; throws GeoFileError 400 (format) or 422 (plan). */
export function writeGeoFile(format: ExportFormat | string, plan: PlanExport): GeoFileOutput {
  if (!isExportFormat(format)) {
    throw new GeoFileError(400, 'unknown-export-format', `Export format "${String(format).slice(0, 20)}" is not offered; choose geojson, kml, gpx or csv.`);
  }
  checkPlanExport(plan);
  const writer = WRITERS[format];
  return {
    contentType: writer.contentType,
    filename: `${slugify(plan.propertyName)}.${writer.extension}`,
    body: writer.write(plan),
  };
}
