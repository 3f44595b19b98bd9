import { z } from 'zod';

/** A positive integer record id from a path or query string. */
export const IdSchema = z.coerce.number().int().positive({ message: 'must be a positive whole number' });
export const IdParamsSchema = z.object({ id: IdSchema });

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
