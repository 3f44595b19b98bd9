import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { Prescription, Proposal } from '../../server/models';
import { SeasonDraft } from '../../server/models/season-draft';
import { SeasonDraftDtoSchema } from '../../shared/schemas/seasons';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
let outsider: Agent;
let propertyId: number;
let plotId: number;
let year: number;

const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  outsider = await signedInAgent((await makeFirm()).users.consultant.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
  year = (await Prescription.findOne({ where: { unitId: plotId } }))!.year;
  // A failed stand, deer eating the rape and passing over the radish, and a soil test: the evidence.
  await send(consultant, 'post', `/api/units/${plotId}/checks`, { kind: 'establishment', checkedOn: `${year}-09-20`, frameSqFt: 1, samples: [{ species: 'rape', plants: 0 }, { species: 'turnip', plants: 1 }], groundCoverPct: 10, weedPressure: 'high' });
  await send(consultant, 'post', `/api/units/${plotId}/checks`, { kind: 'browse', checkedOn: `${year}-11-20`, pairs: [{ species: 'rape', caged: 10, open: 1 }, { species: 'forage radish', caged: 10, open: 9 }] });
  await send(consultant, 'post', `/api/units/${plotId}/soil-tests`, { sampledOn: `${year}-03-01`, lab: 'County lab', ph: 5.4, enmLbPerAcre: 1200, pPpm: 20, kPpm: 110 });
});

describe('rolling into next season', () => {
  it('drafts each change with its reason, then writes the accepted ones and a draft proposal', async () => {
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/seasons`, { season: year + 1 });
    expect(res.status).toBe(201);
    const draft = SeasonDraftDtoSchema.parse(res.body.data);
    const kinds = draft.plan.changes.map((c) => c.kind);
    expect(kinds).toEqual(['reseed', 'shift-mix', 'lime']);
    expect(draft.plan.changes[1]!.reason).toMatch(/prefer rape/);
    // The same season again answers the same draft.
    const again = await send(consultant, 'post', `/api/properties/${propertyId}/seasons`, { season: year + 1 });
    expect(again.status).toBe(200);
    expect(again.body.data.id).toBe(draft.id);

    // Nothing is written while a change is undecided.
    const early = await send(consultant, 'post', `/api/season-drafts/${draft.id}/proposal`);
    expect(early.status).toBe(422);
    expect(early.body.error).toMatch(/accept or reject every change/);
    expect(await Prescription.count({ where: { unitId: plotId, year: year + 1 } })).toBe(0);

    for (const change of draft.plan.changes) {
      const decided = await send(consultant, 'patch', `/api/season-drafts/${draft.id}/changes/${change.id}`, { decision: change.kind === 'lime' ? 'rejected' : 'accepted' });
      expect(decided.status).toBe(200);
    }
    const written = await send(consultant, 'post', `/api/season-drafts/${draft.id}/proposal`);
    expect(written.status).toBe(200);
    expect(written.body.data.status).toBe('written');
    const proposal = await Proposal.findByPk(written.body.data.proposalId);
    expect(proposal!.status).toBe('draft');
    const next = await Prescription.findOne({ where: { unitId: plotId, year: year + 1 } });
    // Shifted mix: rape 4 × 1.25 = 5, radish 2.7 × 0.75 = 2.03, turnip unchanged 1.65 (starter library rates; factors common practice, no source)
    expect(next!.parameters.steps!.seed!.seedRatesLbPerAcre).toEqual({ 'seed-forage-radish': 2.03, 'seed-turnip': 1.65, 'seed-rape': 5 });
    expect(next!.parameters.steps!.lime?.limeTonsPerAcre).toBeUndefined(); // the lime change was rejected
    expect(next!.notes).toMatch(/Failed stand/);
    const late = await send(consultant, 'patch', `/api/season-drafts/${draft.id}/changes/${draft.plan.changes[0]!.id}`, { decision: 'rejected' });
    expect(late.status).toBe(409);
  });

  it('refuses bad seasons, crew and other firms, saving nothing', async () => {
    const before = await SeasonDraft.count();
    expect((await send(consultant, 'post', `/api/properties/${propertyId}/seasons`, { season: 27 })).status).toBe(422);
    expect((await send(consultant, 'post', `/api/properties/${propertyId}/seasons`, { season: 2027.5 })).status).toBe(422);
    const none = await send(consultant, 'post', `/api/properties/${propertyId}/seasons`, { season: 2001 });
    expect(none.status).toBe(422);
    expect(none.body.error).toMatch(/no unit of this property carries a prescription before 2001/);
    expect((await send(crew, 'post', `/api/properties/${propertyId}/seasons`, { season: year + 2 })).status).toBe(403);
    expect((await send(outsider, 'post', `/api/properties/${propertyId}/seasons`, { season: year + 2 })).status).toBe(404);
    expect(await SeasonDraft.count()).toBe(before);
  });
});
