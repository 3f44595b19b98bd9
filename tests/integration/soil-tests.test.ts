import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { Firm, Prescription } from '../../server/models';
import { SoilTest } from '../../server/models/soil-test';
import { SoilTestDtoSchema } from '../../shared/schemas/soil-tests';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
let outsider: Agent;
let propertyId: number;
let plotId: number;

const post = (agent: Agent, url: string, body: unknown) => agent.post(url).set('X-CSRF-Token', agent.csrf).send(body as object);

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  outsider = await signedInAgent((await makeFirm()).users.consultant.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
});

describe('a soil test by the University of Missouri ENM method (the default outside the south)', () => {
  it('answers the lime from the lab’s ENM and the lime’s ENM per ton', async () => {
    await Firm.update({ settings: {}, region: 'midwest' }, { where: { id: ctx.firm.id } });
    const res = await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-10', lab: 'County lab', ph: 5.4, bufferMethod: 'woodruff', bufferPh: 6.6, enmLbPerAcre: 1600, pPpm: 20, kPpm: 110 });
    expect(res.status).toBe(201);
    const data = SoilTestDtoSchema.parse(res.body.data);
    // 1,600 lb ENM ÷ 400 lb ENM/ton (starter library's spread lime) = 4 t/acre (University of Missouri)
    expect(data.lime.tonsPerAcre).toBe(4);
    expect(data.lime.method).toBe('missouri');
    // Brassica plot: P (25 − 20) × 20 ÷ 4 + 40 = 65 (Tri-State: critical 25 ppm Bray P1, 20 lb P2O5/ppm, 4 years);
    // K 110 ≥ 105 ppm, the critical level without a CEC (2020 Tri-State 120 ppm Mehlich-3 ÷ 1.14, Ohio State ANR-75): maintenance 60 only (from memory)
    expect(data.nutrients).toMatchObject({ p2o5LbPerAcre: 65, k2oLbPerAcre: 60 });
    expect(res.body.data.labMethod).toBe('bray-nh4oac'); // the default: what the Tri-State rules are calibrated on
    expect(data.retestDue).toBe('2029-03-10'); // 3 years by default
  });

  it('writes the recommendation into the prescription with its source, still editable', async () => {
    const made = await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-11', lab: 'County lab', ph: 5.4, enmLbPerAcre: 1200, pPpm: 20, kPpm: 110 });
    const res = await post(consultant, `/api/soil-tests/${made.body.data.id}/apply`, {});
    expect(res.status).toBe(200);
    const prescription = await Prescription.findByPk(res.body.data.prescriptionId);
    expect(prescription!.parameters.steps!.lime!.limeTonsPerAcre).toBe(3); // 1,200 ÷ 400 (MU Extension)
    expect(prescription!.parameters.steps!.fertilize).toMatchObject({ p2o5LbPerAcre: 65, k2oLbPerAcre: 60 });
    expect(prescription!.notes).toMatch(/from the soil test of Mar 11, 2026.*University of Missouri/);
    const edit = await consultant.patch(`/api/prescriptions/${prescription!.id}`).set('X-CSRF-Token', consultant.csrf).send({ parameters: { steps: { lime: { limeTonsPerAcre: 2.5 } } } });
    expect(edit.status).toBe(200);
  });
});

