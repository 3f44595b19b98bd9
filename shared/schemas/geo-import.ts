/** The import preview (what POST /api/properties/:id/imports answers) and the query for full geometries. */
import { z } from 'zod';
import type { Geometry } from 'geojson';
import type { KindFamily, UnitKind } from '../domain/unit-kinds';

/** One feature found in an uploaded file, as the preview lists it: a simplified outline, not the full shape. */
export interface ImportPreviewFeatureDto {
  /** Position of this feature in the preview's list; the key for fetching its full geometry. */
  item: number;
  /** Position of the source feature in the file. */
  index: number;
  part?: number;
  name: string;
  family: KindFamily;
  kind?: UnitKind;
  /** A simplified outline for drawing the preview (the full geometry stays on the server until saved). */
  geometry: Geometry;
  /** Corners and track points of the full geometry. */
  vertexCount: number;
  /** Measured on the full geometry: acres of an area, feet of a line. */
  acres?: number;
  lengthFt?: number;
  notes: string[];
  /** Set on an open line whose ends lie within GEOMETRY_LIMITS.trackCloseMaxGapM: it may become an area. */
  closableGapM?: number;
}

/** What POST /api/properties/:id/imports answers: counts, names and outlines; nothing is saved yet. */
export interface ImportPreviewDto {
  /** The stored import, to fetch full geometries of the chosen features. */
  importId: string;
  format: string;
  counts: { features: number; skipped: number; area: number; line: number; point: number; vertices: number };
  features: ImportPreviewFeatureDto[];
  skipped: { index: number; part?: number; name?: string; reason: string }[];
  warnings: string[];
}

/** GET /api/properties/:id/imports/:importId/features?items=0,3,7 — the full geometries of the chosen features. */
export const ImportFeaturesQuerySchema = z.object({
  items: z
    .string()
    .trim()
    .regex(/^\d{1,6}(,\d{1,6})*$/, 'list the feature numbers separated by commas, e.g. 0,3,7')
    .transform((s) => [...new Set(s.split(',').map(Number))])
    .refine((items) => items.length <= 5_000, 'ask for at most 5,000 features at a time'),
});

/** The formats a plan exports to (GET /api/properties/:id/export?format=…). */
export const GEO_EXPORT_FORMATS = ['geojson', 'kml', 'gpx', 'csv'] as const;
export type GeoExportFormat = (typeof GEO_EXPORT_FORMATS)[number];

/** GET /api/properties/:id/export?format=kml — one of GEO_EXPORT_FORMATS. */
export const PlanExportQuerySchema = z.object({
  format: z
    .string()
    .refine((value): value is GeoExportFormat => (GEO_EXPORT_FORMATS as readonly string[]).includes(value), { message: `choose one of ${GEO_EXPORT_FORMATS.join(', ')}` })
    .transform((value) => value as GeoExportFormat),
});

export const ImportParamsSchema = z.object({
  id: z.coerce.number().int().positive(),
  importId: z.string().uuid('that import id is not valid'),
});

/** One full feature of a stored import. */
export interface ImportFullFeatureDto {
  item: number;
  geometry: Geometry;
}
