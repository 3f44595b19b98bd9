/**
 * The import preview: counts, names, measures and simplified outlines of what a file holds, small
 * enough to send at once (the full geometries are stored and fetched only for the features saved).
 */
import type { Geometry, Position } from 'geojson';
import { measureArea, measureLine } from '../../../shared/domain/geometry';
import type { ImportPreviewDto, ImportPreviewFeatureDto } from '../../../shared/schemas/geo-import';
import { GEOMETRY_LIMITS } from '../../../shared/limits';
import type { GeoFileReadResult, ImportedFeature, PlanGeometry } from './types';

/** Most vertices all the preview's outlines may hold together; longer lines and rings are thinned to fit. */
export const PREVIEW_VERTEX_BUDGET = 20_000;
/** Most features the preview lists (a property holds at most this many units); the counts cover all. */
export const PREVIEW_MAX_FEATURES = GEOMETRY_LIMITS.unitsPerProperty;

function vertexCount(geometry: PlanGeometry): number {
  switch (geometry.type) {
    case 'Point':
      return 1;
    case 'LineString':
      return geometry.coordinates.length;
    case 'MultiLineString':
    case 'Polygon':
      return geometry.coordinates.reduce((n, l) => n + l.length, 0);
    case 'MultiPolygon':
      return geometry.coordinates.reduce((n, p) => n + p.reduce((m, r) => m + r.length, 0), 0);
  }
}

const round6 = (p: Position): Position => [Math.round(p[0] * 1e6) / 1e6, Math.round(p[1] * 1e6) / 1e6];

/** Every `step`-th position of a line or ring, always keeping the first and the last (a ring stays closed, ≥ 4). */
function thin(line: Position[], step: number, ring: boolean): Position[] {
  const min = ring ? 4 : 2;
  if (step <= 1 || line.length <= min * 2) return line.map(round6);
  const out: Position[] = [];
  for (let i = 0; i < line.length - 1; i += step) out.push(round6(line[i]));
  out.push(round6(line[line.length - 1]));
  if (out.length < min) return line.map(round6);
  return out;
}

/** The outline drawn in the preview: positions rounded to 6 decimals (about 0.1 m), long lines thinned by `step`. */
function outline(geometry: PlanGeometry, step: number): Geometry {
  switch (geometry.type) {
    case 'Point':
      return { type: 'Point', coordinates: round6(geometry.coordinates) };
    case 'LineString':
      return { type: 'LineString', coordinates: thin(geometry.coordinates, step, false) };
    case 'MultiLineString':
      return { type: 'MultiLineString', coordinates: geometry.coordinates.map((l) => thin(l, step, false)) };
    case 'Polygon':
      return { type: 'Polygon', coordinates: geometry.coordinates.map((r) => thin(r, step, true)) };
    case 'MultiPolygon':
      return { type: 'MultiPolygon', coordinates: geometry.coordinates.map((p) => p.map((r) => thin(r, step, true))) };
  }
}

function measures(feature: ImportedFeature): { acres?: number; lengthFt?: number } {
  try {
    const g = feature.geometry;
    if (g.type === 'Polygon' || g.type === 'MultiPolygon') return { acres: Math.round(measureArea(g).acres * 100) / 100 };
    if (g.type === 'LineString' || g.type === 'MultiLineString') return { lengthFt: Math.round(measureLine(g).lengthFt) };
  } catch {
    /* listed without a measure */
  }
  return {};
}

/**
 * The compact preview of a read file, for the stored import `importId`: counts of everything, and
 * the first PREVIEW_MAX_FEATURES features with names, measures and thinned outlines.
 */
export function buildImportPreview(result: GeoFileReadResult, importId: string): ImportPreviewDto {
  const counts = { features: result.features.length, skipped: result.skipped.length, area: 0, line: 0, point: 0, vertices: 0 };
  const sizes = result.features.map((f) => vertexCount(f.geometry));
  for (const [i, f] of result.features.entries()) {
    counts[f.family] += 1;
    counts.vertices += sizes[i];
  }
  const listed = result.features.slice(0, PREVIEW_MAX_FEATURES);
  const listedVertices = sizes.slice(0, listed.length).reduce((a, b) => a + b, 0);
  const step = Math.max(1, Math.ceil(listedVertices / PREVIEW_VERTEX_BUDGET));
  const features: ImportPreviewFeatureDto[] = listed.map((f, item) => ({
    item,
    index: f.index,
    ...(f.part !== undefined ? { part: f.part } : {}),
    name: f.name,
    family: f.family,
    ...(f.kind ? { kind: f.kind } : {}),
    geometry: outline(f.geometry, step),
    vertexCount: sizes[item],
    ...measures(f),
    notes: f.notes,
    ...(f.closableGapM !== undefined ? { closableGapM: f.closableGapM } : {}),
  }));
  const warnings = [...result.warnings];
  if (result.features.length > listed.length) {
    warnings.push(
      `This file holds ${result.features.length.toLocaleString('en-US')} features; the preview lists the first ${listed.length.toLocaleString('en-US')}, ` +
        'as many as one property can hold. Split the file to import the rest.',
    );
  }
  return { importId, format: result.format, counts, features, skipped: result.skipped.slice(0, PREVIEW_MAX_FEATURES), warnings };
}