describe('a Mehlich-3 soil test', () => {
  it('stores the lab method and works P and K on the Bray/ammonium-acetate equivalents (Ohio State ANR-75)', async () => {
    await Firm.update({ settings: {}, region: 'midwest' }, { where: { id: ctx.firm.id } });
    // M3 P 27 ÷ 1.35 = 20 Bray P1 → (25 − 20) × 20 ÷ 4 + 40 = 65; M3 K 114 ÷ 1.14 = 100 → (105 − 100) × 8 ÷ 4 + 60 = 70 (worked by hand from ANR-75 and the Tri-State rules)
    const res = await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-12', lab: 'Commercial lab', ph: 6.6, labMethod: 'mehlich-3', pPpm: 27, kPpm: 114 });
    expect(res.status).toBe(201);
    const data = SoilTestDtoSchema.parse(res.body.data);
    expect(data.nutrients).toMatchObject({ p2o5LbPerAcre: 65, k2oLbPerAcre: 70 });
    expect(data.nutrients.working).toMatch(/Bray P1 20, ammonium-acetate K 100/);
    expect(res.body.data).toMatchObject({ labMethod: 'mehlich-3', pPpm: 27, kPpm: 114 }); // the lab's own numbers are kept
    const row = await SoilTest.findByPk(data.id);
    expect(row!.labMethod).toBe('mehlich-3');
  });

  it('refuses a method it does not know, naming the field, and saves nothing', async () => {
    const before = await SoilTest.count({ where: { unitId: plotId } });
    const res = await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-12', lab: 'Commercial lab', ph: 6.6, labMethod: 'olsen', pPpm: 27 });
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body)).toMatch(/labMethod/);
    expect(await SoilTest.count({ where: { unitId: plotId } })).toBe(before);
  });
});

describe('a soil test by the NCDA&CS method (firm setting)', () => {
  it('reproduces the published worked example through the API', async () => {
    await Firm.update({ settings: { limeMethod: 'ncdacs', soilRetestYears: 2 } }, { where: { id: ctx.firm.id } });
    try {
    // Brassica target pH 6.3 (from memory): acidity (6.6 − 6.3) × 4 = 1.2; × (6.3 − 5.0) ÷ (6.6 − 5.0) = 0.975 t/acre (NCDA&CS formula)
    const res = await post(consultant, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-04-01', lab: 'State lab', ph: 5.0, bufferPh: 6.3, bufferMethod: 'mehlich' });
    expect(res.status).toBe(201);
    expect(res.body.data.lime.tonsPerAcre).toBe(0.98);
    expect(res.body.data.retestDue).toBe('2028-04-01');
    } finally {
      await Firm.update({ settings: {} }, { where: { id: ctx.firm.id } });
    }
  });
});

describe('the lab CSV import by unit name', () => {
  it('stores every row, or none when one row is wrong', async () => {
    const good = 'unit,sampledOn,lab,ph,enmLbPerAcre,pPpm,kPpm\nNorth plot,2026-05-01,County lab,5.8,800,40,180\nnorth plot,2026-05-02,County lab,6.1,400,45,190\n';
    const res = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv: good });
    expect(res.status).toBe(201);
    expect(res.body.data.map((d: { lime: { tonsPerAcre: number } }) => d.lime.tonsPerAcre)).toEqual([2, 1]); // 800 ÷ 400, 400 ÷ 400
    const before = await SoilTest.count({ where: { unitId: plotId } });
    const bad = 'unit,sampledOn,lab,ph,enmLbPerAcre\nNorth plot,2026-06-01,County lab,6.0,400\nSouth field,2026-06-01,County lab,6.0,400\n';
    const refused = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv: bad });
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatch(/row 3, unit: “South field” is not a unit/);
    expect(await SoilTest.count({ where: { unitId: plotId } })).toBe(before);
  });
});

describe('bad input: 422 naming the field, nothing saved', () => {
  const cases: [string, unknown, RegExp][] = [
    ['a pH outside 3–10', { sampledOn: '2026-03-10', lab: 'x', ph: 11 }, /ph must lie between 3 and 10/],
    ['a buffer the state method does not use', { sampledOn: '2026-03-10', lab: 'x', ph: 5.5, bufferPh: 6.5, bufferMethod: 'smp', enmLbPerAcre: 800 }, /bufferMethod.*woodruff/i],
    ['a Missouri test without the lab’s ENM below the target pH', { sampledOn: '2026-03-10', lab: 'x', ph: 5.5 }, /enmLbPerAcre/],
    ['a buffer method without its buffer pH', { sampledOn: '2026-03-10', lab: 'x', ph: 5.5, bufferMethod: 'woodruff' }, /bufferPh/],
  ];
  for (const [label, body, message] of cases) {
    it(`refuses ${label}`, async () => {
      const before = await SoilTest.count({ where: { unitId: plotId } });
      const res = await post(consultant, `/api/units/${plotId}/soil-tests`, body);
      expect(res.status).toBe(422);
      expect(res.body.error).toMatch(message);
      expect(await SoilTest.count({ where: { unitId: plotId } })).toBe(before);
    });
  }
});

