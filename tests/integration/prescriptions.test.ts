import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Material, Practice } from '../../server/models';

let consultant: Agent;
let ctx: Awaited<ReturnType<typeof makeFirm>>;
let propertyId: number;
const post = (url: string, body: unknown) => consultant.post(url).set('X-CSRF-Token', consultant.csrf).send(body as object);
const patch = (url: string, body: unknown) => consultant.patch(url).set('X-CSRF-Token', consultant.csrf).send(body as object);

async function practiceId(key: string): Promise<number> {
  return (await Practice.findOne({ where: { firmId: ctx.firm.id, key } }))!.id;
}

async function foodPlot(widthM = 120, heightM = 80) {
  const res = await post(`/api/properties/${propertyId}/units`, { kind: 'food-plot', name: `Plot ${Math.random()}`, geometry: rectangle(-90.938, 43.262, widthM, heightM) });
  expect(res.status).toBe(201);
  return res.body.data as { id: number; acres: number };
}

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
});

describe('the practice library', () => {
  it('starts every firm with the starter library: at least 12 practices, with cautions', async () => {
    const res = await consultant.get('/api/practices').expect(200);
    expect(res.body.data.length).toBeGreaterThanOrEqual(12);
    const brassica = res.body.data.find((p: { key: string }) => p.key === 'fall-brassica-plot');
    expect(brassica.cautions.map((c: { id: string }) => c.id)).toContain('herbicide');
    expect(brassica.steps.map((s: { key: string }) => s.key)).toEqual(expect.arrayContaining(['soil-test', 'lime', 'burn-down', 'seed']));
    const materials = await consultant.get('/api/materials?kind=seed').expect(200);
    expect(materials.body.data.every((m: { kind: string }) => m.kind === 'seed')).toBe(true);
    expect((await consultant.get('/api/rates').expect(200)).body.data.length).toBeGreaterThan(5);
  });

  it('adds a seed material and refuses impossible values with 422 naming the field, saving nothing', async () => {
    const before = await Material.count({ where: { firmId: ctx.firm.id } });
    const purity = await post('/api/materials', { kind: 'seed', name: 'Bad clover', species: 'white clover', purityPct: 120, germinationPct: 85, packageSizeLb: 5, packagePriceCents: 4000 });
    expect(purity.status).toBe(422);
    expect(purity.body.details[0].path).toBe('purityPct');
    expect(purity.body.error).toMatch(/between 0 and 100/);
    const grade = await post('/api/materials', { kind: 'fertilizer', name: 'Impossible blend', grade: '60-40-20', bagSizeLb: 50, bagPriceCents: 2500 });
    expect(grade.status).toBe(422);
    expect(grade.body.details[0].path).toBe('grade');
    const negative = await post('/api/materials', { kind: 'seed', name: 'Negative rye', species: 'cereal rye', purityPct: 98, germinationPct: 85, rateLbPerAcre: -90, packageSizeLb: 50, packagePriceCents: 2500 });
    expect(negative.status).toBe(422);
    expect(negative.body.details[0].path).toBe('rateLbPerAcre');
    expect(await Material.count({ where: { firmId: ctx.firm.id } })).toBe(before);
    const ok = await post('/api/materials', { kind: 'seed', name: 'Medium red clover', species: 'red clover', purityPct: 99, germinationPct: 88, rateLbPerAcre: 12, packageSizeLb: 50, packagePriceCents: 21000 });
    expect(ok.status).toBe(201);
    expect(ok.body.data).toMatchObject({ kind: 'seed', type: 'seed', purityPct: 99, germinationPct: 88, rateLbPerAcre: 12 });
  });

  it('refuses a practice whose step uses a material the firm does not have', async () => {
    const res = await post('/api/practices', {
      name: 'Ghost plot',
      unitKinds: ['food-plot'],
      measure: 'acres',
      windowKey: 'clover',
      anchorStepKey: 'seed',
      summary: { action: 'Plant', subject: 'ghost clover', purpose: 'test' },
      steps: [{ key: 'seed', kind: 'seed', name: 'Seed', application: { type: 'seed', method: 'broadcast', components: [{ materialKey: 'no-such-seed', rateLbPerAcre: 5, rateBasis: 'bulk' }] } }],
    });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/no-such-seed/);
  });
});

