import { z } from 'zod';

/** The largest id a PostgreSQL INTEGER (SERIAL) column holds: 2^31 − 1 (PostgreSQL manual, numeric types). */
export const MAX_RECORD_ID = 2147483647;

/** A record id in a JSON body: a positive whole number that fits the database column. */
export const RecordIdSchema = z
  .number({ message: 'must be a record id (a positive whole number)' })
  .int({ message: 'must be a positive whole number' })
  .positive({ message: 'must be a positive whole number' })
  .max(MAX_RECORD_ID, { message: 'is not a record id' });

/**
 * A positive integer record id from a path, a query or a form: digits only, no sign, no leading
 * zero, no spaces, no 0x/1e3 forms, not a boolean, and small enough for the database column.
 */
export const IdSchema = z
  .union([RecordIdSchema, z.string().regex(/^[1-9]\d{0,9}$/, { message: 'must be a positive whole number written with digits only' }).transform(Number)], {
    error: 'must be a positive whole number',
  })
  .pipe(RecordIdSchema);
export const IdParamsSchema = z.object({ id: IdSchema });

/** What a date control says when its date is missing or partial (it shows month/day/year, never YYYY-MM-DD). */
export const DATE_FIELD_MESSAGE = 'enter the whole date: month, day and year';

/** True when `v` (YYYY-MM-DD) is a day that exists on the calendar, in years 1–9999 (PostgreSQL has no year 0). */
export function isRealCalendarDate(v: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(v);
  if (!m) return false;
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (year < 1 || month < 1 || month > 12 || day < 1) return false;
  return day <= new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** A calendar date written YYYY-MM-DD that exists (no 2026-02-30, no 2025-02-29). */
export const IsoDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: DATE_FIELD_MESSAGE })
  .refine(isRealCalendarDate, { message: 'is not a real calendar date' });

/** Lone UTF-16 surrogates: halves of a character that cannot be stored or sent as UTF-8. */
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
/** The smallest normal double (IEEE 754); anything nearer zero is a denormal no column stores. */
const MIN_NORMAL = 2.2250738585072014e-308;

/** Why a text cannot be stored (NUL or a broken character), or null when it can. */
export function unstorableTextReason(v: string): string | null {
  if (v.includes('\u0000')) return 'contains a NUL character; remove it';
  if (LONE_SURROGATE.test(v)) return 'contains a broken character (half of a UTF-16 pair); type or paste it again';
  return null;
}

/** Why a number cannot be stored (not finite, or a denormal such as 5e-324), or null when it can. */
export function unstorableNumberReason(v: number): string | null {
  if (!Number.isFinite(v)) return 'must be a finite number';
  if (v !== 0 && Math.abs(v) < MIN_NORMAL) return 'is too close to zero to store; write 0 or a larger number';
  return null;
}

/**
 * The first value anywhere in a parsed request (body, query or params) that no column can store,
 * with its path: text with NUL or lone surrogates, denormal or non-finite numbers. Null when none.
 */
export function findUnstorableValue(value: unknown, path: (string | number)[] = [], depth = 0): { path: (string | number)[]; message: string } | null {
  if (typeof value === 'string') {
    const message = unstorableTextReason(value);
    return message ? { path, message } : null;
  }
  if (typeof value === 'number') {
    const message = unstorableNumberReason(value);
    return message ? { path, message } : null;
  }
  if (depth > 64 || value === null || typeof value !== 'object') return null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = findUnstorableValue(value[i], [...path, i], depth + 1);
      if (found) return found;
    }
    return null;
  }
  if (isBinary(value)) return null;
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
    const keyProblem = unstorableTextReason(k);
    if (keyProblem) return { path: [...path, k], message: `the field name ${keyProblem}` };
    const found = findUnstorableValue(v, [...path, k], depth + 1);
    if (found) return found;
  }
  return null;
}

/** Binary bodies (raw webhooks, files) are not text; shared code cannot import Buffer, so test by shape. */
function isBinary(v: object): boolean {
  return v instanceof Uint8Array;
}

/** A text field that refuses what cannot be stored (NUL, lone surrogates); `max` in characters. */
export const SafeTextSchema = (max: number) =>
  z
    .string()
    .max(max, { message: `must be at most ${max} characters` })
    .superRefine((v, ctx) => {
      const message = unstorableTextReason(v);
      if (message) ctx.addIssue({ code: 'custom', message });
    });

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
    .superRefine((v, ctx) => {
      const message = unstorableTextReason(v);
      if (message) ctx.addIssue({ code: 'custom', message });
    })
    .transform((v) => (v === '' ? null : v))
    .nullish();

/** Rows a list answers when the address does not say, and the most it answers at once. */
export const LIST_PAGE = { defaultLimit: 500, maxLimit: 2000 } as const;

/** Paging of a list: `limit` rows from `offset` (query strings, so numbers are coerced). */
/** A page's `limit` without its default (a list with a page size of its own adds one). */
export const PageLimitSchema = z.coerce
  .number()
  .int({ message: 'limit must be a whole number' })
  .min(1, { message: 'limit must be at least 1' })
  .max(LIST_PAGE.maxLimit, { message: `limit must be at most ${LIST_PAGE.maxLimit}` });

export const PageQuerySchema = z.object({
  limit: PageLimitSchema.default(LIST_PAGE.defaultLimit),
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
