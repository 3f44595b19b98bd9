/** Rolling a plan into the next season: draft, decide each change, write prescriptions and a draft proposal. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
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

properties.post('/:id/seasons', STAFF, validate({ params: IdParamsSchema, body: SeasonRollSchema }), async (req, res) => {
  const { draft, existing } = await rollSeason(actor(req), Number(req.params.id), req.body.season, req.ip ?? null);
  res.status(existing ? 200 : 201).json({ data: presentDraft(draft) });
});

drafts.get('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  res.json({ data: presentDraft(await findInFirm(SeasonDraft, Number(req.params.id), actor(req).firmId, 'That season draft')) });
});

drafts.patch('/:id/changes/:changeId', STAFF, validate({ params: SeasonChangeParamsSchema, body: SeasonChangeDecisionSchema }), async (req, res) => {
  const draft = await decideSeasonChange(actor(req), Number(req.params.id), String(req.params.changeId), req.body.decision, req.ip ?? null);
  res.json({ data: presentDraft(draft) });
});

drafts.post('/:id/proposal', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  res.json({ data: presentDraft(await writeSeason(actor(req), Number(req.params.id), req.ip ?? null)) });
});

export const propertySeasonsRouter = properties.router;
export const seasonDraftsRouter = drafts.router;
