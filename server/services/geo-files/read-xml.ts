/** KML and GPX reading through @xmldom/xmldom and @tmcw/togeojson. */
import { DOMParser, type Document as XmlDocument } from '@xmldom/xmldom';
import { gpxGen, kmlGen } from '@tmcw/togeojson';
import { booleanPointInPolygon } from '@turf/turf';
import type { Position } from 'geojson';
import { AREA_KINDS } from '../../../shared/domain/unit-kinds';
import { tooManyFeatures, unreadableFile } from './geo-file-error';
import type { SourceFeature } from './normalize-features';

interface LocatorLike {
  lineNumber?: number;
  columnNumber?: number;
}

/** Parse XML text; a fatal error becomes a 422 GeoFileError naming the problem and its line. */
export function parseXml(text: string, label: string): XmlDocument {
  let firstProblem: string | undefined;
  const parser = new DOMParser({
    onError: (level, message) => {
      // Warnings and recoverable errors (e.g. an HTML entity such as &nbsp; in a description) are
      // let through: xmldom keeps going and the content is still usable.
      if (level === 'fatalError') {
        firstProblem ??= String(message);
        throw new Error(String(message));
      }
    },
  });
  let doc: XmlDocument;
  try {
    doc = parser.parseFromString(text, 'text/xml');
  } catch (error) {
    const locator = (error as { locator?: LocatorLike }).locator;
    const where =
      locator?.lineNumber && locator.lineNumber > 0
        ? ` near line ${locator.lineNumber}${locator.columnNumber ? `, column ${locator.columnNumber}` : ''}`
        : '';
    const problem = (firstProblem ?? (error as Error).message).replace(/^Reporting \w+ "(.*)" caused .*$/s, '$1');
    const subject = label === 'XML file' ? 'This XML file could not be read' : `This file is a ${label} but its XML could not be read`;
    throw unreadableFile(
      `${subject}: ${problem}${where}. ` +
        'The file may be cut short or hand-edited; export it again or fix it in a text editor.',
      { line: locator?.lineNumber, column: locator?.columnNumber },
    );
  }
  if (!doc.documentElement) {
    throw unreadableFile(`This file is a ${label} but it has no root element. Export it again.`);
  }
  return doc;
}

/** The local name of a parsed document's root element. */
export function rootName(doc: XmlDocument): string {
  return doc.documentElement?.localName ?? doc.documentElement?.nodeName ?? '';
}

function collect(generator: Iterable<{ geometry: unknown; properties: unknown }>, maxFeatures: number, label: string): SourceFeature[] {
  const sources: SourceFeature[] = [];
  try {
    for (const feature of generator) {
      if (sources.length >= maxFeatures) throw tooManyFeatures(`more than ${maxFeatures}`, maxFeatures);
      sources.push({ index: sources.length, geometry: feature.geometry, properties: feature.properties });
    }
  } catch (error) {
    if ((error as Error).name === 'GeoFileError') throw error;
    throw unreadableFile(`This ${label} could not be converted: ${(error as Error).message}. Export it again.`);
  }
  return sources;
}

/** Placemarks of a KML document as source features (a Placemark without readable geometry has null). */
export function readKmlDocument(doc: XmlDocument, maxFeatures: number, label = 'KML'): SourceFeature[] {
  return collect(kmlGen(doc), maxFeatures, label);
}

const AREA_TYPES = new Set<string>([...AREA_KINDS, 'boundary']);

const closed = (line: Position[]): boolean =>
  line.length >= 4 && line[0][0] === line[line.length - 1][0] && line[0][1] === line[line.length - 1][1];

/**
 * A GPX track or route whose <type> is an area kind and whose segments are all closed is an area
 * written as outlines (handheld units show tracks): rebuild the polygon(s). A segment inside the
 * previous outer ring is a hole of it; any other starts a new polygon.
 */
export function areaFromClosedTrack(geometry: unknown, type: unknown): { type: 'Polygon' | 'MultiPolygon'; coordinates: unknown } | null {
  if (typeof type !== 'string' || !AREA_TYPES.has(type.trim())) return null;
  const g = geometry as { type?: string; coordinates?: Position[] | Position[][] } | null;
  if (!g || !Array.isArray(g.coordinates)) return null;
  const lines = g.type === 'LineString' ? [g.coordinates as Position[]] : g.type === 'MultiLineString' ? (g.coordinates as Position[][]) : null;
  if (!lines || lines.length === 0 || !lines.every((l) => Array.isArray(l) && closed(l))) return null;
  const polygons: Position[][][] = [];
  for (const ring of lines) {
    const current = polygons[polygons.length - 1];
    const first: Position = [ring[0][0], ring[0][1]];
    if (current && booleanPointInPolygon(first, { type: 'Polygon', coordinates: [current[0]] })) current.push(ring);
    else polygons.push([ring]);
  }
  return polygons.length === 1 ? { type: 'Polygon', coordinates: polygons[0] } : { type: 'MultiPolygon', coordinates: polygons };
}

/** Waypoints, routes and tracks of a GPX document as source features; closed area tracks become areas. */
export function readGpxDocument(doc: XmlDocument, maxFeatures: number): SourceFeature[] {
  return collect(gpxGen(doc), maxFeatures, 'GPX').map((source) => {
    const properties = (source.properties ?? {}) as Record<string, unknown>;
    const area = areaFromClosedTrack(source.geometry, properties.type);
    if (!area) return source;
    return {
      ...source,
      geometry: area,
      notes: [`rebuilt as an area from a closed ${properties._gpxType === 'rte' ? 'route' : 'track'} (its type is "${String(properties.type)}")`],
    };
  });
}
