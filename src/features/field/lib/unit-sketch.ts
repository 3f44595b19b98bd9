/**
 * The task page's small map of a unit, drawn without tiles so it works with no signal: the unit's
 * geometry projected into a box (x = lon·cos(midLat), y = −lat, an equirectangular projection about
 * the middle latitude; plenty for a field-sized shape), plus dots for photo positions.
 */
import type { Geometry, Position } from 'geojson';

export interface SketchPoint {
  x: number;
  y: number;
}

export interface PlacedPosition extends SketchPoint {
  id: number;
}

export interface UnitSketch {
  width: number;
  height: number;
  /** Path data of every polygon ring (fill with even-odd). */
  areaPath: string;
  /** Path data of every line. */
  linePath: string;
  points: SketchPoint[];
  /** Positions drawn on the map (inside the frame). */
  placed: PlacedPosition[];
  /** Ids of positions too far from the unit to draw. */
  offMap: number[];
}

export interface ExtraPosition {
  id: number;
  /** [lon, lat] */
  position: [number, number];
}

/** Half the frame (degrees of latitude) around a unit that is a single point: about 110 m. */
const POINT_HALF_SPAN_DEG = 0.001;
/** Photo positions more than this many unit spans from the unit's centre are not drawn. */
const EXTRA_REACH = 1.5;

function collect(geometry: Geometry): { rings: Position[][]; lines: Position[][]; points: Position[] } {
  switch (geometry.type) {
    case 'Polygon':
      return { rings: geometry.coordinates.filter((r) => r.length >= 3), lines: [], points: [] };
    case 'MultiPolygon':
      return { rings: geometry.coordinates.flat().filter((r) => r.length >= 3), lines: [], points: [] };
    case 'LineString':
      return { rings: [], lines: geometry.coordinates.length >= 2 ? [geometry.coordinates] : [], points: [] };
    case 'MultiLineString':
      return { rings: [], lines: geometry.coordinates.filter((l) => l.length >= 2), points: [] };
    case 'Point':
      return { rings: [], lines: [], points: [geometry.coordinates] };
    case 'MultiPoint':
      return { rings: [], lines: [], points: geometry.coordinates };
    case 'GeometryCollection': {
      const parts = geometry.geometries.map(collect);
      return { rings: parts.flatMap((p) => p.rings), lines: parts.flatMap((p) => p.lines), points: parts.flatMap((p) => p.points) };
    }
  }
}

/** Projects a unit (and photo positions near it) into a `widthPx`×`heightPx` box with north up; null when there is nothing to draw. */
export function sketchUnit(geometry: Geometry | null, widthPx: number, heightPx: number, extras: readonly ExtraPosition[] = [], paddingPx = 16): UnitSketch | null {
  if (!geometry) return null;
  const { rings, lines, points } = collect(geometry);
  const all = [...rings.flat(), ...lines.flat(), ...points].filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1]));
  if (all.length === 0) return null;
  const lats = all.map((p) => p[1]);
  const lons = all.map((p) => p[0]);
  let [minLat, maxLat, minLon, maxLon] = [Math.min(...lats), Math.max(...lats), Math.min(...lons), Math.max(...lons)];
  const midLat = (minLat + maxLat) / 2;
  const k = Math.cos((midLat * Math.PI) / 180);
  if (maxLat - minLat < 1e-9 && maxLon - minLon < 1e-9) {
    minLat -= POINT_HALF_SPAN_DEG;
    maxLat += POINT_HALF_SPAN_DEG;
    minLon -= POINT_HALF_SPAN_DEG / k;
    maxLon += POINT_HALF_SPAN_DEG / k;
  }
  // Photos near the unit widen the frame; those far away are only counted.
  const spanLat = maxLat - minLat;
  const spanLon = maxLon - minLon;
  const centre = [(minLon + maxLon) / 2, (minLat + maxLat) / 2];
  const near: ExtraPosition[] = [];
  const offMap: number[] = [];
  for (const e of extras) {
    const [lon, lat] = e.position;
    const ok = Number.isFinite(lon) && Number.isFinite(lat) && Math.abs(lon - centre[0]) <= spanLon * (0.5 + EXTRA_REACH) && Math.abs(lat - centre[1]) <= spanLat * (0.5 + EXTRA_REACH);
    if (ok) near.push(e);
    else offMap.push(e.id);
  }
  for (const e of near) {
    minLon = Math.min(minLon, e.position[0]);
    maxLon = Math.max(maxLon, e.position[0]);
    minLat = Math.min(minLat, e.position[1]);
    maxLat = Math.max(maxLat, e.position[1]);
  }
  const spanX = (maxLon - minLon) * k;
  const spanY = maxLat - minLat;
  const innerW = widthPx - 2 * paddingPx;
  const innerH = heightPx - 2 * paddingPx;
  const scale = Math.min(spanX > 0 ? innerW / spanX : Infinity, spanY > 0 ? innerH / spanY : Infinity);
  const offsetX = paddingPx + (innerW - spanX * scale) / 2;
  const offsetY = paddingPx + (innerH - spanY * scale) / 2;
  const r = (n: number) => Math.round(n * 10) / 10;
  const project = ([lon, lat]: Position): SketchPoint => ({ x: r(offsetX + (lon - minLon) * k * scale), y: r(offsetY + (maxLat - lat) * scale) });
  const pathOf = (list: Position[][], close: boolean) =>
    list.map((line) => line.map((p, i) => `${i === 0 ? 'M' : 'L'}${project(p).x} ${project(p).y}`).join('') + (close ? 'Z' : '')).join('');
  return {
    width: widthPx,
    height: heightPx,
    areaPath: pathOf(rings, true),
    linePath: pathOf(lines, false),
    points: points.map(project),
    placed: near.map((e) => ({ id: e.id, ...project(e.position) })),
    offMap,
  };
}

/**
 * The link that opens a place in the phone's maps app: a geo URI (RFC 5870, section 3.3:
 * "geo:" latitude "," longitude, WGS 84), six decimals (about 0.1 m). Null without a position.
 */
export function geoUri(location: [number, number] | null, label?: string): string | null {
  if (!location) return null;
  const [lon, lat] = location;
  if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) return null;
  const fix = (n: number) => String(Math.round(n * 1e6) / 1e6);
  // Android's maps apps read a "q" query with the same point and a label; other apps ignore it.
  const query = label ? `?q=${fix(lat)},${fix(lon)}(${encodeURIComponent(label)})` : '';
  return `geo:${fix(lat)},${fix(lon)}${query}`;
}
