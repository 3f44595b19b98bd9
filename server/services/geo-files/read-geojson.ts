/** GeoJSON (RFC 7946) reading: FeatureCollection, Feature or a bare geometry, with structural checks. */
import type { Position } from 'geojson';
import { tooManyFeatures, tooManyVertices, unreadableFile } from './geo-file-error';
import { crsPlan, reprojectGeometry } from './crs';
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

/** Positions in GeoJSON text, counted without parsing: every "[" that opens a list of numbers. */
export function countJsonPositions(text: string): number {
  let count = 0;
  for (let i = text.indexOf('['); i !== -1; i = text.indexOf('[', i + 1)) {
    let j = i + 1;
    while (j < text.length && (text.charCodeAt(j) === 32 || text.charCodeAt(j) === 10 || text.charCodeAt(j) === 13 || text.charCodeAt(j) === 9)) j += 1;
    const c = text.charCodeAt(j);
    if ((c >= 48 && c <= 57) || c === 45) count += 1; // a digit or "-"
  }
  return count;
}

/** Features in GeoJSON text, counted without parsing (every "type": "Feature"). */
export function countJsonFeatures(text: string): number {
  return text.match(/"type"\s*:\s*"Feature"/g)?.length ?? 0;
}

/** Parse GeoJSON text into source features; throws 422 GeoFileError for JSON that is not GeoJSON, 413 over a guard. */
export function readGeoJsonText(text: string, limits: { maxFeatures: number; maxVertices: number }): GeoJsonSources {
  // The guards run on the text first, so an oversized file is refused before it is built in memory.
  if (countJsonPositions(text) > limits.maxVertices) throw tooManyVertices(limits.maxVertices);
  const featureCount = countJsonFeatures(text);
  if (featureCount > limits.maxFeatures) throw tooManyFeatures(featureCount, limits.maxFeatures);
  const maxFeatures = limits.maxFeatures;
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
  let transform: ((p: Position) => Position) | null = null;
  let notesForAll: string[] | undefined;
  if (isRecord(data.crs)) {
    const crsName = isRecord(data.crs.properties) ? data.crs.properties.name : undefined;
    if (typeof crsName === 'string') {
      const plan = crsPlan(crsName.trim());
      if (plan.warning) warnings.push(plan.warning);
      transform = plan.transform ?? null;
      notesForAll = plan.note ? [plan.note] : undefined;
    }
  }
  const result = sourcesOf(data as Record<string, unknown> & { type: string }, maxFeatures);
  if (transform) for (const source of result) source.geometry = reprojectGeometry(source.geometry, transform);
  if (notesForAll) for (const source of result) source.notes = [...(source.notes ?? []), ...notesForAll];
  return { sources: result, warnings };
}

function sourcesOf(data: Record<string, unknown> & { type: string }, maxFeatures: number): SourceFeature[] {
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
    return sources;
  }
  if (data.type === 'Feature') {
    return [{ index: 0, geometry: data.geometry, properties: data.properties }];
  }
  if (GEOMETRY_TYPES.includes(data.type)) {
    return [{ index: 0, geometry: data, properties: {} }];
  }
  throw unreadableFile(
    `This file is JSON but not GeoJSON: its "type" is "${data.type.slice(0, 60)}"; expected FeatureCollection, Feature or a geometry type.`,
  );
}
