/** The ellipsoidal reference: GeographicLib (Karney, "Algorithms for geodesics", J. Geodesy 87:43–55, 2013). */
import { createRequire } from 'node:module';
import type { Polygon, Position } from 'geojson';

const require = createRequire(import.meta.url);
// The bundle hides its named exports from Node's ESM loader; load it through require.
const { Geodesic } = require('geographiclib-geodesic') as {
  Geodesic: { WGS84: { Polygon(polyline: boolean): { AddPoint(lat: number, lon: number): void; Compute(reverse: boolean, sign: boolean): { area: number; perimeter: number } }; Inverse(lat1: number, lon1: number, lat2: number, lon2: number): { s12: number } } };
};

/** Area in m² of a polygon's outer ring on the WGS84 ellipsoid. */
export function ellipsoidalAreaSqM(polygon: Polygon): number {
  const p = Geodesic.WGS84.Polygon(false);
  const ring = polygon.coordinates[0];
  for (const [lon, lat] of ring.slice(0, -1)) p.AddPoint(lat, lon);
  return Math.abs(p.Compute(false, true).area);
}

/** Length in metres of a polyline on the WGS84 ellipsoid. */
export function ellipsoidalLengthM(line: Position[]): number {
  let total = 0;
  for (let i = 1; i < line.length; i++) total += Geodesic.WGS84.Inverse(line[i - 1][1], line[i - 1][0], line[i][1], line[i][0]).s12;
  return total;
}

/** A rectangle of the given size in metres, south-west corner at lon/lat (degree math at that latitude). */
export function rectangle(lon: number, lat: number, widthM: number, heightM: number): Polygon {
  const dLat = heightM / 111_132;
  const dLon = widthM / (111_320 * Math.cos((lat * Math.PI) / 180));
  return { type: 'Polygon', coordinates: [[[lon, lat], [lon + dLon, lat], [lon + dLon, lat + dLat], [lon, lat + dLat], [lon, lat]]] };
}
