/**
 * The task page's small map of a unit, drawn without tiles so it works with no signal: the unit's
 * geometry projected into a box through the shared map projection (shared/domain/map-projection.ts:
 * north up, one scale on both axes), plus dots for photo positions.
 */
import type { Geometry, Position } from 'geojson';
import { fitProjection, metresPerDegree } from '../../../../shared/domain/map-projection';

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
  // Ground length of a degree of longitude over that of a degree of latitude.
  const perDeg = metresPerDegree(midLat);
  const k = perDeg.lon / perDeg.lat;
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
  const projection = fitProjection([minLon, minLat, maxLon, maxLat], { x: 0, y: 0, width: widthPx, height: heightPx }, { padding: paddingPx, digits: 1 });
  const r = (n: number) => Math.round(n * 10) / 10;
  const project = ([lon, lat]: Position): SketchPoint => {
    const [x, y] = projection.project(lon!, lat!);
    return { x: r(x), y: r(y) };
  };
  return {
    width: widthPx,
    height: heightPx,
    areaPath: rings.length > 0 ? projection.path({ type: 'Polygon', coordinates: rings }) : '',
    linePath: lines.length > 0 ? projection.path({ type: 'MultiLineString', coordinates: lines }) : '',
    points: points.map(project),
    placed: near.map((e) => ({ id: e.id, ...project(e.position) })),
    offMap,
  };
}

export { geoUri } from './geo-uri';
