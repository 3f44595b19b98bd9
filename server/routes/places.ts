/** Finding a place for the map: counties, towns and typed coordinates. */
import { defineRoutes } from '../middlewares/access';
import { answerPlaceSearch } from '../services/places/place-search-answer';

const r = defineRoutes('/places');

r.get('/', 'signed-in', (req, res) => {
  res.json(answerPlaceSearch(req.query));
});

export const placesRouter = r.router;
