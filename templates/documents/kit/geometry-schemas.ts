/** The GeoJSON shapes a document's input may carry, checked before a page is laid out. */
import type { Geometry, MultiPolygon, Polygon } from 'geojson';
import { z } from 'zod';

/** Any GeoJSON geometry (a unit's line, point or area). */
export const GeometrySchema = z.custom<Geometry>(
  (v) => typeof v === 'object' && v !== null && typeof (v as { type?: unknown }).type === 'string',
  { message: 'must be a GeoJSON geometry' },
);

/** An area: a property boundary or an area unit. */
export const AreaGeometrySchema = z.custom<Polygon | MultiPolygon>(
  (v) => typeof v === 'object' && v !== null && ['Polygon', 'MultiPolygon'].includes((v as { type?: string }).type ?? ''),
  { message: 'must be a GeoJSON Polygon or MultiPolygon' },
);
