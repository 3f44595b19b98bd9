/** A property's camera sites with their numbers summed over every deployment (staff). */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Property } from '../models';
import { actor, findInFirm } from '../policies/firm-scope';
import { todayInZone } from '../services/clock';
import { cameraSiteSummaries } from '../queries/camera-sites';
import { IdParamsSchema } from '../../shared/schemas/common';

const r = defineRoutes('/properties');

r.get('/:id/camera-sites', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, params.id, me.firmId, 'That property');
  res.json(await cameraSiteSummaries(me.firmId, property.id, todayInZone(me.firmTimezone)));
}));

export const propertyCameraSitesRouter = r.router;
