import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeClient, makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Practice, Task, TaskPhoto } from '../../server/models';
import { PortalPropertiesSchema, PortalPropertyDetailSchema } from '../../shared/schemas/portal';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let client: Agent;
let secondContact: Agent;
let otherClient: Agent;
let crew: Agent;
let farmId: number;
let secondPropertyId: number;
let otherPropertyId: number;
let plotId: number;

const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  // A second contact of the same client (another household member) signs in with their own account.
  const second = await makeUser(ctx.firm.id, 'client', ctx.client.id);
  secondContact = await signedInAgent(second.email, PASSWORD);
  const other = await makeClient(ctx.firm.id, 'Another Club');
  otherClient = await signedInAgent((await makeUser(ctx.firm.id, 'client', other.id)).email, PASSWORD);
  farmId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  secondPropertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  otherPropertyId = (await makeProperty(ctx.firm.id, other.id)).id;

  const plot = await send(consultant, 'post', `/api/properties/${farmId}/units`, { kind: 'food-plot', name: 'North plot', geometry: rectangle(-90.938, 43.2655, 120, 80) });
  expect(plot.status).toBe(201);
  plotId = plot.body.data.id;
  const timber = await send(consultant, 'post', `/api/properties/${farmId}/units`, { kind: 'timber', name: 'Oak slope', geometry: rectangle(-90.936, 43.2655, 200, 150) });
  expect(timber.status).toBe(201);
  const tsi = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'tsi-hinge-cut' } }))!.id;
  expect((await send(consultant, 'post', `/api/units/${timber.body.data.id}/prescriptions`, { practiceId: tsi })).status).toBe(201);

  // Three tasks on the plot worth 100, 200 and 300 cents; the first two done, one with a photo.
  const base = { firmId: ctx.firm.id, propertyId: farmId, unitId: plotId, prescriptionId: null, proposalId: null, kind: 'seed', practiceName: 'Clover plot', unitName: 'North plot', earliest: '2026-04-01', latest: '2026-05-15', startDate: null, endDate: null, assigneeId: null };
  const t1 = await Task.create({ ...base, stepKey: 'lime', name: 'Spread lime', status: 'done', costCents: 100, doneOn: '2026-04-03' });
  await Task.create({ ...base, stepKey: 'disk', name: 'Disk the plot', status: 'done', costCents: 200, doneOn: '2026-04-10' });
  await Task.create({ ...base, stepKey: 'seed', name: 'Seed clover', status: 'planned', costCents: 300 });
  await TaskPhoto.create({ firmId: ctx.firm.id, taskId: t1.id, storageKey: 'photos/00000000000000000000000000000000.png', originalName: 'lime.png', contentType: 'image/png', byteSize: 10, latitude: null, longitude: null, takenAt: null, uploadedById: null });
});

describe('GET /api/portal/properties', () => {
  it('lists the signed-in client’s properties only, with percent done by cost', async () => {
    const res = await client.get('/api/portal/properties');
    expect(res.status).toBe(200);
    const body = PortalPropertiesSchema.parse(res.body.data);
    expect(body.properties.map((p) => p.id).sort()).toEqual([farmId, secondPropertyId].sort());
    const farm = body.properties.find((p) => p.id === farmId)!;
    expect(farm.unitCount).toBe(2);
    // (100 + 200) / (100 + 200 + 300) = 50 % — arithmetic of the weights, common practice, no source.
    expect(farm.percentDone).toBe(50);
    expect(body.properties.find((p) => p.id === secondPropertyId)!.percentDone).toBeNull();
  });

  it('answers two contacts of one client with the same properties', async () => {
    const a = (await client.get('/api/portal/properties')).body.data.properties.map((p: { id: number }) => p.id);
    const b = (await secondContact.get('/api/portal/properties')).body.data.properties.map((p: { id: number }) => p.id);
    expect(b).toEqual(a);
    expect(a.length).toBe(2);
  });

  it('refuses staff and crew on the client routes (they use the preview)', async () => {
    expect((await consultant.get('/api/portal/properties')).status).toBe(403);
    expect((await crew.get('/api/portal/properties')).status).toBe(403);
  });
});

