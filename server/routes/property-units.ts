/** A property's plan: its units (read with an ETag by the plan's revision, or added one or many) and its summary. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { UnitBulkCreateSchema, UnitCreateSchema } from '../../shared/schemas/unit';
import { presentUnit } from '../presenters/unit';
import { actor } from '../policies/firm-scope';
import { createUnits } from '../commands/unit-writer';
import { planEtagAt, planRevision, planSummaryOf, unitsAnswer } from '../services/plan/plan-reader';
import { etagMatches, sendPrecompressed } from '../services/http/precompressed';

const r = defineRoutes('/properties');

r.get('/:id/units', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  // The revision first, alone: a 304 costs the session read and this one small query.
  const propertyId = params.id;
  const revision = await planRevision(propertyId, actor(req).firmId);
  const etag = planEtagAt(propertyId, revision);
  res.setHeader('ETag', etag);
  res.setHeader('Cache-Control', 'private, no-cache');
  res.vary('Accept-Encoding');
  if (etagMatches(req.headers['if-none-match'], etag)) return res.status(304).end();
  sendPrecompressed(req, res, await unitsAnswer(propertyId, revision));
}));

r.post('/:id/units', STAFF, ...typed({ params: IdParamsSchema, body: UnitCreateSchema }, async ({ params, body }, req, res) => {
  const [unit] = await createUnits(actor(req), params.id, [body], req.ip ?? null);
  res.status(201).json({ data: presentUnit(unit) });
}));

r.post('/:id/units/bulk', STAFF, ...typed({ params: IdParamsSchema, body: UnitBulkCreateSchema }, async ({ params, body }, req, res) => {
  const units = await createUnits(actor(req), params.id, body.units, req.ip ?? null, { confirmLargeArea: body.confirmLargeArea });
  res.status(201).json({ data: units.map(presentUnit) });
}));

r.get('/:id/plan', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await planSummaryOf(params.id, actor(req).firmId) });
}));

export const propertyUnitsRouter = r.router;
