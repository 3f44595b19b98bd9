/** Soil tests: per unit, a lab CSV per property, applying a test to the prescription, and retests due (the Desk). */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { SoilTestCreateSchema, SoilTestImportSchema } from '../../shared/schemas/soil-tests';
import { actor, findInFirm } from '../policies/firm-scope';
import { applySoilTest, createSoilTest, importSoilTests } from '../commands/soil-test-writer';
import { listUnitSoilTests, retestsDue } from '../queries/soil-tests';
import { presentSoilTest } from '../presenters/soil-test';
import { todayInZone } from '../services/clock';
import { Unit } from '../models';

const units = defineRoutes('/units');
const properties = defineRoutes('/properties');
const tests = defineRoutes('/soil-tests');

/** Days ahead the Desk looks for retests coming due. */
const RETEST_LOOKAHEAD_DAYS = 60;

units.get('/:id/soil-tests', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const unit = await findInFirm(Unit, params.id, actor(req).firmId, 'That unit');
  res.json({ data: await listUnitSoilTests(unit) });
}));

units.post('/:id/soil-tests', STAFF, ...typed({ params: IdParamsSchema, body: SoilTestCreateSchema }, async ({ params, body }, req, res) => {
  const row = await createSoilTest(actor(req), params.id, body, req.ip ?? null);
  const unit = await Unit.findByPk(row.unitId, { attributes: ['name'] });
  res.status(201).json({ data: presentSoilTest(row, unit?.name ?? '') });
}));

properties.post('/:id/soil-tests/import', STAFF, ...typed({ params: IdParamsSchema, body: SoilTestImportSchema }, async ({ params, body }, req, res) => {
  const rows = await importSoilTests(actor(req), params.id, body.csv, req.ip ?? null, body.columns);
  const names = new Map((await Unit.findAll({ where: { id: rows.map((r) => r.unitId) }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
  res.status(201).json({ data: rows.map((r) => presentSoilTest(r, names.get(r.unitId) ?? '')) });
}));

tests.post('/:id/apply', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { soilTest, prescription } = await applySoilTest(actor(req), params.id, req.ip ?? null);
  const unit = await Unit.findByPk(soilTest.unitId, { attributes: ['name'] });
  res.json({ data: { soilTest: presentSoilTest(soilTest, unit?.name ?? ''), prescriptionId: prescription.id, notes: prescription.notes } });
}));

tests.get('/retests-due', STAFF, async (req, res) => {
  const me = actor(req);
  const today = todayInZone(me.firmTimezone);
  const by = new Date(Date.parse(`${today}T00:00:00Z`) + RETEST_LOOKAHEAD_DAYS * 86_400_000).toISOString().slice(0, 10);
  res.json({ data: await retestsDue(me.firmId, by) });
});

export const unitSoilTestsRouter = units.router;
export const propertySoilTestsRouter = properties.router;
export const soilTestsRouter = tests.router;