describe('who may see and write soil tests', () => {
  it('keeps crew and other firms out, and lists retests due for the Desk', async () => {
    expect((await post(crew, `/api/units/${plotId}/soil-tests`, { sampledOn: '2026-03-10', lab: 'x', ph: 6 })).status).toBe(403);
    expect((await outsider.get(`/api/units/${plotId}/soil-tests`)).status).toBe(404);
    const list = await consultant.get(`/api/units/${plotId}/soil-tests`).expect(200);
    expect(list.body.data.length).toBeGreaterThanOrEqual(4);
    await SoilTest.create({ firmId: ctx.firm.id, propertyId, unitId: plotId, sampledOn: '2019-04-01', lab: 'Old lab', ph: 6, bufferPh: null, bufferMethod: null, pPpm: null, kPpm: null, organicMatterPct: null, cec: null, enmLbPerAcre: null, cropGroup: 'brassica', recommendation: { lime: { method: 'missouri', targetPh: 6.3, tonsPerAcre: 0, working: '', source: '' }, nutrients: { p2o5LbPerAcre: 0, k2oLbPerAcre: 0, working: '', source: '' } }, retestDue: '2022-04-01', appliedPrescriptionId: null, createdById: null });
    const due = await consultant.get('/api/soil-tests/retests-due').expect(200);
    // The unit's latest test (2026) is not due, so the old one does not count.
    expect(due.body.data.some((d: { unitId: number }) => d.unitId === plotId)).toBe(false);
  });
});

describe('the lab CSV import with the lab’s own column names', () => {
  it('stores every row through a column mapping', async () => {
    await Firm.update({ settings: {}, region: 'midwest' }, { where: { id: ctx.firm.id } });
    const csv = 'Field ID,Date,Laboratory,Soil pH,ENM,P (ppm),K (ppm)\nNorth plot,2026-07-01,Valley lab,5.6,"1,200",25,140\n';
    const columns = { unit: 'Field ID', sampledOn: 'Date', lab: 'Laboratory', ph: 'Soil pH', enmLbPerAcre: 'ENM', pPpm: 'P (ppm)', kPpm: 'K (ppm)' };
    const res = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv, columns });
    expect(res.status).toBe(201);
    const [row] = res.body.data.map((d: unknown) => SoilTestDtoSchema.parse(d));
    expect(row.lime.tonsPerAcre).toBe(3); // 1,200 lb ENM ÷ 400 lb ENM/ton (University of Missouri)
  });

  it('reads the lab’s extractant column and converts a Mehlich-3 row before the rules', async () => {
    const csv = 'Field ID,Date,Laboratory,Soil pH,ENM,Extractant,P (ppm),K (ppm)\nNorth plot,2026-07-02,Valley lab,6.6,,Mehlich-3,27,114\n';
    const res = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv });
    expect(res.status).toBe(201);
    // ANR-75: 27 ÷ 1.35 = 20 Bray P1, 114 ÷ 1.14 = 100 ppm AA-K → P2O5 65, K2O 70 on the brassica plot (as worked above)
    expect(res.body.data[0]).toMatchObject({ labMethod: 'mehlich-3', nutrients: { p2o5LbPerAcre: 65, k2oLbPerAcre: 70 } });
  });

  it('names every wrong row and field and stores none', async () => {
    const before = await SoilTest.count({ where: { unitId: plotId } });
    const csv = 'Field ID,Date,Laboratory,Soil pH,ENM\nNorth plot,2026-08-01,Valley lab,5.6,400\nNorth plot,2026-08-01,Valley lab,12,400\nBack forty,2026-08-01,Valley lab,6.0,400\nNorth plot,2026-08-01,,6.0,400\n';
    const columns = { unit: 'Field ID', sampledOn: 'Date', lab: 'Laboratory', ph: 'Soil pH', enmLbPerAcre: 'ENM' };
    const res = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv, columns });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/^Nothing was saved: 3 of 4 rows need changes/);
    const problems = (res.body.details as { row: number; field: string }[]).map((p) => `${p.row}:${p.field}`);
    expect(problems).toEqual(['3:ph', '4:unit', '5:lab']);
    expect(await SoilTest.count({ where: { unitId: plotId } })).toBe(before);
  });

  it('asks for the required columns no mapping names', async () => {
    const res = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv: 'Field ID,Soil pH\nNorth plot,6\n', columns: { unit: 'Field ID' } });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/columns: say which column holds date sampled, laboratory, soil ph/);
    const stray = await post(consultant, `/api/properties/${propertyId}/soil-tests/import`, { csv: 'Field ID,Soil pH\nNorth plot,6\n', columns: { unit: 'Field', ph: 'Soil pH' } });
    expect(stray.status).toBe(422);
    expect(stray.body.error).toMatch(/columns.unit: the file has no column “Field”/);
  });
});

