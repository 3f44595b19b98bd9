/** Rolling a plan into the next season: draft, decide each change, write prescriptions and a draft proposal. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import { SeasonChangeDecisionSchema, SeasonChangeParamsSchema, SeasonRollSchema, type SeasonDraftDto } from '../../shared/schemas/seasons';
import { actor, findInFirm } from '../policies/firm-scope';
import { decideSeasonChange, rollSeason, writeSeason } from '../commands/season-roller';
import { SeasonDraft } from '../models/season-draft';

const properties = defineRoutes('/properties');
const drafts = defineRoutes('/season-drafts');

/** A season draft as the API answers it. */
function presentDraft(d: SeasonDraft): SeasonDraftDto {
  return { id: d.id, propertyId: d.propertyId, season: d.season, status: d.status, plan: d.plan, prescriptionIds: d.prescriptionIds, proposalId: d.proposalId };
}

properties.post('/:id/seasons', STAFF, ...typed({ params: IdParamsSchema, body: SeasonRollSchema }, async ({ params, body }, req, res) => {
  const { draft, existing } = await rollSeason(actor(req), params.id, body.season, req.ip ?? null);
  res.status(existing ? 200 : 201).json({ data: presentDraft(draft) });
}));

drafts.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: presentDraft(await findInFirm(SeasonDraft, params.id, actor(req).firmId, 'That season draft')) });
}));

drafts.patch('/:id/changes/:changeId', STAFF, ...typed({ params: SeasonChangeParamsSchema, body: SeasonChangeDecisionSchema }, async ({ params, body }, req, res) => {
  const draft = await decideSeasonChange(actor(req), params.id, String(params.changeId), body.decision, req.ip ?? null);
  res.json({ data: presentDraft(draft) });
}));

drafts.post('/:id/proposal', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: presentDraft(await writeSeason(actor(req), params.id, req.ip ?? null)) });
}));

export const propertySeasonsRouter = properties.router;
export const seasonDraftsRouter = drafts.router;
