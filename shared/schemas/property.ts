import { z } from 'zod';
import type { MultiPolygon } from 'geojson';
import { LIMITS } from '../limits';
import { optionalText, IdSchema, PageQuerySchema } from './common';
import { BoundarySchema } from './geometry';

import { REGIONS } from '../domain/planting-windows';

export { REGIONS };
export type { Region } from '../domain/planting-windows';

export const PropertyCreateSchema = z.object({
  clientId: IdSchema,
  name: z.string().trim().min(1, { message: 'enter a name for the property' }).max(LIMITS.nameMax),
  county: optionalText(80),
  state: optionalText(40),
  region: z.enum(REGIONS).nullish(),
  objectives: optionalText(LIMITS.textMax),
  notes: optionalText(LIMITS.textMax),
  boundary: BoundarySchema.nullish(),
  /** Keeps a boundary larger than the firm's large-area threshold (otherwise 422). */
  confirmLargeArea: z.boolean().optional(),
});
export type PropertyCreateInput = z.infer<typeof PropertyCreateSchema>;

export const PropertyUpdateSchema = PropertyCreateSchema.omit({ clientId: true }).partial().extend({
  clientId: IdSchema.optional(),
});
export type PropertyUpdateInput = z.infer<typeof PropertyUpdateSchema>;

export const PropertyListQuerySchema = z
  .object({
    clientId: IdSchema.optional(),
    q: z.string().trim().max(100).optional(),
  })
  .extend(PageQuerySchema.shape);

/** A property as the API answers it; acres and perimeter are computed on the server. */
export const PropertySchema = z.object({
  id: z.number().int(),
  clientId: z.number().int(),
  clientName: z.string(),
  name: z.string(),
  county: z.string().nullable(),
  state: z.string().nullable(),
  region: z.string().nullable(),
  objectives: z.string().nullable(),
  notes: z.string().nullable(),
  boundary: z.custom<MultiPolygon>().nullable(),
  acres: z.number().nullable(),
  hectares: z.number().nullable(),
  perimeterFt: z.number().nullable(),
  revision: z.number().int(),
  unitCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type PropertyDto = z.infer<typeof PropertySchema>;
