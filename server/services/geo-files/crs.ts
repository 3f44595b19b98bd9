/**
 * The coordinate system a GeoJSON file names in its (pre-RFC 7946) `crs` member: WGS84 and NAD83
 * longitude/latitude are read as they are; a projected system (state plane in feet, UTM, …) is
 * reprojected to lon/lat with proj4 from the EPSG definition, the way a shapefile's .prj is.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import proj4 from 'proj4';
import type { Position } from 'geojson';

const require = createRequire(import.meta.url);

/** What to do with a file's coordinates given the name of its coordinate system. */
export interface CrsPlan {
  transform?: (p: Position) => Position;
  /** A file-level remark that says what was done (never contradicted by what is done). */
  warning?: string;
  /** A note for every feature. */
  note?: string;
}

const WGS84_NAMES = /^(urn:ogc:def:crs:OGC:(1\.3:)?CRS84|CRS84|WGS ?84)$/i;
const NAD83_NAMES = /^(urn:ogc:def:crs:OGC:(1\.3:)?CRS83|CRS83|NAD ?83)$/i;

/** The EPSG code in a CRS name ("urn:ogc:def:crs:EPSG::2236", "EPSG:2236", "…/def/crs/EPSG/0/2236"), or null. */
export function epsgCode(name: string): number | null {
  const match = /EPSG(?::[\d.]*:|:|\/\d+\/)(\d{4,6})$/i.exec(name.trim());
  return match ? Number(match[1]) : null;
}

interface EpsgEntry {
  code: string;
  kind: string;
  name: string;
  proj4: string;
  unit?: string;
}

/** The EPSG registry entry (from the epsg-index package, one small file per code), or null. */
export function epsgEntry(code: number): EpsgEntry | null {
  try {
    return JSON.parse(readFileSync(require.resolve(`epsg-index/s/${code}.json`), 'utf8')) as EpsgEntry;
  } catch {
    return null;
  }
}

/** Decide how to read coordinates written in the named system. */
export function crsPlan(name: string): CrsPlan {
  if (WGS84_NAMES.test(name)) return {};
  const code = epsgCode(name);
  if (code === 4326) return {};
  if (NAD83_NAMES.test(name) || code === 4269) {
    return {
      warning:
        `The file declares NAD83 longitude/latitude ("${name}"). It was imported as WGS84 longitude/latitude, as GeoJSON (RFC 7946) defines; ` +
        'in the United States the two differ by about a metre or two, well within what a habitat plan needs.',
    };
  }
  const entry = code === null ? null : epsgEntry(code);
  if (!entry || !entry.proj4) {
    return {
      warning:
        `The file declares the coordinate system "${name}", which Browseline does not know, so its coordinates could not be converted. ` +
        'Export the layer as GeoJSON in WGS84 longitude/latitude (EPSG:4326) and upload it again.',
    };
  }
  if (entry.kind === 'CRS-GEOGCRS') {
    const nad27 = /NAD27|1927/i.test(entry.name);
    return {
      warning: `The file declares ${entry.name} longitude/latitude (EPSG:${code}); it was imported as WGS84 longitude/latitude.`,
      ...(nad27 ? { note: 'the file is in NAD27; its datum shift to WGS84 was not applied, so positions may be off by tens of metres — export in WGS84 or NAD83 for exact positions' } : {}),
    };
  }
  let converter: proj4.Converter;
  try {
    converter = proj4(entry.proj4, 'WGS84');
  } catch {
    return { warning: `The file's coordinate system ${entry.name} (EPSG:${code}) could not be set up for conversion. Export the layer in WGS84 longitude/latitude and upload it again.` };
  }
  return {
    transform: (p) => {
      const [lon, lat] = converter.forward([p[0], p[1]]);
      return p.length > 2 ? [lon, lat, p[2]] : [lon, lat];
    },
    warning: `The file's coordinates are in ${entry.name} (EPSG:${code}${entry.unit ? `, ${entry.unit}` : ''}); they were converted to WGS84 longitude/latitude.`,
  };
}

/** The geometry with every position passed through `transform` (anything unexpected is left as it is). */
export function reprojectGeometry(geometry: unknown, transform: (p: Position) => Position): unknown {
  if (typeof geometry !== 'object' || geometry === null) return geometry;
  const g = geometry as { type?: unknown; coordinates?: unknown; geometries?: unknown };
  const walk = (value: unknown): unknown => {
    if (!Array.isArray(value)) return value;
    if (value.length >= 2 && typeof value[0] === 'number' && typeof value[1] === 'number') return transform(value as Position);
    return value.map(walk);
  };
  if (g.type === 'GeometryCollection' && Array.isArray(g.geometries)) return { ...g, geometries: g.geometries.map((c) => reprojectGeometry(c, transform)) };
  return 'coordinates' in g ? { ...g, coordinates: walk(g.coordinates) } : g;
}