describe('prescriptions', () => {
  it('writes a fall brassica prescription with seed, lime, fertilizer and herbicide quantities, schedule, cost and cautions', async () => {
    const plot = await foodPlot();
    const res = await post(`/api/units/${plot.id}/prescriptions`, { practiceId: await practiceId('fall-brassica-plot'), year: 2027, targetDate: '2027-08-20' });
    expect(res.status).toBe(201);
    const p = res.body.data;
    const acres = plot.acres;
    // Seed: the starter mix is 2.7 + 1.65 + 4 = 8.35 lb/acre broadcast (rates within Cook & Gray 2003, Alabama DCNR).
    expect(p.bulkSeedLb).toBeCloseTo(8.35 * acres, 1);
    expect(p.limeTons).toBeCloseTo(2 * acres, 1); // 2 t/acre soil-test recommendation in the starter practice
    // 13-13-13 at 40 lb N → 307.7 lb/acre, plus 46-0-0 topdress at 40 lb N → 87.0 lb/acre (product = nutrient ÷ grade).
    expect(p.fertilizerProductLb).toBeCloseTo((40 / 0.13 + 40 / 0.46) * acres, 0);
    expect(p.herbicideProductGal).toBeGreaterThanOrEqual(0.5 * acres); // glyphosate 2 qt/acre
    expect(p.tankLoads).toBe(Math.ceil((15 * acres) / 25)); // 15 GPA, 25-gal tank
    const linesTotal = p.lines.reduce((sum: number, l: { amountCents: number }) => sum + l.amountCents, 0);
    expect(p.totalCents).toBe(linesTotal);
    expect(p.totalCents).toBe(p.materialCents + p.laborCents + p.equipmentCents + p.feesCents);
    expect(Number.isInteger(p.totalCents)).toBe(true);
    expect(p.cautions.map((c: { id: string }) => c.id)).toContain('herbicide');
    expect(p.cautions.find((c: { id: string }) => c.id === 'herbicide').text).toMatch(/label is the law/);
    const burnDown = p.schedule.steps.find((s: { stepKey: string }) => s.stepKey === 'burn-down');
    expect(burnDown).toMatchObject({ earliest: '2027-08-06', latest: '2027-08-13' }); // 7–14 days before seeding (common practice)
    expect(p.summary).toMatch(/brassica/i);
  });

  it('recomputes with the soil-test recommendation and refuses impossible parameters with 422', async () => {
    const plot = await foodPlot();
    const created = await post(`/api/units/${plot.id}/prescriptions`, { practiceId: await practiceId('fall-brassica-plot') });
    const three = await patch(`/api/prescriptions/${created.body.data.id}`, { parameters: { steps: { lime: { limeTonsPerAcre: 3 } } } });
    expect(three.status).toBe(200);
    expect(three.body.data.limeTons).toBeCloseTo(3 * plot.acres, 1);
    const zeroTank = await patch(`/api/prescriptions/${created.body.data.id}`, { parameters: { steps: { 'burn-down': { tankGal: 0 } } } });
    expect(zeroTank.status).toBe(422);
    expect(zeroTank.body.details[0].path).toMatch(/tankGal/);
    const negativeN = await patch(`/api/prescriptions/${created.body.data.id}`, { parameters: { steps: { fertilize: { nLbPerAcre: -5 } } } });
    expect(negativeN.status).toBe(422);
    const kept = await consultant.get(`/api/prescriptions/${created.body.data.id}`).expect(200);
    expect(kept.body.data.limeTons).toBeCloseTo(3 * plot.acres, 1);
  });

  it('refuses a practice that does not fit the unit kind', async () => {
    const plot = await foodPlot();
    const res = await post(`/api/units/${plot.id}/prescriptions`, { practiceId: await practiceId('mock-scrape') });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/Mock scrape.*food plot/i);
  });

  it('warns when a brassica planting leaves too few days before the first frost', async () => {
    const plot = await foodPlot();
    const res = await post(`/api/units/${plot.id}/prescriptions`, { practiceId: await practiceId('fall-brassica-plot'), year: 2027, targetDate: '2027-09-28' });
    expect(res.status).toBe(201);
    expect(res.body.data.warnings.map((w: { code: string }) => w.code)).toContain('frost-too-close'); // 60–90 days: common practice
  });

  it('keeps prescriptions inside the firm and away from crew', async () => {
    const plot = await foodPlot();
    const created = await post(`/api/units/${plot.id}/prescriptions`, { practiceId: await practiceId('perennial-clover-chicory') });
    const other = await makeFirm();
    const outsider = await signedInAgent(other.users.consultant.email, PASSWORD);
    await outsider.get(`/api/prescriptions/${created.body.data.id}`).expect(404);
    const foreignPractice = (await Practice.findOne({ where: { firmId: other.firm.id, key: 'fall-brassica-plot' } }))!.id;
    const res = await post(`/api/units/${plot.id}/prescriptions`, { practiceId: foreignPractice });
    expect(res.status).toBe(422);
    const crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
    await crew.get(`/api/units/${plot.id}/prescriptions`).expect(403);
    const list = await consultant.get(`/api/properties/${propertyId}/prescriptions`).expect(200);
    expect(list.body.data.some((p: { id: number }) => p.id === created.body.data.id)).toBe(true);
  });
});
