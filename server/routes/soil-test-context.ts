/** What the browser needs to preview a soil test's recommendation with the shared function: the firm's method and each unit's crop. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { actor, findInFirm } from '../policies/firm-scope';
import { propertySoilTestContext } from '../queries/soil-test-context';
import { Property } from '../models';

const r = defineRoutes('/properties');

r.get('/:id/soil-test-context', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, params.id, me.firmId, 'That property');
  res.json({ data: await propertySoilTestContext(me.firmId, property.id) });
}));

export const soilTestContextRouter = r.router;
