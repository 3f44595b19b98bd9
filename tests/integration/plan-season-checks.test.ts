import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { Material, Prescription, Practice, Task } from '../../server/models';
import { PlanSummarySchema } from '../../shared/schemas/unit';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let propertyId: number;
let plotId: number;

const send = (method: 'post' | 'patch', url: string, body: unknown) => consultant[method](url).set('X-CSRF-Token', consultant.csrf).send(body as object);
const herbicide = { kind: 'herbicide', name: 'Residual burndown', activeIngredient: 'an invented residual, 2 lb/gal', pricing: { basis: 'per-gal', pricePerGalCents: 9000 } };

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
});

describe('plant-back interval on a herbicide', () => {
  it('is saved from the library form and refused in the wrong unit with a sentence naming the field', async () => {
    const bad = await send('post', '/api/materials', { ...herbicide, plantBackDays: '4 months' });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toMatch(/plantBackDays/);
    const fraction = await send('post', '/api/materials', { ...herbicide, plantBackDays: 30.5 });
    expect(fraction.status).toBe(422);
    expect(JSON.stringify(fraction.body)).toMatch(/whole number of days/);
    expect(await Material.count({ where: { firmId: ctx.firm.id, name: herbicide.name } })).toBe(0);

    const made = await send('post', '/api/materials', { ...herbicide, plantBackDays: 120 });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect(made.body.data.plantBackDays).toBe(120);
  });

  it('the database refuses a plant-back interval that is not whole days, however it is written', async () => {
    const row = await Material.findOne({ where: { firmId: ctx.firm.id, name: herbicide.name } });
    await expect(Material.update({ definition: { ...row!.definition, plantBackDays: '4 months' } as never }, { where: { id: row!.id } })).rejects.toThrow(/materials_plant_back_days_whole/);
  });

  it('the plan checks warn when the spray date plus the interval falls after the seeding on the same unit', async () => {
    const row = await Material.findOne({ where: { firmId: ctx.firm.id, name: herbicide.name } });
    const base = { firmId: ctx.firm.id, propertyId, unitId: plotId, prescriptionId: null, proposalId: null, practiceName: 'Fall brassica plot', unitName: 'North plot', startDate: null, endDate: null };
    await Task.create({ ...base, stepKey: 'spray', name: 'Burn down the sod', kind: 'spray', earliest: '2026-05-01', latest: '2026-05-15', quantities: [{ key: row!.key, label: herbicide.name, amount: 1, unit: 'gal', rateText: '' }] });
    await Task.create({ ...base, stepKey: 'seed', name: 'Broadcast seed', kind: 'seed', earliest: '2026-08-01', latest: '2026-08-31' });
    const res = await consultant.get(`/api/properties/${propertyId}/plan`);
    expect(res.status).toBe(200);
    const summary = PlanSummarySchema.parse(res.body.data);
    const warning = summary.warnings.find((w) => w.code === 'plant-back');
    // 2026-05-01 + 120 days = 2026-08-29; seeding 2026-08-01 is 28 days early (calendar arithmetic, no source).
    expect(warning?.unitIds).toEqual([plotId]);
    expect(warning?.message).toContain('28 days too early');
  });
});

describe('rotation in the plan checks', () => {
  it('warns when a plot carries the same crop family two seasons running (common practice, no source)', async () => {
    const first = (await Prescription.findOne({ where: { unitId: plotId } }))!;
    const again = await send('post', `/api/units/${plotId}/prescriptions`, { practiceId: first.practiceId, year: first.year + 1 });
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    const res = await consultant.get(`/api/properties/${propertyId}/plan`);
    const summary = PlanSummarySchema.parse(res.body.data);
    const warning = summary.warnings.find((w) => w.code === 'rotation');
    expect(warning?.unitIds).toEqual([plotId]);
    expect(warning?.message).toMatch(/brassica crops in \d{4} and \d{4}/);
    expect((await Practice.findByPk(first.practiceId))!.key).toBe('fall-brassica-plot');
  });
});
