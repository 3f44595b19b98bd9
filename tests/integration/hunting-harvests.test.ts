/**
 * Harvests from the hunters: a client's contacts may record a deer taken on their own land when the
 * consultant turned sit logging on, linked to a stand site and a sit, with the state's disease-sampling
 * number; bad links answer 422 naming the field and save nothing. The season report carries a section
 * on pressure and sits.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Agent } from '../support/test-app';
import { send, type FirmContext } from '../support/firm-settings';
import { huntingSetup, STAND } from '../support/hunting-setup';
import { makeClient, makeProperty } from '../support/factories';
import { HarvestRecord, Sit } from '../../server/models';
import { SitSchema } from '../../shared/schemas/hunting';
import { buildSeasonPressure } from '../../server/queries/season-pressure';

let ctx: FirmContext;
let consultant: Agent;
let client: Agent;
let crew: Agent;
let propertyId: number;
let standId: number;
let otherStandId: number;
let plotId: number;
let sitId: number;

const harvest = (over: Record<string, unknown> = {}) => ({ date: '2025-11-15', sex: 'male', ageClass: '2.5', dressedWeightLb: 131, antlerPoints: 8, hunter: 'Priya', ...over });

beforeAll(async () => {
  const setup = await huntingSetup();
  ({ ctx, consultant, client, crew, propertyId, standId } = setup);
  const unit = setup.addUnit;
  otherStandId = await unit({ kind: 'stand-site', name: 'Creek hang-on', geometry: { type: 'Point', coordinates: [STAND[0] + 0.003, STAND[1]] } });
  plotId = await unit({ kind: 'food-plot', name: 'Clover', geometry: { type: 'Polygon', coordinates: [[[STAND[0], STAND[1] - 0.001], [STAND[0] + 0.0008, STAND[1] - 0.001], [STAND[0] + 0.0008, STAND[1] - 0.0005], [STAND[0], STAND[1] - 0.0005], [STAND[0], STAND[1] - 0.001]]] } });
  const sit = await consultant
    .post(`/api/properties/${propertyId}/sits`)
    .set('X-CSRF-Token', consultant.csrf)
    .set('Idempotency-Key', `harvest-sit-${Date.now()}`)
    .send({ standUnitId: standId, startedAt: '2025-11-15T21:00:00.000Z', endedAt: '2025-11-15T23:30:00.000Z', windFrom: 'N', seen: { bucks: 1, does: 2, fawns: 0 } });
  expect(sit.status, JSON.stringify(sit.body)).toBe(201);
  sitId = SitSchema.parse(sit.body.data).id;
});

describe('harvests by allowed hunters', () => {
  it('refuses the client until sit logging is on, then records a harvest linked to the stand and sit with the sampling number', async () => {
    const before = await HarvestRecord.count({ where: { propertyId } });
    const refused = await send(client, 'post', `/api/properties/${propertyId}/harvests`, harvest({ standUnitId: standId, sitId }));
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/not turned on/);
    expect(await HarvestRecord.count({ where: { propertyId } })).toBe(before);

    expect((await send(consultant, 'put', `/api/clients/${ctx.client.id}/sit-logging`, { allowed: true })).status).toBe(200);
    const ok = await send(client, 'post', `/api/properties/${propertyId}/harvests`, harvest({ standUnitId: standId, sitId, diseaseSampleNumber: ' WI-CWD 2025-0412 ' }));
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.data).toMatchObject({ standUnitId: standId, standName: 'Oak ladder', sitId, diseaseSampleNumber: 'WI-CWD 2025-0412' });

    // The sit alone is enough: the stand is taken from it.
    const fromSit = await send(client, 'post', `/api/properties/${propertyId}/harvests`, harvest({ sex: 'female', antlerPoints: null, sitId }));
    expect(fromSit.status, JSON.stringify(fromSit.body)).toBe(201);
    expect(fromSit.body.data.standUnitId).toBe(standId);

    const list = await client.get(`/api/properties/${propertyId}/harvests`);
    expect(list.body.data.find((h: { id: number }) => h.id === ok.body.data.id)).toMatchObject({ diseaseSampleNumber: 'WI-CWD 2025-0412', standName: 'Oak ladder' });
  });

  it('refuses a stand that is not a stand site, a sit of another stand or property, and a malformed sampling number — saving nothing', async () => {
    const before = await HarvestRecord.count({ where: { propertyId } });
    const notStand = await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, harvest({ standUnitId: plotId }));
    expect(notStand.status).toBe(422);
    expect(notStand.body.error).toMatch(/standUnitId: that is not a stand site/);
    const otherStand = await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, harvest({ standUnitId: otherStandId, sitId }));
    expect(otherStand.status).toBe(422);
    expect(otherStand.body.error).toMatch(/sit was at another stand/);
    const elsewhere = await makeProperty(ctx.firm.id, ctx.client.id);
    const wrongProperty = await send(consultant, 'post', `/api/properties/${elsewhere.id}/harvests`, harvest({ sitId }));
    expect(wrongProperty.status).toBe(422);
    expect(wrongProperty.body.error).toMatch(/sitId: that sit was not logged on this property/);
    const badNumber = await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, harvest({ diseaseSampleNumber: '<script>' }));
    expect(badNumber.status).toBe(422);
    expect(badNumber.body.error).toMatch(/disease-sampling number/);
    expect(await HarvestRecord.count({ where: { propertyId } })).toBe(before);
  });

  it('keeps the client on its own land and the crew out', async () => {
    const otherClient = await makeClient(ctx.firm.id);
    const notMine = await makeProperty(ctx.firm.id, otherClient.id);
    expect((await send(client, 'post', `/api/properties/${notMine.id}/harvests`, harvest())).status).toBe(404);
    expect((await send(crew, 'post', `/api/properties/${propertyId}/harvests`, harvest())).status).toBe(403);
    // Changing or deleting a record stays with staff.
    const any = await HarvestRecord.findOne({ where: { propertyId } });
    expect((await send(client, 'patch', `/api/harvests/${any!.id}`, { notes: 'x' })).status).toBe(403);
  });

  it('edits keep the links, and a patch can change the sampling number', async () => {
    const rec = await HarvestRecord.findOne({ where: { propertyId, sitId }, order: [['id', 'ASC']] });
    const res = await send(consultant, 'patch', `/api/harvests/${rec!.id}`, { diseaseSampleNumber: 'WI-CWD 2025-0413' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.data).toMatchObject({ sitId, standUnitId: standId, diseaseSampleNumber: 'WI-CWD 2025-0413' });
  });
});

describe('the season report’s pressure section', () => {
  it('sums sits, hours and deer per stand for the season, with the harvests taken from each stand', async () => {
    const section = await buildSeasonPressure(ctx.firm.id, propertyId, 2025);
    const oak = section.stands.find((s) => s.name === 'Oak ladder')!;
    // One sit 21:00–23:30 UTC = 2.5 h, 3 deer seen → 1.2 deer per hour; two harvests from the stand (worked by hand).
    expect(oak).toMatchObject({ sits: 1, hours: 2.5, deerSeen: 3, harvests: 2 });
    expect(oak.deerPerHour).toBeCloseTo(1.2, 5);
    expect(section.totals).toMatchObject({ sits: 1, hours: 2.5, deerSeen: 3 });
    expect(section.sampledHarvests).toBe(1);
  });
});

describe('identified bucks on a sit', () => {
  it('takes buckIds from the property’s camera roster, and refuses a buck of another property saving nothing', async () => {
    const buck = await send(consultant, 'post', `/api/properties/${propertyId}/bucks`, { name: 'Split G2' });
    expect(buck.status, JSON.stringify(buck.body)).toBe(201);
    const buckId = buck.body.data.id as number;
    const elsewhere = await makeProperty(ctx.firm.id, ctx.client.id);
    const stray = await send(consultant, 'post', `/api/properties/${elsewhere.id}/bucks`, { name: 'Drop tine' });
    expect(stray.status).toBe(201);
    const body = { standUnitId: standId, startedAt: '2025-11-16T12:00:00.000Z', endedAt: '2025-11-16T15:00:00.000Z', seen: { bucks: 1, does: 0, fawns: 0 } };
    const post = (key: string, over: object) => consultant.post(`/api/properties/${propertyId}/sits`).set('X-CSRF-Token', consultant.csrf).set('Idempotency-Key', key).send({ ...body, ...over });

    const ok = await post(`bucks-ok-${Date.now()}`, { buckIds: [buckId] });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(SitSchema.parse(ok.body.data).buckIds).toEqual([buckId]);

    const before = await Sit.count({ where: { propertyId } });
    const refused = await post(`bucks-bad-${Date.now()}`, { buckIds: [buckId, stray.body.data.id] });
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatch(/not a buck of this property’s camera roster/);
    const twice = await post(`bucks-twice-${Date.now()}`, { buckIds: [buckId, buckId] });
    expect(twice.status).toBe(422);
    expect(twice.body.error).toMatch(/each buck once/);
    expect(await Sit.count({ where: { propertyId } })).toBe(before);

    // Without buckIds a sit still answers an empty list.
    const none = await post(`bucks-none-${Date.now()}`, {});
    expect(SitSchema.parse(none.body.data).buckIds).toEqual([]);
  });
});
