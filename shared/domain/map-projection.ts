/**
 * The one projection and sketch module of the product: the plan map in the PDFs, the field sheet's
 * small map of a unit and the property page's boundary preview all draw through it.
 *
 * Longitude/latitude first go to a local plane in metres about the drawing's centre, with the WGS84
 * radii of curvature at the centre latitude (metres per degree of latitude from the meridian radius
 * M, of longitude from N·cos(latitude); Snyder 1987, USGS Professional Paper 1395, ch. 4) — a local
 * equirectangular projection, north up, one scale on both axes. Over a property (a few miles at
 * most) its scale error stays under about 0.1 %: it grows with tan(latitude) times the north-south
 * distance from the centre. It is not meant for areas much larger than a county, nor for shapes
 * across the antimeridian.
 *
 * d3-geo then fits that plane into the box (`geoIdentity().reflectY(true).fitExtent`: y flips so
 * north is up on screen, the extent is centred with the padding on every side) and writes SVG path
 * data (`geoPath`). The plane is planar, so d3 never reads ring winding as it does on the sphere
 * (where a ring wound the "wrong" way stands for the whole globe outside it): every ring, outer or
 * hole, is drawn as given, and a hole stays a hole when the path is filled with fill-rule evenodd.
 */
import { geoIdentity, geoPath, geoTransform, type GeoStream } from 'd3-geo';
import type { BBox, Geometry, Position } from 'geojson';

// WGS84 defining constants (NIMA TR8350.2): semi-major axis and flattening.
const WGS84_A_M = 6378137;
const WGS84_F = 1 / 298.257223563;
const WGS84_E2 = WGS84_F * (2 - WGS84_F);
const DEG = Math.PI / 180;

/** A rectangle of the drawing, y downwards (SVG, PDF page and screen space). */
export interface DrawingBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Ground metres in one degree of longitude and of latitude at a latitude, on the WGS84 ellipsoid. */
export function metresPerDegree(latDeg: number): { lon: number; lat: number } {
  const sinLat = Math.sin(latDeg * DEG);
  const w = 1 - WGS84_E2 * sinLat * sinLat;
  const meridianRadiusM = (WGS84_A_M * (1 - WGS84_E2)) / w ** 1.5;
  const primeVerticalRadiusM = WGS84_A_M / Math.sqrt(w);
  return { lon: primeVerticalRadiusM * Math.cos(latDeg * DEG) * DEG, lat: meridianRadiusM * DEG };
}

export interface FitOptions {
  /** Room left empty on every side of the box, in drawing units. */
  padding?: number;
  /** The extent is widened to at least this many metres on each axis (a point or a sliver still gets a map). */
  minSpanM?: number;
  /** Decimals of the coordinates in path data. */
  digits?: number;
}

/** A projection fitted to a box: lon/lat to drawing units and back, and SVG path data of geometries. */
export interface FittedProjection {
  /** Centre of the projection, degrees (the centre of the fitted extent; it lands in the box's centre). */
  lon0: number;
  lat0: number;
  /** Drawing units per metre of ground, the same on both axes. */
  unitsPerMetre: number;
  metresPerDegLon: number;
  metresPerDegLat: number;
  /** Longitude/latitude (degrees) to drawing [x, y]. */
  project(lon: number, lat: number): [number, number];
  /** Drawing [x, y] back to [longitude, latitude] in degrees. */
  invert(x: number, y: number): [number, number];
  /**
   * SVG path data of a geometry's polygons and lines: each ring a closed "M…Z" subpath (holes
   * included; fill with fill-rule evenodd), each line an open one. Points are left out (draw them
   * from `project`). Empty string when there is nothing to draw.
   */
  path(geometry: Geometry): string;
}

