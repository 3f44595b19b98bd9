/**
 * The one answer of both place searches, `GET /api/places` (signed in) and `GET /api/signup/places`
 * (public, rate-limited): the query read through the shared schema, then the gazetteer's matches.
 */
import { PlaceQuerySchema } from '../../../shared/schemas/places';
import type { Place } from '../../../shared/domain/place-search';
import { searchPlaces } from './place-index';
import { badRequest } from '../../errors';
import { describeZodError } from '../../middlewares/error-handler';

/**
 * Reads a place-search query string (`?q=`) and answers `{ data: places }`, best match first.
 * A query the schema refuses (missing, repeated, over 200 characters) is a 400 with its sentence.
 */
export function answerPlaceSearch(query: unknown): { data: Place[] } {
  const parsed = PlaceQuerySchema.safeParse(query);
  if (!parsed.success) throw badRequest(describeZodError(parsed.error).message);
  return { data: searchPlaces(parsed.data.q) };
}
