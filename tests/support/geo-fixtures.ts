/**
 * Test shapes built on the WGS84 ellipsoid with GeographicLib (C. Karney, "Algorithms for
 * geodesics", J. Geodesy 87:43–55, 2013; npm geographiclib-geodesic 2.2.0), and the ellipsoidal
 * reference measures the unit tests compare turf against.
 */
import { createRequire } from 'node:module';
import type { LineString, MultiPolygon, Polygon, Position } from 'geojson';

// The package is a UMD bundle whose named exports Node's ESM loader cannot see: load it as CommonJS.
const require = createRequire(import.meta.url);
const geographiclib = require('geographiclib-geodesic') as typeof import('geographiclib-geodesic');

/** The WGS84 ellipsoid of GeographicLib. */
export const WGS84 = geographiclib.Geodesic.WGS84;
/** WGS84 semi-major axis and flattening as GeographicLib states them. */
export const WGS84_CONSTANTS = geographiclib.Constants.WGS84;
/** Turf's earth radius, metres (@turf/helpers `earthRadius`, the IUGG mean radius). */
export const TURF_EARTH_RADIUS_M = 6371008.8;

/** The point `distanceM` metres from (lat, lon) along the geodesic leaving at `azimuthDeg`. */
export function destination(lat: number, lon: number, azimuthDeg: number, distanceM: number): { lat: number; lon: number } {
  const r = WGS84.Direct(lat, lon, azimuthDeg, distanceM);
  return { lat: r.lat2!, lon: r.lon2! };
}

/**
 * A lat/lon-aligned rectangle centred at (lat, lon), `eastWestM` wide and `northSouthM` tall on the
 * ellipsoid, counter-clockwise from its south-west corner and closed.
 */
export function rectangleAt(lat: number, lon: number, eastWestM: number, northSouthM: number): Polygon {
  const north = destination(lat, lon, 0, northSouthM / 2).lat;
  const south = destination(lat, lon, 180, northSouthM / 2).lat;
  const halfLon = destination(lat, lon, 90, eastWestM / 2).lon - lon;
  const west = lon - halfLon;
  const east = lon + halfLon;
  return {
    type: 'Polygon',
    coordinates: [[[west, south], [east, south], [east, north], [west, north], [west, south]]],
  };
}

/** A square of side `sideM` metres centred at (lat, lon). */
export function squareAt(lat: number, lon: number, sideM: number): Polygon {
  return rectangleAt(lat, lon, sideM, sideM);
}

/** A square holding `acres` international acres (side √(acres × 4,046.8564224 m²)). */
export function squareOfAcres(lat: number, lon: number, acres: number): Polygon {
  return squareAt(lat, lon, Math.sqrt(acres * 4046.8564224));
}

/** The ring reversed (clockwise), as GeoJSON wants holes. */
export function reversedRing(ring: Position[]): Position[] {
  return [...ring].reverse();
}

/** Area of one ring on the WGS84 ellipsoid, m² (geodesic edges), always positive. */
export function ellipsoidRingAreaSqM(ring: Position[]): number {
  const poly = WGS84.Polygon(false);
  for (const [lon, lat] of ring.slice(0, -1)) poly.AddPoint(lat, lon);
  return Math.abs(poly.Compute(false, true).area!);
}

/** Area of a Polygon or MultiPolygon on the WGS84 ellipsoid, m²: outer rings minus holes. */
export function ellipsoidAreaSqM(geom: Polygon | MultiPolygon): number {
  const polygons = geom.type === 'Polygon' ? [geom.coordinates] : geom.coordinates;
  let total = 0;
  for (const rings of polygons) {
    rings.forEach((ring, i) => {
      total += (i === 0 ? 1 : -1) * ellipsoidRingAreaSqM(ring);
    });
  }
  return total;
}

/** Length of a LineString on the WGS84 ellipsoid, m (sum of geodesic inverse distances s12). */
export function ellipsoidLengthM(line: LineString): number {
  let total = 0;
  for (let i = 1; i < line.coordinates.length; i++) {
    const [lon1, lat1] = line.coordinates[i - 1];
    const [lon2, lat2] = line.coordinates[i];
    total += WGS84.Inverse(lat1, lon1, lat2, lon2).s12!;
  }
  return total;
}

/** A line from (lat, lon) `distanceM` metres along the geodesic at `azimuthDeg`. */
export function geodesicLine(lat: number, lon: number, azimuthDeg: number, distanceM: number): LineString {
  const end = destination(lat, lon, azimuthDeg, distanceM);
  return { type: 'LineString', coordinates: [[lon, lat], [end.lon, end.lat]] };
}

/**
 * A circle of radius `radiusM` with `steps` corners, built on turf's sphere (radius 6,371,008.8 m)
 * with the spherical direct formula, so it tests turf's area sum rather than the ellipsoid.
 */
export function sphereCircle(lat: number, lon: number, radiusM: number, steps: number): Polygon {
  const rad = Math.PI / 180;
  const phi1 = lat * rad;
  const lambda1 = lon * rad;
  const delta = radiusM / TURF_EARTH_RADIUS_M;
  const ring: Position[] = [];
  for (let i = 0; i < steps; i++) {
    const theta = (2 * Math.PI * i) / steps;
    const phi2 = Math.asin(Math.sin(phi1) * Math.cos(delta) + Math.cos(phi1) * Math.sin(delta) * Math.cos(theta));
    const lambda2 =
      lambda1 +
      Math.atan2(Math.sin(theta) * Math.sin(delta) * Math.cos(phi1), Math.cos(delta) - Math.sin(phi1) * Math.sin(phi2));
    ring.push([lambda2 / rad, phi2 / rad]);
  }
  ring.reverse(); // bearings run clockwise; GeoJSON outer rings are counter-clockwise
  ring.push(ring[0]);
  return { type: 'Polygon', coordinates: [ring] };
}

/**
 * Expected ratio of turf's spherical area to the ellipsoidal area for a small shape at `lat`:
 * R² / (M·N), with M and N the meridian and prime-vertical radii of curvature of WGS84
 * (Snyder 1987, "Map Projections — A Working Manual", USGS Professional Paper 1395, ch. 4).
 */
export function sphereToEllipsoidAreaRatio(lat: number): number {
  const { a, f } = WGS84_CONSTANTS;
  const e2 = f * (2 - f);
  const s2 = Math.sin((lat * Math.PI) / 180) ** 2;
  const w = 1 - e2 * s2;
  const m = (a * (1 - e2)) / w ** 1.5;
  const n = a / Math.sqrt(w);
  return (TURF_EARTH_RADIUS_M * TURF_EARTH_RADIUS_M) / (m * n);
}
