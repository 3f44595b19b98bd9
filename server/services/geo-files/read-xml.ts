/**
 * KML and GPX reading with a streaming XML parser (saxes): placemarks, waypoints, routes and tracks
 * become source features as the parser passes them, and the feature and vertex guards stop the
 * read as soon as a file is over them, before anything more is built.
 */
import { SaxesParser, type SaxesTagPlain } from 'saxes';
import { booleanPointInPolygon } from '@turf/turf';
import type { Position } from 'geojson';
import { AREA_KINDS } from '../../../shared/domain/unit-kinds';
import { tooManyFeatures, tooManyVertices, unreadableFile } from './geo-file-error';
import type { SourceFeature } from './normalize-features';

/** Guards of one read: features (placemarks, waypoints, routes, tracks) and coordinate positions. */
export interface XmlReadLimits {
  maxFeatures: number;
  maxVertices: number;
}

export interface KmlRead {
  sources: SourceFeature[];
  /** `href`s of NetworkLinks, in document order (a KMZ's doc.kml may hold only these). */
  links: string[];
}

/** A running count of positions shared by every document of one import (a KMZ may hold several). */
export class VertexCounter {
  count = 0;
  constructor(readonly max: number) {}
  /** Add `n` positions; throws 413 as soon as the import holds more than the guard allows. */
  add(n: number): void {
    this.count += n;
    if (this.count > this.max) throw tooManyVertices(this.max);
  }
}

const localName = (name: string): string => {
  const colon = name.indexOf(':');
  return colon === -1 ? name : name.slice(colon + 1);
};

type Label = string;

class XmlProblem extends Error {}

const isFatal = (error: Error): boolean => !/undefined entity/i.test(error.message);

/** Where the first fatal XML error is: a second pass with positions on, run only when the first failed. */
function locateProblem(text: string): { line: number; column: number; openTag?: string } {
  const parser = new SaxesParser<{ xmlns: false; position: true }>({ xmlns: false, position: true });
  const open: string[] = [];
  let found: { line: number; column: number; openTag?: string } | null = null;
  parser.on('opentag', (tag: SaxesTagPlain) => {
    if (!tag.isSelfClosing) open.push(tag.name);
  });
  parser.on('closetag', () => {
    open.pop();
  });
  parser.on('error', (error: Error) => {
    if (!isFatal(error)) return;
    found ??= { line: parser.line, column: parser.column, openTag: open[open.length - 1] };
    throw new XmlProblem(error.message);
  });
  try {
    parser.write(text).close();
  } catch {
    /* found */
  }
  return found ?? { line: parser.line, column: parser.column };
}

/**
 * Run saxes over the text (positions off: they cost a third of the parse); a well-formedness
 * error becomes a 422 naming the format, the problem and its line, found by a second pass.
 */
function runParser(text: string, label: Label, handlers: (parser: SaxesParser<{ xmlns: false }>) => void): void {
  const parser = new SaxesParser<{ xmlns: false }>({ xmlns: false, position: false } as { xmlns: false });
  parser.on('error', (error: Error) => {
    // An HTML entity (&nbsp; in a description) is not XML, but the content stays usable: let it pass.
    if (!isFatal(error)) return;
    throw new XmlProblem(error.message);
  });
  handlers(parser);
  try {
    parser.write(text).close();
  } catch (error) {
    if ((error as Error).name === 'GeoFileError') throw error;
    const where = locateProblem(text);
    const problem = (error as Error).message.replace(/^\d+:\d+:\s*/, '').replace(/\.$/, '');
    const subject = label === 'XML file' ? 'This XML file could not be read' : `This file is a ${label} but its XML could not be read`;
    throw unreadableFile(
      `${subject}: ${problem} near line ${where.line}, column ${where.column}. ` +
        'The file may be cut short or hand-edited; export it again or fix it in a text editor.',
      { line: where.line, column: where.column },
    );
  }
}

/** The local name of the first element (the root), read with the same parser, or null. */
export function xmlRootOf(text: string): string | null {
  let root: string | null = null;
  const parser = new SaxesParser<{ xmlns: false }>({ xmlns: false });
  parser.on('error', () => undefined);
  parser.on('opentag', (tag: SaxesTagPlain) => {
    root ??= localName(tag.name);
  });
  try {
    // The root is near the top: the first 64 KB are plenty (declaration, comments, DOCTYPE).
    parser.write(text.slice(0, 64 * 1024));
  } catch {
    /* the root was found or not; either way stop */
  }
  return root;
}

