/** GeoJSON (RFC 7946) reading: FeatureCollection, Feature or a bare geometry, with structural checks. */
import { tooManyFeatures, unreadableFile } from './geo-file-error';
import type { SourceFeature } from './normalize-features';

const GEOMETRY_TYPES = ['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon', 'GeometryCollection'];

export interface GeoJsonSources {
  sources: SourceFeature[];
  warnings: string[];
}

/** Line and column of a character offset, for error messages. */
export function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - before.lastIndexOf('\n') };
}

function describeJsonSyntaxError(text: string, error: Error): string {
  const message = error.message.replace(/\s*\(line \d+ column \d+\)\s*$/, '');
  const position = /at position (\d+)/.exec(message);
  if (position) {
    const { line, column } = lineAndColumn(text, Number(position[1]));
    return `${message.replace(/ in JSON at position \d+/, '')} near line ${line}, column ${column}`;
  }
  return message;
}

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

const CRS84_NAMES = /^(urn:ogc:def:crs:OGC:(1\.3:)?CRS84|urn:ogc:def:crs:EPSG::4326|EPSG:4326|CRS84)$/i;

/** Parse GeoJSON text into source features; throws 422 GeoFileError for JSON that is not GeoJSON. */
export function readGeoJsonText(text: string, maxFeatures: number): GeoJsonSources {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    throw unreadableFile(
      `This file looks like GeoJSON but its JSON could not be read: ${describeJsonSyntaxError(text, error as Error)}. ` +
        'Fix the file in a text editor or export it again.',
    );
  }
  const warnings: string[] = [];
  if (!isRecord(data) || typeof data.type !== 'string') {
    throw unreadableFile(
      'This file is JSON but not GeoJSON: expected an object with "type" FeatureCollection, Feature or a geometry type. ' +
        'Export the layer as GeoJSON and upload that file.',
    );
  }
  if (data.type === 'Topology') {
    throw unreadableFile('This file is TopoJSON, not GeoJSON. Convert it to GeoJSON (for example with topojson-client) and upload that file.');
  }
  if (isRecord(data.crs)) {
    const crsName = isRecord(data.crs.properties) ? data.crs.properties.name : undefined;
    if (typeof crsName === 'string' && !CRS84_NAMES.test(crsName.trim())) {
      warnings.push(
        `The file declares the coordinate system "${crsName}"; GeoJSON (RFC 7946) is WGS84 longitude/latitude and only such coordinates can be imported.`,
      );
    }
  }

  if (data.type === 'FeatureCollection') {
    if (!Array.isArray(data.features)) {
      throw unreadableFile('This GeoJSON FeatureCollection has no "features" list. Export the layer again.');
    }
    if (data.features.length > maxFeatures) throw tooManyFeatures(data.features.length, maxFeatures);
    const sources: SourceFeature[] = data.features.map((feature: unknown, index: number) => {
      if (!isRecord(feature) || feature.type !== 'Feature') {
        const found = isRecord(feature) && typeof feature.type === 'string' ? `"type" is "${feature.type.slice(0, 40)}"` : 'not an object';
        return { index, geometry: null, properties: {}, problem: `not a GeoJSON Feature (${found})` };
      }
      return { index, geometry: feature.geometry, properties: feature.properties };
    });
    return { sources, warnings };
  }
  if (data.type === 'Feature') {
    return { sources: [{ index: 0, geometry: data.geometry, properties: data.properties }], warnings };
  }
  if (GEOMETRY_TYPES.includes(data.type)) {
    return { sources: [{ index: 0, geometry: data, properties: {} }], warnings };
  }
  throw unreadableFile(
    `This file is JSON but not GeoJSON: its "type" is "${data.type.slice(0, 60)}"; expected FeatureCollection, Feature or a geometry type.`,
  );
}
