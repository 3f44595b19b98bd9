import { z } from 'zod';
import type { Geometry } from 'geojson';
import { UNIT_KINDS, type UnitKind } from '../domain/unit-kinds';
import { LIMITS } from '../limits';
import { optionalText } from './common';
import { UnitGeometrySchema } from './geometry';

export const UnitKindSchema = z.enum(UNIT_KINDS, { error: `kind must be one of: ${UNIT_KINDS.join(', ')}` });

export const UnitCreateSchema = z.object({
  kind: UnitKindSchema,
  name: z.string().trim().min(1, { message: 'give the unit a name, e.g. “North clover plot”' }).max(LIMITS.nameMax),
  notes: optionalText(LIMITS.textMax),
  geometry: UnitGeometrySchema,
  /** Keeps a unit larger than its property (or, with no boundary, than the firm's threshold); otherwise 422. */
  confirmLargeArea: z.boolean().optional(),
});
export type UnitCreateInput = z.infer<typeof UnitCreateSchema>;

export const UnitUpdateSchema = UnitCreateSchema.partial();
export type UnitUpdateInput = z.infer<typeof UnitUpdateSchema>;

/** Several units (and optionally the boundary) in one transaction, e.g. from an import. */
export const UnitBulkCreateSchema = z.object({
  units: z.array(UnitCreateSchema).max(2000),
  /** Confirms every large unit of the batch at once. */
  confirmLargeArea: z.boolean().optional(),
});
export type UnitBulkCreateInput = z.infer<typeof UnitBulkCreateSchema>;

/** A unit as the API answers it: acres for areas, lengthFt for lines, computed on the server. */
export const UnitSchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  kind: UnitKindSchema,
  family: z.enum(['area', 'line', 'point']),
  name: z.string(),
  notes: z.string().nullable(),
  geometry: z.custom<Geometry>(),
  acres: z.number().nullable(),
  hectares: z.number().nullable(),
  perimeterFt: z.number().nullable(),
  lengthFt: z.number().nullable(),
  lengthMi: z.number().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type UnitDto = z.infer<typeof UnitSchema> & { kind: UnitKind };

export const PlanSummarySchema = z.object({
  propertyId: z.number().int(),
  revision: z.number().int(),
  boundaryAcres: z.number().nullable(),
  shareByKind: z.array(z.object({ kind: z.string(), label: z.string(), acres: z.number(), pctOfProperty: z.number() })),
  warnings: z.array(z.object({ code: z.string(), unitIds: z.array(z.number()), message: z.string(), acres: z.number().optional(), lengthFt: z.number().optional() })),
});
export type PlanSummary = z.infer<typeof PlanSummarySchema>;