/**
 * Parse a KML `coordinates` text ("lon,lat[,alt] …", tuples split by whitespace, a space after a
 * comma tolerated); null when a tuple is not numbers. A hand-written scan: it runs over every
 * vertex of a file, and is several times faster than split-and-map.
 */
export function parseKmlCoordinates(text: string): Position[] | null {
  const out: Position[] = [];
  // The tuple being read, in locals: each position is then made once, at its exact size (a
  // growing array per tuple was most of a large file's garbage).
  let count = 0;
  let lon = 0;
  let lat = 0;
  let alt = 0;
  let start = -1;
  let afterComma = false;
  const n = text.length;
  for (let i = 0; i <= n; i += 1) {
    const c = i < n ? text.charCodeAt(i) : 32;
    const space = c === 32 || c === 10 || c === 13 || c === 9;
    if (c === 44 /* , */ || space) {
      if (start !== -1) {
        const value = parseDecimal(text, start, i);
        if (!Number.isFinite(value)) return null;
        if (count === 0) lon = value;
        else if (count === 1) lat = value;
        else if (count === 2) alt = value;
        count += 1;
        start = -1;
      }
      if (c === 44) {
        afterComma = true;
        continue;
      }
      // Whitespace ends a tuple unless it follows a comma ("lon, lat").
      if (!afterComma && count > 0) {
        if (count < 2) return null;
        out.push(count === 2 ? [lon, lat] : [lon, lat, alt]);
        count = 0;
      }
      continue;
    }
    afterComma = false;
    if (start === -1) start = i;
  }
  if (count > 0) return null;
  return out;
}

/**
 * The number written in text[from, to): plain decimals ("-93.4500001") are read digit by digit
 * without making a substring (integer ÷ power of ten is correctly rounded while both are exact,
 * i.e. up to 15 digits), anything else through Number().
 */
function parseDecimal(text: string, from: number, to: number): number {
  let i = from;
  let negative = false;
  const first = text.charCodeAt(i);
  if (first === 45 /* - */ || first === 43 /* + */) {
    negative = first === 45;
    i += 1;
  }
  let mantissa = 0;
  let digits = 0;
  let scale = 0;
  let seenDot = false;
  for (; i < to; i += 1) {
    const c = text.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits += 1;
      if (seenDot) scale += 1;
    } else if (c === 46 /* . */ && !seenDot) {
      seenDot = true;
    } else {
      return Number(text.slice(from, to)); // an exponent, or not a number at all
    }
  }
  if (digits === 0 || digits > 15) return Number(text.slice(from, to));
  const value = scale === 0 ? mantissa : mantissa / POWERS_OF_TEN[scale];
  return negative ? -value : value;
}

const POWERS_OF_TEN = Array.from({ length: 16 }, (_, k) => 10 ** k);

interface GeometryBuilder {
  kind: string;
  coordinates?: Position[] | null;
  outer?: Position[] | null;
  inner?: (Position[] | null)[];
  children?: unknown[];
  /** gx:Track positions. */
  track?: Position[];
  broken?: boolean;
}

function finishGeometry(b: GeometryBuilder): unknown {
  switch (b.kind) {
    case 'Point':
      return b.coordinates && b.coordinates.length > 0 ? { type: 'Point', coordinates: b.coordinates[0] } : null;
    case 'LineString':
    case 'LinearRing':
      return b.coordinates && b.coordinates.length > 0 ? { type: 'LineString', coordinates: b.coordinates } : null;
    case 'Track':
      return b.track && b.track.length > 0 && !b.broken ? { type: 'LineString', coordinates: b.track } : null;
    case 'Polygon':
      if (!b.outer || b.outer.length === 0 || (b.inner ?? []).some((r) => !r)) return null;
      return { type: 'Polygon', coordinates: [b.outer, ...(b.inner as Position[][])] };
    default: {
      const children = (b.children ?? []).filter((c) => c !== null);
      if (children.length === 0) return null;
      return children.length === 1 ? children[0] : { type: 'GeometryCollection', geometries: children };
    }
  }
}

/** Elements whose text the KML reader keeps (everything else, e.g. whitespace between tags, is dropped at once). */
const KML_TEXT_ELEMENTS = new Set(['name', 'description', 'styleUrl', 'visibility', 'coordinates', 'coord', 'value', 'SimpleData', 'href']);

const GEOMETRY_ELEMENTS = new Set(['Point', 'LineString', 'LinearRing', 'Polygon', 'MultiGeometry', 'Track', 'MultiTrack']);

