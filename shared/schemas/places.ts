import { z } from 'zod';

/** `GET /api/places?q=`: what the map's search box sends. */
export const PlaceQuerySchema = z.object({
  q: z.string({ message: 'send one search text in q' }).max(200, { message: 'the search text is too long: type at most 200 characters, such as “Crawford County, WI”' }),
});

export const PlaceSchema = z.object({
  name: z.string(),
  kind: z.enum(['county', 'town', 'coordinates']),
  /** [longitude, latitude] */
  center: z.tuple([z.number(), z.number()]),
  /** [west, south, east, north], for counties */
  bbox: z.tuple([z.number(), z.number(), z.number(), z.number()]).optional(),
});
export type PlaceDto = z.infer<typeof PlaceSchema>;

/**
 * The sign-up page's place search (`GET /api/signup/places?q=`, public): how many searches one
 * address may make in the window. A person picking a home area types a few dozen; common practice, no source.
 */
export const PUBLIC_PLACE_SEARCH_LIMIT = { max: 120, windowMs: 10 * 60 * 1000 } as const;
