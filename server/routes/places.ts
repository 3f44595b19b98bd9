/** Finding a place for the map: counties, towns and typed coordinates. */
import { defineRoutes } from '../middlewares/access';
import { PlaceQuerySchema } from '../../shared/schemas/places';
import { searchPlaces } from '../services/places/place-index';
import { badRequest } from '../errors';
import { describeZodError } from '../middlewares/error-handler';

const r = defineRoutes('/places');

r.get('/', 'signed-in', (req, res) => {
  const parsed = PlaceQuerySchema.safeParse(req.query);
  if (!parsed.success) throw badRequest(describeZodError(parsed.error).message);
  res.json({ data: searchPlaces(parsed.data.q) });
});

export const placesRouter = r.router;
