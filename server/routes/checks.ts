/** Checks on a unit: establishment checks, browse checks and timber cruises; the re-seeding a check drafts; plot statuses; the unit's history. */
import type { Request } from 'express';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { ReseedDecisionSchema, UnitCheckCreateSchema } from '../../shared/schemas/checks';
import { IDEMPOTENCY_HEADER, IdempotencyKeySchema } from '../../shared/schemas/task';
import { actor, findInFirm } from '../policies/firm-scope';
import { unprocessable } from '../errors';
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

/** The optional Idempotency-Key of a check sent from the field sheet's queue. */
function optionalKey(req: Request): string | null {
  const raw = req.get(IDEMPOTENCY_HEADER);
  if (!raw) return null;
  const parsed = IdempotencyKeySchema.safeParse(raw);
  if (!parsed.success) throw unprocessable(`${IDEMPOTENCY_HEADER}: ${parsed.error.issues[0]?.message ?? 'is not valid'}.`);
  return parsed.data;
}

units.get('/:id/checks', CHECKERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const unit = await checkableUnit(actor(req), params.id);
  res.json({ data: await listUnitChecks(unit) });
}));

units.post('/:id/checks', CHECKERS, ...typed({ params: IdParamsSchema, body: UnitCheckCreateSchema }, async ({ params, body }, req, res) => {
  const { check, replayed } = await createCheck(actor(req), params.id, body, optionalKey(req), req.ip ?? null);
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
