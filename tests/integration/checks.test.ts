import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Observation, Prescription, Task } from '../../server/models';
import { UnitCheck } from '../../server/models/unit-check';
import { SoilTest } from '../../server/models/soil-test';
import { UnitCheckDtoSchema } from '../../shared/schemas/checks';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let other: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
let client: Agent;
let outsider: Agent;
let propertyId: number;
let plotId: number;
let timberId: number;

const post = (agent: Agent, url: string, body: unknown, headers: Record<string, string> = {}) => {
  const req = agent.post(url).set('X-CSRF-Token', agent.csrf);
  for (const [k, v] of Object.entries(headers)) req.set(k, v);
  return req.send(body as object);
};

// A failed brassica stand: 1 rape and 1 turnip seedling over 4 × 1 ft² frames against targets of 5
// (rape: OMAFRA canola stand guide, lower end of 5–8/ft²) and 5 plants/ft² (turnip: from memory) → well under 40 % of target (threshold: common practice, no source).
const failedStand = {
  kind: 'establishment',
  checkedOn: '2026-10-01',
  frameSqFt: 1,
  samples: [
    { species: 'rape', plants: 1 },
    { species: 'rape', plants: 0 },
    { species: 'turnip', plants: 1 },
    { species: 'turnip', plants: 0 },
  ],
  groundCoverPct: 15,
  weedPressure: 'high',
};