describe('the context the browser previews a soil test with', () => {
  it('gives the firm’s method and each unit’s crop group and target pH', async () => {
    await Firm.update({ settings: { limeMethod: 'ncdacs', soilRetestYears: 4 } }, { where: { id: ctx.firm.id } });
    try {
      const res = await consultant.get(`/api/properties/${propertyId}/soil-test-context`);
      expect(res.status).toBe(200);
      expect(res.body.data).toMatchObject({ method: 'ncdacs', buffers: ['mehlich'], retestYears: 4 });
      // the brassica plot's target pH 6.3 (from memory, TARGET_PH) and the starter library's 400 lb ENM/ton lime
      expect(res.body.data.units).toContainEqual(expect.objectContaining({ unitId: plotId, cropGroup: 'brassica', targetPh: 6.3, limeEnmLbPerTon: 400 }));
      expect((await crew.get(`/api/properties/${propertyId}/soil-test-context`)).status).toBe(403);
      expect((await outsider.get(`/api/properties/${propertyId}/soil-test-context`)).status).toBe(404);
    } finally {
      await Firm.update({ settings: {} }, { where: { id: ctx.firm.id } });
    }
  });
});

describe('the firm’s soil-test settings', () => {
  it('the owner chooses the method and the retest years; bad values are refused naming the field', async () => {
    const owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
    const patch = (body: unknown) => owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send(body as object);
    try {
      const res = await patch({ limeMethod: 'ncdacs', soilRetestYears: 2 });
      expect(res.status).toBe(200);
      expect(res.body.data.settings).toMatchObject({ limeMethod: 'ncdacs', soilRetestYears: 2 });
      expect((await consultant.get(`/api/properties/${propertyId}/soil-test-context`)).body.data).toMatchObject({ method: 'ncdacs', retestYears: 2 });
      const bad = await patch({ limeMethod: 'mehlich' });
      expect(bad.status).toBe(422);
      expect(bad.body.error).toMatch(/limeMethod must be one of ncdacs, missouri/);
      expect((await patch({ soilRetestYears: 0 })).body.error).toMatch(/soilRetestYears: at least 1 year/);
      // Back to the region's method (midwest: Missouri) and the default 3 years when unset.
      const cleared = await patch({ limeMethod: null });
      expect(cleared.body.data.settings).toMatchObject({ limeMethod: null, soilRetestYears: 2 });
      expect((await consultant.get(`/api/properties/${propertyId}/soil-test-context`)).body.data.method).toBe('missouri');
    } finally {
      await Firm.update({ settings: {} }, { where: { id: ctx.firm.id } });
    }
  });
});
