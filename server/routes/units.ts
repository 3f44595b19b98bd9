/** One plan unit: edit or delete. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { UnitUpdateSchema } from '../../shared/schemas/unit';
import { presentUnit } from '../presenters/unit';
import { actor, findInFirm } from '../policies/firm-scope';
import { deleteUnit, updateUnit } from '../commands/unit-writer';
import { Unit } from '../models';

const r = defineRoutes('/units');

r.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const unit = await findInFirm(Unit, params.id, actor(req).firmId, 'That unit');
  res.json({ data: presentUnit(unit) });
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: UnitUpdateSchema }, async ({ params, body }, req, res) => {
  const unit = await updateUnit(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: presentUnit(unit) });
}));

r.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deleteUnit(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

export const unitsRouter = r.router;