/**
 * Read KML text into source features (one per Placemark, in document order: name, description,
 * styleUrl and ExtendedData as properties) and the NetworkLink hrefs it holds.
 */
export function readKmlText(text: string, limits: XmlReadLimits, vertices = new VertexCounter(limits.maxVertices), label = 'KML'): KmlRead {
  const sources: SourceFeature[] = [];
  const links: string[] = [];
  const stack: string[] = [];
  let placemark: { properties: Record<string, unknown>; geometry: unknown; depth: number } | null = null;
  const builders: GeometryBuilder[] = [];
  let textBuffer = '';
  let dataName: string | null = null;
  let inNetworkLink = 0;
  let sawRoot = false;
  let capture = false;

  runParser(text, label, (parser) => {
    parser.on('opentag', (tag: SaxesTagPlain) => {
      const name = localName(tag.name);
      if (!sawRoot) {
        sawRoot = true;
        if (name !== 'kml') throw unreadableFile(`This ${label} is not KML: its root element is <${name}>. Export it again.`);
      }
      stack.push(name);
      textBuffer = '';
      capture = KML_TEXT_ELEMENTS.has(name);
      if (name === 'NetworkLink') inNetworkLink += 1;
      if (name === 'Placemark') {
        if (sources.length >= limits.maxFeatures) throw tooManyFeatures(`more than ${limits.maxFeatures.toLocaleString('en-US')}`, limits.maxFeatures);
        placemark = { properties: {}, geometry: null, depth: stack.length };
        builders.length = 0;
        return;
      }
      if (!placemark) return;
      if (GEOMETRY_ELEMENTS.has(name)) {
        builders.push({ kind: name === 'MultiTrack' ? 'MultiGeometry' : name, inner: [], children: [], track: [] });
      } else if (name === 'Data') {
        dataName = typeof tag.attributes.name === 'string' ? tag.attributes.name : null;
      } else if (name === 'SimpleData') {
        dataName = typeof tag.attributes.name === 'string' ? tag.attributes.name : null;
      }
    });
    parser.on('text', (t: string) => {
      if (capture) textBuffer += t;
    });
    parser.on('cdata', (t: string) => {
      if (capture) textBuffer += t;
    });
    parser.on('closetag', (tag: SaxesTagPlain) => {
      capture = false;
      const name = localName(tag.name);
      const parent = stack[stack.length - 2];
      const value = textBuffer;
      textBuffer = '';
      stack.pop();
      if (name === 'NetworkLink') inNetworkLink -= 1;
      if (name === 'href' && inNetworkLink > 0 && value.trim()) links.push(value.trim());
      const current = placemark;
      if (!current) return;
      if (name === 'Placemark') {
        sources.push({ index: sources.length, geometry: current.geometry, properties: current.properties });
        placemark = null;
        return;
      }
      const builder = builders[builders.length - 1];
      if (name === 'coordinates' && builder) {
        const coordinates = parseKmlCoordinates(value);
        if (coordinates) vertices.add(coordinates.length);
        builder.coordinates = coordinates;
        return;
      }
      if (name === 'coord' && builder?.kind === 'Track') {
        const numbers = value.trim().split(/\s+/).map(Number);
        if (numbers.length < 2 || numbers.some((n) => !Number.isFinite(n))) builder.broken = true;
        else {
          vertices.add(1);
          builder.track!.push(numbers.slice(0, 3));
        }
        return;
      }
      if (GEOMETRY_ELEMENTS.has(name) && builder) {
        builders.pop();
        const geometry = finishGeometry(builder);
        const owner = builders[builders.length - 1];
        if (name === 'LinearRing' && owner?.kind === 'Polygon') {
          const ring = geometry ? (geometry as { coordinates: Position[] }).coordinates : null;
          if (parent === 'outerBoundaryIs') owner.outer = ring;
          else if (parent === 'innerBoundaryIs') owner.inner!.push(ring);
        } else if (owner) {
          owner.children!.push(geometry);
        } else {
          current.geometry = geometry;
        }
        return;
      }
      // Properties: direct children of the Placemark and ExtendedData values.
      if (stack.length === current.depth) {
        if (name === 'name' || name === 'description' || name === 'styleUrl' || name === 'visibility') current.properties[name] = value.trim();
      } else if (name === 'value' && parent === 'Data' && dataName) {
        current.properties[dataName] = value.trim();
      } else if (name === 'SimpleData' && dataName) {
        current.properties[dataName] = value.trim();
        dataName = null;
      }
    });
  });
  if (!sawRoot) throw unreadableFile(`This file is a ${label} but it has no root element. Export it again.`);
  return { sources, links };
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

const GPX_PROPERTIES = new Set(['name', 'type', 'desc', 'cmt', 'src', 'sym', 'number']);

/** Waypoints, routes and tracks of GPX text as source features; closed area tracks become areas. */
export function readGpxText(text: string, limits: XmlReadLimits, vertices = new VertexCounter(limits.maxVertices)): SourceFeature[] {
  const sources: SourceFeature[] = [];
  const stack: string[] = [];
  let feature: { kind: 'wpt' | 'rte' | 'trk'; depth: number; properties: Record<string, unknown>; point?: Position | null; segments: Position[][] } | null = null;
  let segment: Position[] | null = null;
  let textBuffer = '';
  let pending: Position | null = null;
  let sawRoot = false;

  const position = (attributes: Record<string, string>): Position | null => {
    const lon = Number(attributes.lon);
    const lat = Number(attributes.lat);
    return attributes.lon !== undefined && attributes.lat !== undefined && Number.isFinite(lon) && Number.isFinite(lat) ? [lon, lat] : null;
  };

  runParser(text, 'GPX', (parser) => {
    parser.on('opentag', (tag: SaxesTagPlain) => {
      const name = localName(tag.name);
      if (!sawRoot) {
        sawRoot = true;
        if (name !== 'gpx') throw unreadableFile(`This GPX is not GPX: its root element is <${name}>. Export it again.`);
      }
      stack.push(name);
      textBuffer = '';
      const attributes = tag.attributes as Record<string, string>;
      if (!feature && (name === 'wpt' || name === 'rte' || name === 'trk')) {
        if (sources.length >= limits.maxFeatures) throw tooManyFeatures(`more than ${limits.maxFeatures.toLocaleString('en-US')}`, limits.maxFeatures);
        feature = { kind: name, depth: stack.length, properties: { _gpxType: name }, segments: [] };
        if (name === 'wpt') {
          feature.point = position(attributes);
          if (feature.point) vertices.add(1);
        }
        if (name === 'rte') segment = [];
        return;
      }
      if (!feature) return;
      if (name === 'trkseg') segment = [];
      if (name === 'rtept' || name === 'trkpt') {
        pending = position(attributes);
        if (pending) {
          vertices.add(1);
          segment?.push(pending);
        }
      }
    });
    parser.on('text', (t: string) => {
      textBuffer += t;
    });
    parser.on('cdata', (t: string) => {
      textBuffer += t;
    });
    parser.on('closetag', (tag: SaxesTagPlain) => {
      const name = localName(tag.name);
      const value = textBuffer;
      textBuffer = '';
      stack.pop();
      const current = feature;
      if (!current) return;
      if (name === 'ele' && (stack[stack.length - 1] === 'rtept' || stack[stack.length - 1] === 'trkpt') && pending) {
        const ele = Number(value);
        if (Number.isFinite(ele)) pending.push(ele);
        return;
      }
      if (name === 'ele' && stack.length === current.depth && current.point) {
        const ele = Number(value);
        if (Number.isFinite(ele)) current.point.push(ele);
        return;
      }
      if (name === 'trkseg' && segment) {
        if (segment.length >= 2) current.segments.push(segment);
        segment = null;
        return;
      }
      if (stack.length === current.depth && GPX_PROPERTIES.has(name)) {
        current.properties[name] = value.trim();
        return;
      }
      if (stack.length === current.depth - 1 && name === current.kind) {
        if (current.kind === 'rte' && segment) {
          if (segment.length >= 2) current.segments.push(segment);
          segment = null;
        }
        let geometry: unknown = null;
        if (current.kind === 'wpt') geometry = current.point ? { type: 'Point', coordinates: current.point } : null;
        else if (current.segments.length === 1) geometry = { type: 'LineString', coordinates: current.segments[0] };
        else if (current.segments.length > 1) geometry = { type: 'MultiLineString', coordinates: current.segments };
        const source: SourceFeature = { index: sources.length, geometry, properties: current.properties };
        const area = areaFromClosedTrack(geometry, current.properties.type);
        if (area) {
          source.geometry = area;
          source.notes = [`rebuilt as an area from a closed ${current.kind === 'rte' ? 'route' : 'track'} (its type is "${String(current.properties.type)}")`];
        }
        sources.push(source);
        feature = null;
      }
    });
  });
  if (!sawRoot) throw unreadableFile('This file is a GPX but it has no root element. Export it again.');
  return sources;
}
