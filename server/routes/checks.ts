/** Checks on a unit: establishment checks, browse checks and timber cruises; the re-seeding a check drafts; plot statuses; the unit's history. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { optionalIdempotencyKey } from '../middlewares/idempotency-key';
import { IdParamsSchema } from '../../shared/schemas/common';
import { ReseedDecisionSchema, UnitCheckCreateSchema } from '../../shared/schemas/checks';
import { actor, findInFirm } from '../policies/firm-scope';
import { checkableUnit, createCheck, decideReseed } from '../commands/check-writer';
import { listUnitChecks, plotStatuses } from '../queries/checks';
import { presentCheck } from '../presenters/unit-check';
import { readableProperty } from '../services/results/results-reader';
import { Unit } from '../models';
import { readUnitHistory } from '../queries/unit-history';

const units = defineRoutes('/units');
const checks = defineRoutes('/checks');
const properties = defineRoutes('/properties');
const CHECKERS = ['owner', 'consultant', 'crew'] as const;


units.get('/:id/checks', CHECKERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const unit = await checkableUnit(actor(req), params.id);
  res.json({ data: await listUnitChecks(unit) });
}));

units.post('/:id/checks', CHECKERS, ...typed({ params: IdParamsSchema, body: UnitCheckCreateSchema }, async ({ params, body }, req, res) => {
  const { check, replayed } = await createCheck(actor(req), params.id, body, optionalIdempotencyKey(req), req.ip ?? null);
  const unit = await Unit.findByPk(check.unitId, { attributes: ['name'] });
  res.status(replayed ? 200 : 201).json({ data: presentCheck(check, unit?.name ?? ''), replayed });
}));

units.get('/:id/history', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const unit = await findInFirm(Unit, params.id, actor(req).firmId, 'That unit');
  res.json({ data: await readUnitHistory(unit) });
}));

checks.post('/:id/reseed', STAFF, ...typed({ params: IdParamsSchema, body: ReseedDecisionSchema }, async ({ params, body }, req, res) => {
  const check = await decideReseed(actor(req), params.id, body.decision, req.ip ?? null);
  const unit = await Unit.findByPk(check.unitId, { attributes: ['name'] });
  res.json({ data: presentCheck(check, unit?.name ?? '') });
}));

properties.get('/:id/plot-statuses', ['owner', 'consultant', 'client'], ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const property = await readableProperty(actor(req), params.id);
  res.json({ data: await plotStatuses(property.firmId, property.id) });
}));

export const unitChecksRouter = units.router;
export const checksRouter = checks.router;
export const propertyPlotStatusesRouter = properties.router;
