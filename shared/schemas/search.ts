import { z } from 'zod';

/** The longest search text the header search sends; longer is refused before any query runs. */
export const SEARCH_MAX_CHARS = 200;
/** Results in one answer, best first. */
export const SEARCH_MAX_RESULTS = 20;
/** Below this trigram word similarity a record is not a match (pg_trgm's scale, 0–1; common practice, no source). */
export const SEARCH_MIN_SIMILARITY = 0.4;

export const SEARCH_KINDS = ['client', 'property', 'proposal', 'invoice', 'contact'] as const;
export type SearchKind = (typeof SEARCH_KINDS)[number];

/** `GET /api/search?q=`: what the header search box sends. */
export const SearchQuerySchema = z.object({
  q: z
    .string({ message: 'send one search text in q' })
    .max(SEARCH_MAX_CHARS, { message: `the search text is too long: type at most ${SEARCH_MAX_CHARS} characters, such as a client’s name or an invoice number` }),
});

export const SearchResultSchema = z.object({
  kind: z.enum(SEARCH_KINDS),
  id: z.number().int(),
  label: z.string(),
  sublabel: z.string().optional(),
  /** The page of the record in the consultant's app. */
  href: z.string(),
});
export type SearchResultDto = z.infer<typeof SearchResultSchema>;

export const SearchAnswerSchema = z.object({ data: z.array(SearchResultSchema) });

/**
 * The search text as the database sees it: control and format characters and lone surrogates
 * removed, runs of space folded to one, trimmed, lower case. Answers null when nothing searchable is
 * left (empty, only punctuation or symbols): the caller answers an empty list without a query.
 */
export function searchText(raw: string): string | null {
  const cleaned = raw
    .replace(/[\p{Cc}\p{Cf}\p{Cs}\p{Co}\p{Cn}]/gu, ' ')
    .replace(/\s+/g, ' ')
    .trim()
    .toLowerCase();
  return /[\p{L}\p{N}]/u.test(cleaned) ? cleaned : null;
}
