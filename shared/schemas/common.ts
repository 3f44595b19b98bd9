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

/** Rows a list answers when the address does not say, and the most it answers at once. */
export const LIST_PAGE = { defaultLimit: 500, maxLimit: 2000 } as const;

/** Paging of a list: `limit` rows from `offset` (query strings, so numbers are coerced). */
export const PageQuerySchema = z.object({
  limit: z.coerce
    .number()
    .int({ message: 'limit must be a whole number' })
    .min(1, { message: 'limit must be at least 1' })
    .max(LIST_PAGE.maxLimit, { message: `limit must be at most ${LIST_PAGE.maxLimit}` })
    .default(LIST_PAGE.defaultLimit),
  offset: z.coerce.number().int({ message: 'offset must be a whole number' }).min(0, { message: 'offset must be zero or more' }).max(1_000_000).default(0),
});
export type PageQuery = z.infer<typeof PageQuerySchema>;

/** Where a list answer sits in the whole: `total` rows match; this answer holds `limit` from `offset`. */
export interface PageDto {
  total: number;
  limit: number;
  offset: number;
}

/** The paging record of an answer. */
export const pageOf = (query: PageQuery, total: number): PageDto => ({ total, limit: query.limit, offset: query.offset });
