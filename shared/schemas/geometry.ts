/** GeoJSON geometry schemas (RFC 7946, WGS84 lon/lat) with the structural checks a consultant can act on. */
import { z } from 'zod';
import type { Geometry, LineString, MultiLineString, MultiPolygon, Point, Polygon } from 'geojson';
import { findGeometryProblems } from '../domain/geometry-problems';
import { GEOMETRY_LIMITS } from '../limits';

/**
 * A position [longitude, latitude] or [longitude, latitude, altitude]. The altitude (which GPS units
 * and KML tools often add) is dropped here, for every geometry the API accepts, as imports already
 * do: the plan is flat and the database columns are two-dimensional.
 */
const position = z
  .array(z.number({ message: 'coordinates must be numbers' }))
  .min(2, { message: 'a position needs a longitude and a latitude' })
  .max(3, { message: 'a position is a longitude, a latitude and at most an altitude' })
  .transform((p) => (p.length > 2 ? p.slice(0, 2) : p));

const point = z.object({ type: z.literal('Point'), coordinates: position });
const multiPoint = z.object({ type: z.literal('MultiPoint'), coordinates: z.array(position) });
const lineString = z.object({ type: z.literal('LineString'), coordinates: z.array(position) });
const multiLineString = z.object({ type: z.literal('MultiLineString'), coordinates: z.array(z.array(position)) });
const polygon = z.object({ type: z.literal('Polygon'), coordinates: z.array(z.array(position)) });
const multiPolygon = z.object({ type: z.literal('MultiPolygon'), coordinates: z.array(z.array(z.array(position))) });

/** Adds every structural problem (ranges, closure, crossings, vertex cap) as a zod issue at its path. */
function checked<T extends z.ZodType<Geometry>>(schema: T, maxVertices: number) {
  return schema.superRefine((geom, ctx) => {
    for (const problem of findGeometryProblems(geom as Geometry, { maxVertices, crossingCheckMaxVertices: GEOMETRY_LIMITS.crossingCheckMaxVertices })) {
      ctx.addIssue({ code: 'custom', message: problem.message, path: problem.path, params: { code: problem.code, where: problem.where } });
    }
  });
}

const geometryUnion = z.discriminatedUnion('type', [point, multiPoint, lineString, multiLineString, polygon, multiPolygon], {
  error: 'geometry must be a GeoJSON Point, LineString, Polygon or their Multi- forms',
});

/** Any unit geometry. */
export const UnitGeometrySchema = checked(geometryUnion as unknown as z.ZodType<Geometry>, GEOMETRY_LIMITS.unitMaxVertices);

/** A property boundary: Polygon or MultiPolygon. */
export const BoundarySchema = checked(
  z.discriminatedUnion('type', [polygon, multiPolygon], { error: 'the boundary must be a GeoJSON Polygon or MultiPolygon' }) as unknown as z.ZodType<Polygon | MultiPolygon>,
  GEOMETRY_LIMITS.boundaryMaxVertices,
);

export type AnyUnitGeometry = Point | LineString | MultiLineString | Polygon | MultiPolygon;