/** [west, south, east, north] of positions, or null when there are none with finite numbers. */
export function extentOfPositions(positions: Iterable<Position>): BBox | null {
  let west = Infinity;
  let south = Infinity;
  let east = -Infinity;
  let north = -Infinity;
  for (const [lon, lat] of positions) {
    if (!Number.isFinite(lon) || !Number.isFinite(lat)) continue;
    west = Math.min(west, lon!);
    east = Math.max(east, lon!);
    south = Math.min(south, lat!);
    north = Math.max(north, lat!);
  }
  return Number.isFinite(west) ? [west, south, east, north] : null;
}

/** Every position of a geometry (all rings, lines and points, inside collections too). */
export function* positionsOf(geometry: Geometry): Iterable<Position> {
  switch (geometry.type) {
    case 'Point':
      yield geometry.coordinates;
      return;
    case 'MultiPoint':
    case 'LineString':
      yield* geometry.coordinates;
      return;
    case 'MultiLineString':
    case 'Polygon':
      for (const part of geometry.coordinates) yield* part;
      return;
    case 'MultiPolygon':
      for (const rings of geometry.coordinates) for (const ring of rings) yield* ring;
      return;
    case 'GeometryCollection':
      for (const g of geometry.geometries) yield* positionsOf(g);
  }
}

/**
 * The projection that fits the extent [west, south, east, north] (degrees) into `box`, centred,
 * leaving at least `padding` on every side. Throws a RangeError when the box is smaller than its
 * padding, or when the extent has no size on either axis and no `minSpanM` widens it.
 */
export function fitProjection(extent: BBox, box: DrawingBox, options: FitOptions = {}): FittedProjection {
  const { padding = 0, minSpanM = 0, digits = 2 } = options;
  const [west, south, east, north] = extent.length === 6 ? [extent[0], extent[1], extent[3], extent[4]] : extent;
  const inner = { x0: box.x + padding, y0: box.y + padding, x1: box.x + box.width - padding, y1: box.y + box.height - padding };
  if (!(inner.x1 > inner.x0 && inner.y1 > inner.y0)) throw new RangeError('The drawing box is smaller than its padding.');
  const lon0 = (west + east) / 2;
  const lat0 = (south + north) / 2;
  const perDeg = metresPerDegree(lat0);
  const halfX = Math.max((east - west) * perDeg.lon, minSpanM) / 2;
  const halfY = Math.max((north - south) * perDeg.lat, minSpanM) / 2;
  if (!(halfX > 0 || halfY > 0)) throw new RangeError('The extent has no size to fit; give a minimum span.');

  // Ground metres east and north of the centre.
  const toPlane = (lon: number, lat: number): [number, number] => [(lon - lon0) * perDeg.lon, (lat - lat0) * perDeg.lat];
  const screen = geoIdentity()
    .reflectY(true)
    .fitExtent(
      [
        [inner.x0, inner.y0],
        [inner.x1, inner.y1],
      ],
      { type: 'MultiPoint', coordinates: [[-halfX, -halfY], [halfX, halfY]] },
    );
  const plane = geoTransform({
    point(this: { stream: GeoStream }, lon: number, lat: number) {
      const [x, y] = toPlane(lon, lat);
      this.stream.point(x, y);
    },
  });
  const drawer = geoPath({ stream: (output: GeoStream) => plane.stream(screen.stream(output)) }).digits(digits);
  const noPoints: Geometry['type'][] = ['Point', 'MultiPoint'];

  return {
    lon0,
    lat0,
    unitsPerMetre: screen.scale(),
    metresPerDegLon: perDeg.lon,
    metresPerDegLat: perDeg.lat,
    project: (lon, lat) => screen(toPlane(lon, lat)) as [number, number],
    invert: (x, y) => {
      const [ex, ny] = screen.invert!([x, y]) as [number, number];
      return [lon0 + ex / perDeg.lon, lat0 + ny / perDeg.lat];
    },
    path: (geometry) => {
      const drawn = geometry.type === 'GeometryCollection' ? { ...geometry, geometries: geometry.geometries.filter((g) => !noPoints.includes(g.type)) } : geometry;
      if (noPoints.includes(drawn.type)) return '';
      return drawer(drawn) ?? '';
    },
  };
}
