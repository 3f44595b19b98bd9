/**
 * Seasons side by side through HTTP against a real PostgreSQL: per unit, this season's and last
 * season's checks, soil-test pH and work done, read-only for staff and the owning client, refused
 * to other clients and other firms, with a bad season a 422 naming the field.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeClient, makeFirm, makeUser, PASSWORD } from '../support/factories';
import { Firm } from '../../server/models';
import { SeasonComparisonDtoSchema } from '../../shared/schemas/season-comparison';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let client: Agent;
let crew: Agent;
let otherClient: Agent;
let outsider: Agent;
let propertyId: number;
let plotId: number;

const post = (agent: Agent, url: string, body: unknown) => agent.post(url).set('X-CSRF-Token', agent.csrf).send(body as object);

// Last season a failed stand (1 rape plant in 2 ft² against a target of 5/ft²: OMAFRA canola guide);
// this season an established one (6 and 5 plants/ft² against 5 and 5 — turnip target from memory).
const stand = (checkedOn: string, rape: number, turnip: number) => ({
  kind: 'establishment',
  checkedOn,
  frameSqFt: 1,
  samples: [{ species: 'rape', plants: rape }, { species: 'rape', plants: rape }, { species: 'turnip', plants: turnip }],
  groundCoverPct: 60,
  weedPressure: 'low',
});

beforeAll(async () => {
  ctx = await makeFirm();
  await Firm.update({ settings: {}, region: 'midwest' }, { where: { id: ctx.firm.id } });
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  const other = await makeUser(ctx.firm.id, 'client', (await makeClient(ctx.firm.id)).id);
  otherClient = await signedInAgent(other.email, PASSWORD);
  outsider = await signedInAgent((await makeFirm()).users.consultant.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
  expect((await post(consultant, `/api/units/${plotId}/checks`, stand('2025-09-24', 1, 0))).status).toBe(201);
  expect((await post(consultant, `/api/units/${plotId}/checks`, stand('2026-09-20', 6, 5))).status).toBe(201);
  expect((await post(consultant, `/api/units/${plotId}/checks`, { kind: 'browse', checkedOn: '2026-10-20', measure: 'height-in', pairs: [{ species: 'rape', caged: 10, open: 4 }] })).status).toBe(201);
  expect((await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2025-03-10', lab: 'County lab', ph: 5.4, bufferMethod: 'woodruff', bufferPh: 6.6, enmLbPerAcre: 1600 })).status).toBe(201);
  expect((await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-12', lab: 'County lab', ph: 6.1, bufferMethod: 'woodruff', bufferPh: 6.8, enmLbPerAcre: 200 })).status).toBe(201);
});

describe('GET /api/properties/:id/season-comparison', () => {
  it('shows the latest season against the one before, per unit: checks, pH and its change', async () => {
    const res = await client.get(`/api/properties/${propertyId}/season-comparison`);
    expect(res.status).toBe(200);
    const data = SeasonComparisonDtoSchema.parse(res.body.data);
    expect(data).toMatchObject({ season: 2026, previousSeason: 2025 });
    const row = data.rows.find((r) => r.unitId === plotId)!;
    expect(row.previous).toMatchObject({ status: 'failed', soilPh: 5.4 });
    expect(row.current.soilPh).toBe(6.1);
    expect(row.phChange).toBe(0.7); // 6.1 − 5.4
    expect(row.current.status).toBe('browsed-hard'); // the latest check: (10 − 4) ÷ 10 = 60 % ≥ 50 % (common practice, no source)
    expect(row.current.checks).toEqual(['Established (Sep 20, 2026)', 'Deer ate 60 % of the forage (Oct 20, 2026)']);
    expect(row.previous.checks).toEqual(['Failed stand (Sep 24, 2025)']);
  });

  it('takes the season asked for', async () => {
    const res = await consultant.get(`/api/properties/${propertyId}/season-comparison?season=2025`);
    expect(res.status).toBe(200);
    expect(res.body.data).toMatchObject({ season: 2025, previousSeason: 2024 });
    const row = res.body.data.rows.find((r: { unitId: number }) => r.unitId === plotId);
    expect(row.current.status).toBe('failed');
    expect(row.previous).toMatchObject({ status: null, soilPh: null, checks: [] });
  });

  it('refuses a season that is not a year with a sentence naming it', async () => {
    const res = await client.get(`/api/properties/${propertyId}/season-comparison?season=last`);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/season/);
  });

  it('is not there for another client, the crew or another firm', async () => {
    expect((await otherClient.get(`/api/properties/${propertyId}/season-comparison`)).status).toBe(404);
    expect((await crew.get(`/api/properties/${propertyId}/season-comparison`)).status).toBe(403);
    expect((await outsider.get(`/api/properties/${propertyId}/season-comparison`)).status).toBe(404);
  });
});
