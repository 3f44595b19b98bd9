/**
 * The sign-up page's place search: the same counties, towns and typed coordinates as `GET /api/places`,
 * for a person who has no account yet and is picking the firm's home area. Public (open gazetteer data,
 * nothing of any firm) and rate-limited per address in the PostgreSQL store.
 */
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { defineRoutes } from '../middlewares/access';
import { PostgresRateLimitStore } from '../middlewares/rate-limit-store';
import { PUBLIC_PLACE_SEARCH_LIMIT } from '../../shared/schemas/places';
import { answerPlaceSearch } from '../services/places/place-search-answer';
import { tooManyRequests } from '../errors';

const r = defineRoutes('/signup/places');

const placeLimiter = rateLimit({
  windowMs: PUBLIC_PLACE_SEARCH_LIMIT.windowMs,
  limit: PUBLIC_PLACE_SEARCH_LIMIT.max,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  store: new PostgresRateLimitStore('signup-places:'),
  keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
  handler: (_req, _res, next) => next(tooManyRequests('Too many place searches from this address. Wait a few minutes, or skip the home area and set it later in Settings.')),
});

r.get('/', 'public', placeLimiter, (req, res) => {
  res.json(answerPlaceSearch(req.query));
});

export const signupPlacesRouter = r.router;
