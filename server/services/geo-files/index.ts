/** Reading and writing the plan's geometry files (GeoJSON, KML, KMZ, GPX, zipped shapefile, CSV). */
export { readGeoFile, DEFAULT_MAX_FEATURES, DEFAULT_MAX_UNZIPPED_BYTES } from './read-geo-file';
export { writeGeoFile, isExportFormat, EXPORT_FORMATS } from './write-geo-file';
export { GeoFileError, isGeoFileError, type GeoFileErrorCode, type GeoFileErrorStatus } from './geo-file-error';
export { KML_NAMESPACE, kmlColor } from './write-kml';
export { GPX_NAMESPACE } from './write-gpx';
export { CSV_COLUMNS } from './write-csv';
export type * from './types';
