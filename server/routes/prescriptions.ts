/** Prescriptions: the treatment written for a unit. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Practice, Prescription, Property, Unit } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { PrescriptionCreateSchema, PrescriptionUpdateSchema } from '../../shared/schemas/library';
import { presentPrescription } from '../presenters/prescription';
import { actor, findInFirm } from '../policies/firm-scope';
import { createPrescription, deletePrescription, updatePrescription } from '../commands/prescription-writer';

const perUnit = defineRoutes('/units');
const perProperty = defineRoutes('/properties');
const r = defineRoutes('/prescriptions');

/** Presents prescriptions with their practice and unit names (two lookups for the whole list). */
async function presentAll(rows: Prescription[]) {
  const [practices, units] = await Promise.all([
    Practice.findAll({ where: { id: [...new Set(rows.map((p) => p.practiceId))] }, attributes: ['id', 'name'] }),
    Unit.findAll({ where: { id: [...new Set(rows.map((p) => p.unitId))] }, attributes: ['id', 'name'] }),
  ]);
  const practiceName = new Map(practices.map((p) => [p.id, p.name]));
  const unitName = new Map(units.map((u) => [u.id, u.name]));
  return rows.map((p) => presentPrescription(p, practiceName.get(p.practiceId) ?? '', unitName.get(p.unitId)));
}

perUnit.get('/:id/prescriptions', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const unit = await findInFirm(Unit, params.id, firmId, 'That unit');
  const rows = await Prescription.findAll({ where: { unitId: unit.id, firmId }, order: [['id', 'ASC']] });
  res.json({ data: await presentAll(rows) });
}));

perUnit.post('/:id/prescriptions', STAFF, ...typed({ params: IdParamsSchema, body: PrescriptionCreateSchema }, async ({ params, body }, req, res) => {
  const row = await createPrescription(actor(req), params.id, body, req.ip ?? null);
  res.status(201).json({ data: (await presentAll([row]))[0] });
}));

perProperty.get('/:id/prescriptions', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, params.id, firmId, 'That property');
  const rows = await Prescription.findAll({ where: { propertyId: property.id, firmId }, order: [['unitId', 'ASC'], ['id', 'ASC']] });
  res.json({ data: await presentAll(rows) });
}));

r.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const row = await findInFirm(Prescription, params.id, actor(req).firmId, 'That prescription');
  res.json({ data: (await presentAll([row]))[0] });
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: PrescriptionUpdateSchema }, async ({ params, body }, req, res) => {
  const row = await updatePrescription(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: (await presentAll([row]))[0] });
}));

r.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deletePrescription(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

export const unitPrescriptionsRouter = perUnit.router;
export const propertyPrescriptionsRouter = perProperty.router;
export const prescriptionsRouter = r.router;
