/** Prescriptions: the treatment written for a unit. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { Practice, Prescription, Property, Unit } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { PrescriptionCreateSchema, PrescriptionUpdateSchema } from '../../shared/schemas/library';
import { presentPrescription } from '../presenters/prescription';
import { actor, findInFirm } from '../policies/firm-scope';
import { createPrescription, updatePrescription } from '../commands/prescription-writer';
import { recordAudit } from '../commands/audit-recorder';

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

perUnit.get('/:id/prescriptions', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const unit = await findInFirm(Unit, Number(req.params.id), firmId, 'That unit');
  const rows = await Prescription.findAll({ where: { unitId: unit.id, firmId }, order: [['id', 'ASC']] });
  res.json({ data: await presentAll(rows) });
});

perUnit.post('/:id/prescriptions', STAFF, validate({ params: IdParamsSchema, body: PrescriptionCreateSchema }), async (req, res) => {
  const row = await createPrescription(actor(req), Number(req.params.id), req.body, req.ip ?? null);
  res.status(201).json({ data: (await presentAll([row]))[0] });
});

perProperty.get('/:id/prescriptions', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, Number(req.params.id), firmId, 'That property');
  const rows = await Prescription.findAll({ where: { propertyId: property.id, firmId }, order: [['unitId', 'ASC'], ['id', 'ASC']] });
  res.json({ data: await presentAll(rows) });
});

r.get('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const row = await findInFirm(Prescription, Number(req.params.id), actor(req).firmId, 'That prescription');
  res.json({ data: (await presentAll([row]))[0] });
});

r.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: PrescriptionUpdateSchema }), async (req, res) => {
  const row = await updatePrescription(actor(req), Number(req.params.id), req.body, req.ip ?? null);
  res.json({ data: (await presentAll([row]))[0] });
});

r.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const me = actor(req);
  const row = await findInFirm(Prescription, Number(req.params.id), me.firmId, 'That prescription');
  await row.destroy();
  await recordAudit({ firmId: me.firmId, userId: me.id, action: 'prescription.deleted', subjectType: 'Unit', subjectId: row.unitId, ip: req.ip ?? null });
  res.status(204).end();
});

export const unitPrescriptionsRouter = perUnit.router;
export const propertyPrescriptionsRouter = perProperty.router;
export const prescriptionsRouter = r.router;