describe('GET /api/portal/properties/:id', () => {
  it('answers the plan with units and acres, plain-language prescriptions, cautions, share by kind and progress without money', async () => {
    const res = await client.get(`/api/portal/properties/${farmId}`);
    expect(res.status).toBe(200);
    const d = PortalPropertyDetailSchema.parse(res.body.data);
    expect(d.units.map((u) => u.name).sort()).toEqual(['North plot', 'Oak slope']);
    const plot = d.units.find((u) => u.name === 'North plot')!;
    // 120 m × 80 m = 9600 m² = 2.372 acres (1 acre = 4046.8564224 m², NIST SP 811 / shared/units.ts).
    expect(plot.acres).toBeCloseTo(2.372, 2);
    expect(plot.workStatus).toBe('in-progress');
    expect(plot.progress).toMatchObject({ total: 3, done: 2, percentByCount: 66.7, percentByCost: 50 });
    const oak = d.units.find((u) => u.name === 'Oak slope')!;
    expect(oak.prescriptions).toHaveLength(1);
    expect(oak.prescriptions[0].summary.length).toBeGreaterThan(20);
    // Hinge-cutting carries the chainsaw and hinge-cutting cautions (shared/domain/cautions.ts STEP_KIND_CAUTIONS).
    expect(d.cautions.map((c) => c.id)).toEqual(expect.arrayContaining(['hinge-cutting', 'chainsaw']));
    expect(d.shareByKind.map((r) => r.kind)).toEqual(expect.arrayContaining(['food-plot', 'timber']));
    expect(d.progress).toMatchObject({ total: 3, done: 2, open: 1, percentByCost: 50 });
    expect(d.tasks.map((t) => t.name)).toEqual(['Spread lime', 'Disk the plot', 'Seed clover']);
    expect(d.tasks[0].photos[0].url).toMatch(/^\/api\/task-photos\/\d+$/);
    // Never any cents: the answer holds no money field at all.
    expect(JSON.stringify(res.body)).not.toMatch(/Cents/);
  });

  it('answers 404 for another client’s property, a missing one and a bad id', async () => {
    expect((await otherClient.get(`/api/portal/properties/${farmId}`)).status).toBe(404);
    expect((await client.get(`/api/portal/properties/${otherPropertyId}`)).status).toBe(404);
    expect((await client.get('/api/portal/properties/99999999')).status).toBe(404);
    const bad = await client.get('/api/portal/properties/abc');
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/id/);
  });

  it('answers the second contact the same plan', async () => {
    const a = (await client.get(`/api/portal/properties/${farmId}`)).body.data;
    const b = (await secondContact.get(`/api/portal/properties/${farmId}`)).body.data;
    expect(b).toEqual(a);
  });
});

describe('preview as client', () => {
  it('gives staff of the firm exactly what the client reads, without a client session', async () => {
    const own = (await client.get(`/api/portal/properties/${farmId}`)).body.data;
    const preview = await consultant.get(`/api/portal/preview/${ctx.client.id}/properties/${farmId}`);
    expect(preview.status).toBe(200);
    expect(preview.body.data).toEqual(own);
    const list = await consultant.get(`/api/portal/preview/${ctx.client.id}/properties`);
    expect(list.body.data).toEqual((await client.get('/api/portal/properties')).body.data);
    // The consultant is still the consultant afterwards.
    expect((await consultant.get('/api/auth/me')).body.data.user.role).toBe('consultant');
  });

  it('keeps the client scope in preview: another client’s property is 404 there too', async () => {
    expect((await consultant.get(`/api/portal/preview/${ctx.client.id}/properties/${otherPropertyId}`)).status).toBe(404);
  });

  it('refuses clients, crew and other firms', async () => {
    expect((await client.get(`/api/portal/preview/${ctx.client.id}/properties`)).status).toBe(403);
    expect((await crew.get(`/api/portal/preview/${ctx.client.id}/properties`)).status).toBe(403);
    const stranger = await makeFirm();
    const outsider = await signedInAgent(stranger.users.consultant.email, PASSWORD);
    expect((await outsider.get(`/api/portal/preview/${ctx.client.id}/properties`)).status).toBe(404);
    expect((await outsider.get(`/api/portal/preview/${ctx.client.id}/properties/${farmId}`)).status).toBe(404);
  });
});
