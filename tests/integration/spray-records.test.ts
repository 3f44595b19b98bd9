import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, propertyWithBrassicaPlot, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { AuditEvent, Material, Task } from '../../server/models';
import { SprayRecord } from '../../server/models/spray-record';
import { SprayRecordListSchema } from '../../shared/schemas/spray-records';
import { SPRAY_CSV_COLUMNS } from '../../shared/domain/spray-records';
import { sequelize } from '../../server/db/sequelize';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
let client: Agent;
let outsider: Agent;
let propertyId: number;
let plotId: number;

const key = () => `test-${crypto.randomUUID()}`;

/** A herbicide step on the plot, assigned to the crew member, planning the given product. */
async function sprayTask(materialKey: string, label: string): Promise<number> {
  const task = await Task.create({
    firmId: ctx.firm.id, propertyId, unitId: plotId, prescriptionId: null, proposalId: null, stepKey: 'burndown', name: 'Burn down the sod', kind: 'spray', practiceName: 'Fall brassica plot', unitName: 'North plot',
    earliest: '2026-07-01', latest: '2026-08-15', startDate: null, endDate: null, assigneeId: ctx.users.crew.id,
    quantities: [{ key: materialKey, label, amount: 0.34, unit: 'gal', rateText: '1.5 qt/acre' }],
    cautions: [{ id: 'herbicide', title: 'Herbicide', text: 'Read the label.' }],
  });
  return task.id;
}

function complete(agent: Agent, taskId: number, spray: unknown, doneOn = '2026-07-20') {
  const req = agent.post(`/api/tasks/${taskId}/complete`).set('X-CSRF-Token', agent.csrf).set('Idempotency-Key', key()).field('doneOn', doneOn);
  return spray === undefined ? req : req.field('spray', typeof spray === 'string' ? spray : JSON.stringify(spray));
}

const application = (over: Record<string, unknown> = {}) => ({
  products: [{ materialKey: 'herb-glyphosate-41', amount: 1.4, unit: 'qt' }],
  cropOrSite: 'Food plot, sod burndown before seeding',
  areaTreatedAcres: 0.22,
  windMph: 4,
  windDirection: 'SW',
  airTempF: 78,
  applicatorName: 'Sam Crew',
  ...over,
});

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  outsider = await signedInAgent((await makeFirm()).users.consultant.email, PASSWORD);
  ({ propertyId, plotId } = await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id));
  // A restricted-use product of our own invention for the rule (reg. no. made up for the test).
  await Material.create({ firmId: ctx.firm.id, key: 'herb-rup-test', name: 'Atrazine 4L (test)', definition: { key: 'herb-rup-test', type: 'herbicide', name: 'Atrazine 4L (test)', activeIngredient: 'atrazine 4 lb/gal', lbAiPerGal: 4, restrictedUse: true, epaRegNo: '12345-67', pricing: { basis: 'per-gal', pricePerGalCents: 3000 } } });
});

describe('completing a herbicide step records the application', () => {
  it('stores the 7 CFR 110.3 fields, the weather and the unit’s centroid, with an audit record', async () => {
    const taskId = await sprayTask('herb-glyphosate-41', 'Glyphosate 41%');
    const res = await complete(crew, taskId, application());
    expect(res.status).toBe(201);
    const rows = await SprayRecord.findAll({ where: { taskId } });
    expect(rows).toHaveLength(1);
    const r = rows[0];
    expect(r).toMatchObject({ appliedOn: '2026-07-20', productName: 'Glyphosate 41% (3 lb a.e./gal)', amount: 1.4, amountUnit: 'qt', unitName: 'North plot', areaTreated: 0.22, windMph: 4, windDirection: 'SW', airTempF: 78, applicatorName: 'Sam Crew', restrictedUse: false });
    // The plot is a 120 m × 80 m rectangle from the corner -90.938, 43.2655 (tests/support): its
    // centre lies 60 m east and 40 m north, about 0.00074° of longitude and 0.00036° of latitude.
    expect(r.latitude).toBeCloseTo(43.2659, 3);
    expect(r.longitude).toBeCloseTo(-90.9373, 3);
    expect(await AuditEvent.count({ where: { action: 'spray-record.created', subjectId: taskId } })).toBe(1);
  });

  it('refuses a herbicide step without its record, and stores nothing', async () => {
    const taskId = await sprayTask('herb-glyphosate-41', 'Glyphosate 41%');
    const res = await complete(crew, taskId, undefined);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/spray: a herbicide step is completed with its spray record/);
    expect((await Task.findByPk(taskId))!.status).not.toBe('done');
  });

  it('refuses bad input with a sentence naming the field', async () => {
    const taskId = await sprayTask('herb-glyphosate-41', 'Glyphosate 41%');
    for (const [bad, pattern] of [
      [application({ windMph: -3 }), /windMph cannot be negative/],
      [application({ windDirection: 'up' }), /windDirection must be one of/],
      [application({ products: [{ materialKey: 'herb-glyphosate-41', amount: 0, unit: 'qt' }] }), /amount: the total amount applied must be more than zero/],
      [application({ products: [{ materialKey: 'seed-wheat', amount: 1, unit: 'qt' }] }), /is not a spray product in your firm’s library/],
      [application({ areaTreatedAcres: 0 }), /areaTreatedAcres: the area treated must be more than zero/],
      ['{not json', /must be JSON/],
    ] as const) {
      const res = await complete(crew, taskId, bad);
      expect(res.status, JSON.stringify(bad)).toBe(422);
      expect(res.body.error).toMatch(pattern);
      expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
    }
    expect(await SprayRecord.count({ where: { taskId } })).toBe(0);
    expect((await Task.findByPk(taskId))!.status).not.toBe('done');
  });
});

