/**
 * The plan summary is cached whole by the plan's revision, so each of its inputs must move the
 * revision when it changes (migration 0092): a change to a task, a prescription, a material, a
 * practice or the firm's hunting route buffer shows in the very next read — never a stale warning.
 * Every read below follows a warm read at the previous state, so a cache that missed a change would
 * answer the old warnings.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Practice, Prescription, Task } from '../../server/models';
import { PlanSummarySchema, type PlanSummary } from '../../shared/schemas/unit';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let owner: Agent;
let propertyId: number;
let plotId: number;

const send = (agent: Agent, method: 'post' | 'patch' | 'delete', url: string, body?: unknown) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);
const herbicide = { kind: 'herbicide', name: 'Residual burndown', activeIngredient: 'an invented residual, 2 lb/gal', pricing: { basis: 'per-gal', pricePerGalCents: 9000 } };

/** Reads the summary twice (the second from the cache) and checks both agree. */
async function read(): Promise<PlanSummary> {
  const first = PlanSummarySchema.parse((await consultant.get(`/api/properties/${propertyId}/plan`).expect(200)).body.data);
  const again = PlanSummarySchema.parse((await consultant.get(`/api/properties/${propertyId}/plan`).expect(200)).body.data);
  expect(again).toEqual(first);
  return first;
}
const warning = (s: PlanSummary, code: string) => s.warnings.find((w) => w.code === code);

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
});

describe('plan summary cached by revision', () => {
  let materialId: number;
  let seedTaskId: number;

  it('shows a task written, moved and moved back in the next read', async () => {
    const made = await send(consultant, 'post', '/api/materials', { ...herbicide, plantBackDays: 120 });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    materialId = made.body.data.id;
    expect(warning(await read(), 'plant-back')).toBeUndefined();

    const base = { firmId: ctx.firm.id, propertyId, unitId: plotId, prescriptionId: null, proposalId: null, practiceName: 'Fall brassica plot', unitName: 'North plot', startDate: null, endDate: null };
    await Task.create({ ...base, stepKey: 'spray', name: 'Burn down the sod', kind: 'spray', earliest: '2026-05-01', latest: '2026-05-15', quantities: [{ key: made.body.data.key, label: herbicide.name, amount: 1, unit: 'gal', rateText: '' }] });
    seedTaskId = (await Task.create({ ...base, stepKey: 'seed', name: 'Broadcast seed', kind: 'seed', earliest: '2026-08-01', latest: '2026-09-30' })).id;
    // 2026-05-01 + 120 days = 2026-08-29; seeding 2026-08-01 is 28 days early (calendar arithmetic, no source).
    expect(warning(await read(), 'plant-back')?.message).toContain('28 days too early');

    expect((await send(consultant, 'patch', `/api/tasks/${seedTaskId}`, { startDate: '2026-09-15' })).status).toBe(200);
    expect(warning(await read(), 'plant-back')).toBeUndefined();
    expect((await send(consultant, 'patch', `/api/tasks/${seedTaskId}`, { startDate: null })).status).toBe(200);
    expect(warning(await read(), 'plant-back')?.message).toContain('28 days too early');
  });

  it("shows a material's new plant-back interval in the next read", async () => {
    const changed = await send(consultant, 'patch', `/api/materials/${materialId}`, { ...herbicide, plantBackDays: 150 });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    // 2026-05-01 + 150 days = 2026-09-28; 58 days after 2026-08-01 (calendar arithmetic, no source).
    expect(warning(await read(), 'plant-back')?.message).toContain('58 days too early');
  });

  it('shows a prescription added and removed in the next read', async () => {
    expect(warning(await read(), 'rotation')).toBeUndefined();
    const first = (await Prescription.findOne({ where: { unitId: plotId } }))!;
    const again = await send(consultant, 'post', `/api/units/${plotId}/prescriptions`, { practiceId: first.practiceId, year: first.year + 1 });
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(warning(await read(), 'rotation')?.unitIds).toEqual([plotId]);
    expect((await send(consultant, 'delete', `/api/prescriptions/${again.body.data.id}`)).status).toBeLessThan(300);
    expect(warning(await read(), 'rotation')).toBeUndefined();
    expect((await send(consultant, 'post', `/api/units/${plotId}/prescriptions`, { practiceId: first.practiceId, year: first.year + 1 })).status).toBe(201);
    expect(warning(await read(), 'rotation')?.unitIds).toEqual([plotId]);
  });

  it("shows a practice that no longer sows in the next read, however it was written", async () => {
    const first = (await Prescription.findOne({ where: { unitId: plotId } }))!;
    const practice = (await Practice.findByPk(first.practiceId))!;
    const definition = { ...practice.definition, steps: practice.definition.steps.filter((s) => s.application?.type !== 'seed') };
    await Practice.update({ definition }, { where: { id: practice.id } });
    expect(warning(await read(), 'rotation')).toBeUndefined();
  });

  it("shows the firm's hunting route buffer in the next read", async () => {
    const draw = (body: unknown) => send(consultant, 'post', `/api/properties/${propertyId}/units`, body);
    expect((await draw({ kind: 'bedding-area', name: 'East bedding', geometry: rectangle(-90.93, 43.2655, 100, 100) })).status).toBe(201);
    const route = { type: 'LineString', coordinates: [[-90.9305, 43.2647], [-90.9285, 43.2647]] };
    expect((await draw({ kind: 'access-route', name: 'South lane', geometry: route })).status).toBe(201);
    expect((await send(owner, 'patch', '/api/firm/hunting-settings', { routeBufferYd: 300 })).status).toBe(200);
    expect(warning(await read(), 'route-near-bedding')?.message).toContain('keep at least 300 yd');
    expect((await send(owner, 'patch', '/api/firm/hunting-settings', { routeBufferYd: 10 })).status).toBe(200);
    expect(warning(await read(), 'route-near-bedding')).toBeUndefined();
  });
});
