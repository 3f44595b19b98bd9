/** Saves a property's boundary as a MultiPolygon with its acres computed on the server. */
import type { MultiPolygon, Polygon } from 'geojson';
import { area } from '@turf/turf';
import { sqMetresToAcres } from '../../shared/units';

/** A Polygon wrapped as a MultiPolygon (the column's type). */
export function asMultiPolygon(geom: Polygon | MultiPolygon): MultiPolygon {
  return geom.type === 'MultiPolygon' ? geom : { type: 'MultiPolygon', coordinates: [geom.coordinates] };
}

/** Acres of a boundary, rounded to the thousandth stored in the database. */
export function boundaryAcres(geom: Polygon | MultiPolygon): number {
  return Math.round(sqMetresToAcres(area(geom)) * 1000) / 1000;
}