describe('restricted-use products need a certified applicator on the task', () => {
  it('is 422 without a certification number, and stores nothing', async () => {
    const taskId = await sprayTask('herb-rup-test', 'Atrazine 4L (test)');
    const res = await complete(crew, taskId, application({ products: [{ materialKey: 'herb-rup-test', amount: 0.5, unit: 'gal' }] }));
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/Atrazine 4L \(test\) is a restricted-use product; only a certified applicator may apply it/);
    expect(await SprayRecord.count({ where: { taskId } })).toBe(0);
    expect((await Task.findByPk(taskId))!.status).not.toBe('done');
  });

  it('records the certified applicator and the EPA Reg. No. from the library', async () => {
    const taskId = await sprayTask('herb-rup-test', 'Atrazine 4L (test)');
    const res = await complete(crew, taskId, application({ products: [{ materialKey: 'herb-rup-test', amount: 0.5, unit: 'gal' }], applicatorName: 'Dana Certified', applicatorCertNo: 'WI-CA-55821' }), '2026-07-22');
    expect(res.status).toBe(201);
    const [r] = await SprayRecord.findAll({ where: { taskId } });
    expect(r).toMatchObject({ restrictedUse: true, epaRegNo: '12345-67', applicatorName: 'Dana Certified', applicatorCertNo: 'WI-CA-55821' });
  });
});

describe('GET /api/spray-records', () => {
  it('answers the season as JSON for staff only, firm-scoped', async () => {
    const res = await consultant.get(`/api/spray-records?season=2026&propertyId=${propertyId}`);
    expect(res.status).toBe(200);
    const data = SprayRecordListSchema.parse(res.body.data);
    expect(data.records.map((r) => r.productName)).toEqual(['Glyphosate 41% (3 lb a.e./gal)', 'Atrazine 4L (test)']);
    expect(data.records[0].keepUntil).toBe('2028-07-20'); // two years (7 CFR 110.5)
    expect(data.caution).toMatch(/The label is the law/);
    expect((await consultant.get('/api/spray-records?season=2025')).body.data.records).toEqual([]);
    expect((await crew.get('/api/spray-records?season=2026')).status).toBe(403);
    expect([403, 404]).toContain((await client.get('/api/spray-records?season=2026')).status);
    expect((await outsider.get(`/api/spray-records?season=2026&propertyId=${propertyId}`)).status).toBe(404);
    expect((await outsider.get('/api/spray-records?season=2026')).body.data.records).toEqual([]);
  });

  it('refuses a bad query with a sentence', async () => {
    for (const [q, pattern] of [['season=26', /season: a year from 2000 on/], ['season=2026&format=xls', /format must be json, csv or pdf/], ['', /season/], ['season=2026&propertyId=abc', /propertyId/]] as const) {
      const res = await consultant.get(`/api/spray-records?${q}`);
      expect(res.status, q).toBe(422);
      expect(res.body.error).toMatch(pattern);
    }
  });

  it('exports CSV with every column', async () => {
    const res = await consultant.get(`/api/spray-records?season=2026&propertyId=${propertyId}&format=csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual([...SPRAY_CSV_COLUMNS]);
    expect(rows).toHaveLength(2);
    expect(rows[1]).toMatchObject({ Date: '2026-07-22', Unit: 'North plot', 'Crop or site': 'Food plot, sod burndown before seeding', 'Area treated': '0.22', 'Area unit': 'acres', Product: 'Atrazine 4L (test)', 'EPA Reg. No.': '12345-67', 'Restricted use': 'yes', 'Total amount applied': '0.5', 'Amount unit': 'gal', Applicator: 'Dana Certified', 'Certification No.': 'WI-CA-55821', 'Wind (mph)': '4', 'Wind from': 'SW', 'Air temperature (°F)': '78' });
    expect(Number(rows[1].Latitude)).toBeCloseTo(43.2659, 3);
    expect(rows[0]['EPA Reg. No.']).toBe(''); // the starter glyphosate carries no EPA Reg. No.
  });

  it('exports a PDF from the worker pool with the fields and the caution', async () => {
    const res = await consultant.get(`/api/spray-records?season=2026&propertyId=${propertyId}&format=pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    if (process.env.SPRAY_PDF_OUT) writeFileSync(process.env.SPRAY_PDF_OUT, res.body as Buffer);
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: res.body as Buffer }).toString().replace(/\s+/g, ' ');
    for (const expected of ['Spray records, 2026', 'Jul 20, 2026', 'North plot', '43.2659 N, 90.9373 W', 'EPA Reg. No. 12345-67', 'RESTRICTED USE', 'Cert. No. WI-CA-55821', 'Dana Certified', '0.5 gal', '0.22 acres', 'from SW', '78 °F', 'The label is the law', 'at least two years']) {
      expect(text).toContain(expected);
    }
  });
});

describe('records younger than two years are kept', () => {
  it('has no delete route, and the database refuses a delete', async () => {
    const [r] = await SprayRecord.findAll({ where: { firmId: ctx.firm.id }, limit: 1 });
    const del = await consultant.delete(`/api/spray-records/${r.id}`).set('X-CSRF-Token', consultant.csrf);
    expect(del.status).toBe(404);
    await expect(sequelize.query('DELETE FROM spray_records WHERE id = :id', { replacements: { id: r.id } })).rejects.toThrow(/kept at least two years/);
    expect(await SprayRecord.count({ where: { id: r.id } })).toBe(1);
  });
});