beforeAll(async () => {
  ctx = await makeFirm();
  other = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  outsider = await signedInAgent(other.users.consultant.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
  const timber = await post(consultant, `/api/properties/${propertyId}/units`, { kind: 'timber', name: 'Oak ridge', geometry: rectangle(-90.934, 43.2655, 150, 100) });
  timberId = timber.body.data.id;
});

describe('establishment check', () => {
  it('answers the computed stand, the status and a re-seeding draft for a failed plot', async () => {
    const res = await post(consultant, `/api/units/${plotId}/checks`, failedStand);
    expect(res.status).toBe(201);
    const data = UnitCheckDtoSchema.parse(res.body.data);
    expect(data.kind).toBe('establishment');
    expect(res.body.data.frameSqFt).toBe(1);
    expect(res.body.data.samples).toHaveLength(4);
    expect(res.body.data.result.status).toBe('failed');
    const rape = res.body.data.result.species.find((s: { species: string }) => s.species === 'rape');
    expect(rape.plantsPerSqFt).toBe(0.5); // 1 plant ÷ (2 frames × 1 ft²)
    expect(res.body.data.status).toBe('failed');
    expect(res.body.data.reseed).toMatchObject({ status: 'proposed', rateFactor: 1, practiceName: 'Fall brassica plot' });
  });

  it('writes the re-seeding prescription at the scaled rates when the consultant accepts it', async () => {
    const thin = await post(consultant, `/api/units/${plotId}/checks`, { ...failedStand, samples: [{ species: 'rape', plants: 3 }, { species: 'turnip', plants: 3 }] });
    expect(thin.body.data.status).toBe('thin'); // 3/5 (rape, OMAFRA canola guide) and 3/5 (turnip, from memory) of target → mean 0.6
    const before = await Prescription.count({ where: { unitId: plotId } });
    const accepted = await post(consultant, `/api/checks/${thin.body.data.id}/reseed`, { decision: 'accept' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.data.reseed.status).toBe('accepted');
    const made = await Prescription.findByPk(accepted.body.data.reseed.prescriptionId);
    expect(await Prescription.count({ where: { unitId: plotId } })).toBe(before + 1);
    // Half of the practice's rates: rape 4 → 2, turnip 1.65 → 0.83, radish 2.7 → 1.35 lb/acre (starter library)
    expect(made!.parameters.steps!.seed!.seedRatesLbPerAcre).toEqual({ 'seed-forage-radish': 1.35, 'seed-turnip': 0.83, 'seed-rape': 2 });
    const again = await post(consultant, `/api/checks/${thin.body.data.id}/reseed`, { decision: 'reject' });
    expect(again.status).toBe(409);
  });

  it('lists the unit’s checks newest first', async () => {
    const res = await consultant.get(`/api/units/${plotId}/checks`).expect(200);
    expect(res.body.data.length).toBeGreaterThanOrEqual(2);
    res.body.data.forEach((c: unknown) => UnitCheckDtoSchema.parse(c));
  });
});

describe('browse check', () => {
  it('answers use % per species and Jacobs’ D', async () => {
    // clover 10→1 (90 % used), chicory 10→9 (10 %): r = 9/10, p = 1/2 → D = 0.4 ÷ (1.4 − 0.9) = 0.8 (Jacobs 1974, worked by hand)
    const res = await post(consultant, `/api/units/${plotId}/checks`, {
      kind: 'browse',
      checkedOn: '2026-11-10',
      pairs: [{ species: 'white clover', caged: 10, open: 1 }, { species: 'forage chicory', caged: 10, open: 9 }],
    });
    expect(res.status).toBe(201);
    const clover = res.body.data.result.species.find((s: { species: string }) => s.species === 'white clover');
    expect(clover.usePct).toBeCloseTo(90, 10);
    expect(clover.jacobsD).toBeCloseTo(0.8, 10);
    expect(res.body.data.measure).toBe('height-in');
    expect(res.body.data.status).toBe('browsed-hard'); // 10 of 20 used = 50 %: heavy (common practice, no source)
  });
});

describe('timber cruise', () => {
  it('answers basal area and trees per acre against the target residual', async () => {
    // BAF 10; in-trees 10 and 12 → 110 ft²/acre (BAF × mean). Target 65 (Virginia Dept. of Forestry) → 45 over.
    const res = await post(consultant, `/api/units/${timberId}/checks`, { kind: 'timber', baf: 10, points: [{ inTrees: 10, dbhIn: 12 }, { inTrees: 12, dbhIn: 12 }], targetResidualBaSqFtPerAcre: 65 });
    expect(res.status).toBe(201);
    expect(res.body.data.result.basalAreaSqFtPerAcre).toBe(110);
    // 22 trees × 10 ÷ (0.005454 × 144) ÷ 2 points = 140.06 trees/acre (Univ. of Missouri NR 3110 basal area)
    expect(res.body.data.result.treesPerAcre).toBeCloseTo(140.06, 2);
    expect(res.body.data.result.excessBaSqFtPerAcre).toBe(45);
    expect(res.body.data.status).toBe('over-target');
    expect(res.body.data.checkedOn).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });
});

describe('bad input: 422 naming the field, nothing saved', () => {
  const cases: [string, unknown, RegExp][] = [
    ['a negative count', { ...failedStand, samples: [{ species: 'rape', plants: -1 }] }, /plants/],
    ['a fractional count', { ...failedStand, samples: [{ species: 'rape', plants: 1.5 }] }, /whole number/],
    ['a frame area of zero', { ...failedStand, frameSqFt: 0 }, /frameSqFt/],
    ['an open sample larger than its cage', { kind: 'browse', checkedOn: '2026-11-10', pairs: [{ species: 'oats', caged: 4, open: 6 }] }, /open \(6\) is larger than its cage \(4\).*cannot exceed caged/],
    ['DBHs that do not match the in-trees', { kind: 'timber', baf: 10, points: [{ inTrees: 3, dbhIn: [10, 12] }] }, /dbhIn/],
    ['an unknown kind', { kind: 'soil', checkedOn: '2026-11-10' }, /kind/],
  ];
  for (const [label, body, message] of cases) {
    it(`refuses ${label}`, async () => {
      const before = await UnitCheck.count({ where: { unitId: [plotId, timberId] } });
      const res = await post(consultant, `/api/units/${plotId}/checks`, body);
      expect(res.status).toBe(422);
      expect(res.body.error).toMatch(message);
      expect(await UnitCheck.count({ where: { unitId: [plotId, timberId] } })).toBe(before);
    });
  }
});

describe('who may check', () => {
  it('lets crew check a unit they have a task on, once per idempotency key', async () => {
    expect((await post(crew, `/api/units/${plotId}/checks`, failedStand)).status).toBe(404);
    await Task.create({ firmId: ctx.firm.id, propertyId, unitId: plotId, prescriptionId: null, proposalId: null, stepKey: 'check', name: 'Establishment check', kind: 'inspect', practiceName: 'Fall brassica plot', unitName: 'North plot', earliest: '2026-09-15', latest: '2026-10-15', startDate: null, endDate: null, assigneeId: ctx.users.crew.id });
    const key = `check-${Date.now()}-abc`;
    const first = await post(crew, `/api/units/${plotId}/checks`, failedStand, { 'Idempotency-Key': key });
    expect(first.status).toBe(201);
    const again = await post(crew, `/api/units/${plotId}/checks`, failedStand, { 'Idempotency-Key': key });
    expect(again.status).toBe(200);
    expect(again.body.replayed).toBe(true);
    expect(again.body.data.id).toBe(first.body.data.id);
    expect((await post(crew, `/api/checks/${first.body.data.id}/reseed`, { decision: 'accept' })).status).toBe(403);
  });

  it('keeps other firms and clients out', async () => {
    expect((await outsider.get(`/api/units/${plotId}/checks`)).status).toBe(404);
    expect((await post(outsider, `/api/units/${plotId}/checks`, failedStand)).status).toBe(404);
    expect((await post(client, `/api/units/${plotId}/checks`, failedStand)).status).toBe(403);
  });

  it('answers the latest status per plot for the plan map and the owner’s portal', async () => {
    const staff = await consultant.get(`/api/properties/${propertyId}/plot-statuses`).expect(200);
    const plot = staff.body.data.find((s: { unitId: number }) => s.unitId === plotId);
    expect(plot.checkedOn).toBe('2026-11-10');
    expect(plot.status).toBe('browsed-hard');
    expect(staff.body.data.find((s: { unitId: number }) => s.unitId === timberId).status).toBe('over-target');
    expect((await client.get(`/api/properties/${propertyId}/plot-statuses`)).status).toBe(200);
    expect((await outsider.get(`/api/properties/${propertyId}/plot-statuses`)).status).toBe(404);
  });
});

describe('the demo seed', () => {
  it('records a thin brassica stand with its re-seeding drafted, a browse check and a cruise, once', async () => {
    const { seedDemo } = await import('../../server/db/seeds/demo');
    const { seedDemoPrescriptions } = await import('../../server/db/seeds/demo-prescriptions');
    const { seedDemoChecks } = await import('../../server/db/seeds/demo-checks');
    const firm = await seedDemo();
    await seedDemoPrescriptions(firm);
    await seedDemoChecks(firm);
    const count = await UnitCheck.count({ where: { firmId: firm.id } });
    expect(await seedDemoChecks(firm)).toBe(0);
    expect(await SoilTest.count({ where: { firmId: firm.id, sampledOn: '2025-03-18' } })).toBe(1);
    expect(await UnitCheck.count({ where: { firmId: firm.id } })).toBe(count);
    const kinds = (await UnitCheck.findAll({ where: { firmId: firm.id } })).map((c) => `${c.kind}:${c.status}`).sort();
    expect(kinds).toEqual(['browse:checked', 'establishment:thin', 'timber:over-target']);
    const thin = await UnitCheck.findOne({ where: { firmId: firm.id, kind: 'establishment' } });
    expect(thin!.reseed).toMatchObject({ status: 'proposed', practiceName: 'Fall brassica plot', rateFactor: 0.5 });
  });
});

describe('unit history', () => {
  it('keeps prescriptions, checks and soil tests by season under the unit’s identity, even after its outline is edited', async () => {
    await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-10', lab: 'County lab', ph: 6.6 });
    // Two observations on the plot: 1 June 2026, and 31 Dec 2026 at 9 pm in the firm's Chicago time (already 2027 in UTC)
    for (const [i, at] of ['2026-06-01T15:00:00Z', '2027-01-01T03:00:00Z'].entries()) {
      await Observation.create({ firmId: ctx.firm.id, propertyId, unitId: plotId, kind: 'browse', observedAt: new Date(at), notes: null, position: { type: 'Point', coordinates: [-90.938, 43.2655] }, positionSource: 'device', insideBoundary: true, idempotencyKey: `history-observation-${i}-${Date.now()}`, createdById: null });
    }
    const edit = await consultant.patch(`/api/units/${plotId}`).set('X-CSRF-Token', consultant.csrf).send({ geometry: rectangle(-90.938, 43.2655, 110, 80) });
    expect(edit.status).toBe(200);
    const res = await consultant.get(`/api/units/${plotId}/history`).expect(200);
    expect(res.body.data.unitId).toBe(plotId);
    const s2026 = res.body.data.seasons.find((s: { season: number }) => s.season === 2026);
    expect(s2026.checks.map((c: { kind: string }) => c.kind)).toEqual(expect.arrayContaining(['establishment', 'browse']));
    expect(s2026.soilTests).toHaveLength(1);
    expect(s2026.observations).toBe(2); // counted by the year in the firm's time zone
    expect(res.body.data.seasons.find((s: { season: number }) => s.season === 2027)?.observations ?? 0).toBe(0); // not 2027, as UTC would have it
    expect(res.body.data.seasons.flatMap((s: { prescriptions: unknown[] }) => s.prescriptions).length).toBeGreaterThanOrEqual(2); // the brassica plot and its re-seeding
    expect((await crew.get(`/api/units/${plotId}/history`)).status).toBe(403);
    expect((await outsider.get(`/api/units/${plotId}/history`)).status).toBe(404);
  });
});
