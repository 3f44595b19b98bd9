import { z } from 'zod';

/** A positive integer record id from a path or query string. */
export const IdSchema = z.coerce.number().int().positive({ message: 'must be a positive whole number' });
export const IdParamsSchema = z.object({ id: IdSchema });

/** What a date control says when its date is missing or partial (it shows month/day/year, never YYYY-MM-DD). */
export const DATE_FIELD_MESSAGE = 'enter the whole date: month, day and year';

/** A calendar date sent as YYYY-MM-DD that exists (no 2026-02-30). */
export const IsoDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: DATE_FIELD_MESSAGE })
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), { message: 'is not a real calendar date' });

/** The error answer of every API route. */
export const ApiErrorSchema = z.object({
  error: z.string(),
  code: z.string().optional(),
  details: z.unknown().optional(),
});
export type ApiError = z.infer<typeof ApiErrorSchema>;

/** Trims and turns an empty string into null, for optional text fields of forms. */
export const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, { message: `must be at most ${max} characters` })
    .transform((v) => (v === '' ? null : v))
    .nullish();
