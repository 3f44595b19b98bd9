/** One plan unit: edit or delete. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { IdParamsSchema } from '../../shared/schemas/common';
import { UnitUpdateSchema } from '../../shared/schemas/unit';
import { presentUnit } from '../presenters/unit';
import { actor, findInFirm } from '../policies/firm-scope';
import { deleteUnit, updateUnit } from '../commands/unit-writer';
import { Unit } from '../models';

const r = defineRoutes('/units');

r.get('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const unit = await findInFirm(Unit, Number(req.params.id), actor(req).firmId, 'That unit');
  res.json({ data: presentUnit(unit) });
});

r.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: UnitUpdateSchema }), async (req, res) => {
  const unit = await updateUnit(actor(req), Number(req.params.id), req.body, req.ip ?? null);
  res.json({ data: presentUnit(unit) });
});

r.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  await deleteUnit(actor(req), Number(req.params.id), req.ip ?? null);
  res.status(204).end();
});

export const unitsRouter = r.router;
