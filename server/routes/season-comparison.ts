/** Seasons side by side: this season and last per unit (checks, soil-test pH, work done), read-only for staff and the owning client. */
import { defineRoutes } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { SeasonComparisonQuerySchema } from '../../shared/schemas/season-comparison';
import { actor } from '../policies/firm-scope';
import { readableProperty } from '../services/results/results-reader';
import { readSeasonComparison } from '../queries/season-comparison';

const properties = defineRoutes('/properties');

properties.get('/:id/season-comparison', ['owner', 'consultant', 'client'], ...typed({ params: IdParamsSchema, query: SeasonComparisonQuerySchema }, async ({ params, query }, req, res) => {
  const property = await readableProperty(actor(req), params.id);
  res.json({ data: await readSeasonComparison(property, query.season ?? null) });
}));

export const propertySeasonComparisonRouter = properties.router;
