/**
 * The one centroid of the product (CSV export, sun times of a property, a stand's watched unit, the
 * plan map's detail): area-weighted for polygons — holes subtract, every part of a MultiPolygon
 * counts by its area — and computed on an equal-area map (the sinusoidal projection about the
 * shape's first vertex), so each piece weighs by its true area at any latitude. Lines and points
 * keep turf's centroid (the mean of their vertices).
 *
 * turf's `centerOfMass` is not used for areas: it joins a polygon's rings into one (a hole adds
 * area instead of removing it) and takes the convex hull of a MultiPolygon.
 */
import { centroid as vertexMean } from '@turf/turf';
import type { Geometry, Position } from 'geojson';

const RAD = Math.PI / 180;

/** A position as longitude/latitude in degrees. */
export interface CentroidLonLat {
  lon: number;
  lat: number;
}

/**
 * Area-weighted centroid of polygons with holes (each polygon: outer ring, then holes; winding
 * does not matter). Null when there is no area (no rings, or rings of zero area).
 */
export function areaCentroid(polygons: readonly Position[][][]): CentroidLonLat | null {
  const origin = polygons[0]?.[0]?.[0];
  if (!origin) return null;
  const lon0 = origin[0]!;
  const lat0 = origin[1]!;
  // Sinusoidal projection (equal-area) about the first vertex, in degrees of latitude.
  const project = (p: Position): [number, number] => [(p[0]! - lon0) * Math.cos(p[1]! * RAD), p[1]! - lat0];
  let sumArea = 0;
  let sumX = 0;
  let sumY = 0;
  for (const rings of polygons) {
    rings.forEach((ring, i) => {
      const pts = ring.map(project);
      let a = 0;
      let cx = 0;
      let cy = 0;
      for (let k = 0; k < pts.length; k += 1) {
        const [x0, y0] = pts[k]!;
        const [x1, y1] = pts[(k + 1) % pts.length]!;
        const cross = x0 * y1 - x1 * y0;
        a += cross;
        cx += (x0 + x1) * cross;
        cy += (y0 + y1) * cross;
      }
      // Outer rings add and holes subtract, whatever their winding.
      const sign = (i === 0 ? 1 : -1) * Math.sign(a);
      sumArea += sign * a;
      sumX += sign * cx;
      sumY += sign * cy;
    });
  }
  if (sumArea === 0) return null;
  const x = sumX / (3 * sumArea);
  const lat = lat0 + sumY / (3 * sumArea);
  return { lon: lon0 + x / Math.cos(lat * RAD), lat };
}

/** The polygons of an area geometry (Polygon, MultiPolygon, or those inside a collection); empty for lines and points. */
function polygonsOf(geometry: Geometry): Position[][][] {
  if (geometry.type === 'Polygon') return [geometry.coordinates];
  if (geometry.type === 'MultiPolygon') return geometry.coordinates;
  if (geometry.type === 'GeometryCollection') return geometry.geometries.flatMap(polygonsOf);
  return [];
}

/** Centre of a geometry as lon/lat: the area-weighted centroid for areas (see {@link areaCentroid}), the vertex mean otherwise. */
export function centroidOf(geometry: Geometry): CentroidLonLat {
  if (geometry.type === 'Point') return { lon: geometry.coordinates[0]!, lat: geometry.coordinates[1]! };
  const area = areaCentroid(polygonsOf(geometry));
  if (area) return area;
  const [lon, lat] = vertexMean(geometry).geometry.coordinates;
  return { lon: lon!, lat: lat! };
}
