/**
 * Hunting pressure contracts: stand winds, stand-site details, the wind record (CSV, ISD-Lite,
 * typed sectors), sits with an idempotency key, who may log them, and pressure. Answers are parsed
 * with the shared schemas; bad input answers 4xx naming the problem and saves nothing.
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { send, type FirmContext } from '../support/firm-settings';
import { huntingSetup, STAND } from '../support/hunting-setup';
import { makeClient, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Sit, WindRecord } from '../../server/models';
import { PressureAnswerSchema, SitSchema, StandWindsAnswerSchema, WindRecordSchema } from '../../shared/schemas/hunting';

let ctx: FirmContext;
let consultant: Agent;
let client: Agent;
let crew: Agent;
let propertyId: number;
let standId: number;
let beddingId: number;
let plotId: number;
let routeId: number;

const M_LAT = 1 / 111_132;
const fixture = (name: string) => readFileSync(new URL(`../fixtures/wind/${name}`, import.meta.url));
const sitBody = (over: Record<string, unknown> = {}) => ({
  standUnitId: standId,
  startedAt: new Date(Date.now() - 26 * 3600_000).toISOString(),
  endedAt: new Date(Date.now() - 23 * 3600_000).toISOString(),
  windFrom: 'N',
  windMph: 6,
  seen: { bucks: 1, does: 3, fawns: 2 },
  notes: 'Two does at last light',
  ...over,
});
const postSit = (agent: Agent, key: string | null, body: unknown, pid = propertyId) => {
  const req = agent.post(`/api/properties/${pid}/sits`).set('X-CSRF-Token', agent.csrf);
  return (key ? req.set('Idempotency-Key', key) : req).send(body as object);
};
let keyN = 0;
const newKey = () => `sit-key-${Date.now()}-${keyN++}`;

beforeAll(async () => {
  const setup = await huntingSetup();
  ({ ctx, consultant, client, crew, propertyId, standId } = setup);
  const unit = setup.addUnit;
  // Bedding area 120–180 m due north of the stand.
  beddingId = await unit({ kind: 'bedding-area', name: 'North thicket', geometry: rectangle(STAND[0] - 0.0004, STAND[1] + 120 * M_LAT, 60, 60) });
  // The watched food plot 40–100 m south.
  plotId = await unit({ kind: 'food-plot', name: 'Clover', geometry: rectangle(STAND[0] - 0.0004, STAND[1] - 100 * M_LAT, 60, 60) });
  // Walked in from the west along the stand's own latitude.
  routeId = await unit({ kind: 'access-route', name: 'West lane', geometry: { type: 'LineString', coordinates: [[STAND[0] - 0.004, STAND[1]], [STAND[0] - 0.00005, STAND[1]]] } });
});

describe('stand winds', () => {
  it('judges the 16 winds with named reasons: bedding due north — wind from the south not suitable, from the north suitable', async () => {
    const res = await consultant.get(`/api/properties/${propertyId}/stand-winds`);
    expect(res.status).toBe(200);
    const answer = StandWindsAnswerSchema.parse(res.body);
    const stand = answer.data.find((s) => s.unitId === standId)!;
    expect(stand.winds).toHaveLength(16);
    const s = stand.winds.find((w) => w.from === 'S')!;
    expect(s).toMatchObject({ degrees: 180, suitable: false });
    expect(s.reasons).toContainEqual({ kind: 'bedding-area', unitId: beddingId, name: 'North thicket' });
    expect(stand.winds.find((w) => w.from === 'N')!.suitable).toBe(true);
    expect(stand.routeIds).toEqual([routeId]);
    expect(stand.huntableShare).toBeNull();
    expect(answer.meta.cautions.map((c) => c.id)).toEqual(['tree-stand', 'hunting-rules']);
    expect(answer.meta.cautions[0]!.text).toMatch(/full-body harness/);
  });

  it('lets the owner’s client read it, and refuses the crew', async () => {
    expect((await client.get(`/api/properties/${propertyId}/stand-winds`)).status).toBe(200);
    expect((await crew.get(`/api/properties/${propertyId}/stand-winds`)).status).toBe(403);
  });

  it('sets a stand’s watched unit, type and height; refuses a unit that is not a stand site and a watched unit elsewhere', async () => {
    const ok = await send(consultant, 'put', `/api/units/${standId}/stand-site`, { watchedUnitId: plotId, standType: 'ladder', heightFt: 16, approachFrom: 'SW' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body.data).toMatchObject({ watchedUnitId: plotId, standType: 'ladder', heightFt: 16, approachFrom: 'SW' });
    const notStand = await send(consultant, 'put', `/api/units/${plotId}/stand-site`, { standType: 'ladder' });
    expect(notStand.status).toBe(422);
    expect(notStand.body.error).toMatch(/not a stand site/);
    const other = await makeProperty(ctx.firm.id, ctx.client.id);
    const far = await send(consultant, 'post', `/api/properties/${other.id}/units`, { kind: 'food-plot', name: 'Far plot', geometry: rectangle(-90.936, 43.266, 40, 40) });
    const elsewhere = await send(consultant, 'put', `/api/units/${standId}/stand-site`, { watchedUnitId: far.body.data.id });
    expect(elsewhere.status).toBe(422);
    expect(elsewhere.body.error).toMatch(/same property/);
    const badType = await send(consultant, 'put', `/api/units/${standId}/stand-site`, { standType: 'hammock' });
    expect(badType.status).toBe(422);
    // The watched plot's south-west approach side now counts: a wind from the north-east lays scent over it.
    const winds = StandWindsAnswerSchema.parse((await consultant.get(`/api/properties/${propertyId}/stand-winds`)).body);
    const ne = winds.data.find((x) => x.unitId === standId)!.winds.find((w) => w.from === 'NE')!;
    expect(ne.reasons).toContainEqual({ kind: 'approach-side', unitId: plotId, name: 'Clover' });
  });
});

describe('the wind record', () => {
  it('imports a CSV with chosen months and all hours → the rose worked by hand, and huntable shares', async () => {
    // Judge the stand on the bedding area and the route alone (no watched plot).
    expect((await send(consultant, 'put', `/api/units/${standId}/stand-site`, { watchedUnitId: null, approachFrom: null })).status).toBe(200);
    const res = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).field('months', '10').field('hours', 'all').attach('file', fixture('small.csv'), 'small.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const record = WindRecordSchema.parse(res.body.data);
    // By hand (tests/unit/domain/wind-record.test.ts): N 3/7, S 2/7, E 1/7, SW 1/7; 8 hours, 1 calm, 2 rows skipped.
    expect(record).toMatchObject({ source: 'csv', hours: 8, calmHours: 1, skippedRows: 2, months: [10], hoursFilter: 'all' });
    expect(record.rose.find((r) => r.from === 'N')!.share).toBe(0.4286);
    const got = await client.get(`/api/properties/${propertyId}/wind-record`);
    expect(WindRecordSchema.parse(got.body.data).rose).toEqual(record.rose);
    const winds = StandWindsAnswerSchema.parse((await consultant.get(`/api/properties/${propertyId}/stand-winds`)).body);
    const stand = winds.data.find((x) => x.unitId === standId)!;
    const expected = record.rose.filter((r) => stand.winds.find((w) => w.from === r.from)!.suitable).reduce((a, r) => a + r.share, 0);
    expect(stand.huntableShare).toBeCloseTo(expected, 4);
    expect(stand.huntableShare).toBeGreaterThan(0);
  });

  it('imports ISD-Lite hourly lines', async () => {
    const res = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).field('months', '10').field('hours', 'all').attach('file', fixture('isd-lite.txt'), 'isd.txt');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data).toMatchObject({ source: 'isd-lite', hours: 5, calmHours: 1 });
  });

  it('reads a year of ISD-Lite lines (over the inline size, so in a worker thread): every hour from the south-west', async () => {
    const lines: string[] = [];
    for (let t = Date.UTC(2025, 0, 1); t < Date.UTC(2026, 0, 1); t += 3600_000) {
      const d = new Date(t);
      const p = (n: number, w: number) => String(n).padStart(w, ' ');
      lines.push(`${d.getUTCFullYear()} ${String(d.getUTCMonth() + 1).padStart(2, '0')} ${String(d.getUTCDate()).padStart(2, '0')} ${String(d.getUTCHours()).padStart(2, '0')}${p(100, 6)}${p(50, 6)}${p(10150, 6)}${p(225, 6)}${p(40, 6)}${p(4, 6)}${p(-9999, 6)}${p(-9999, 6)}`);
    }
    const text = lines.join('\n');
    expect(text.length).toBeGreaterThan(256 * 1024);
    const res = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).field('months', '11').field('hours', 'all').attach('file', Buffer.from(text), 'year.txt');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // November in the firm's zone: 30 days × 24 hours = 720, give or take the hours the zone shifts across the month's ends.
    expect(Math.abs(res.body.data.hours - 720)).toBeLessThanOrEqual(6);
    expect(res.body.data.rose.find((r: { from: string }) => r.from === 'SW').share).toBe(1);
  });

  it('applies the default hunting hours: the fixture’s evening hours in Wisconsin fall outside them', async () => {
    // 12:00–21:00 UTC on 1 Oct is 07:00–16:00 CDT; sunrise near 43.3°N is about 07:00 CDT, so every hour is within legal light but the first.
    const res = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).attach('file', fixture('small.csv'), 'small.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data.hoursFilter).toBe('hunting');
    expect(res.body.data.months).toEqual([9, 10, 11, 12, 1]);
    expect(res.body.data.hours).toBeLessThanOrEqual(8);
    expect(res.body.data.hours).toBeGreaterThanOrEqual(7);
  });

  it('refuses an unknown format, a file with no usable rows, bad months, and a file over the limit — and keeps the record it had', async () => {
    const before = await WindRecord.findByPk(propertyId);
    const unknown = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.from('hello\nworld\n'), 'x.txt');
    expect(unknown.status).toBe(422);
    expect(unknown.body.error).toMatch(/neither a CSV/);
    const empty = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.from('time,direction\n2026-10-01T12:00Z,999\n'), 'x.csv');
    expect(empty.status).toBe(422);
    expect(empty.body.error).toMatch(/no usable wind rows/);
    const months = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).field('months', '13').attach('file', fixture('small.csv'), 'small.csv');
    expect(months.status).toBe(422);
    expect(months.body.error).toMatch(/months/);
    const big = await consultant.post(`/api/properties/${propertyId}/wind-record`).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.alloc(9 * 1024 * 1024, 'a'), 'big.csv');
    expect(big.status).toBe(413);
    const after = await WindRecord.findByPk(propertyId);
    expect(after!.updatedAt.toISOString()).toBe(before!.updatedAt.toISOString());
  });

  it('takes typed sector frequencies as JSON, and refuses a sector that is not one of the 16 names', async () => {
    const bad = await send(consultant, 'post', `/api/properties/${propertyId}/wind-record`, { sectors: [{ from: 'NORTH', share: 3 }] });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/16 names/);
    const ok = await send(consultant, 'post', `/api/properties/${propertyId}/wind-record`, { sectors: [{ from: 'N', share: 3 }, { from: 'S', share: 1 }] });
    expect(ok.status).toBe(201);
    expect(ok.body.data.rose.find((r: { from: string }) => r.from === 'N').share).toBe(0.75);
    const clientTry = await send(client, 'post', `/api/properties/${propertyId}/wind-record`, { sectors: [{ from: 'N', share: 1 }] });
    expect(clientTry.status).toBe(403);
  });
});

describe('sits', () => {
  it('refuses bad sits with a sentence and saves none', async () => {
    const before = await Sit.count({ where: { propertyId } });
    const cases: [object, RegExp][] = [
      [sitBody({ endedAt: new Date(Date.now() - 30 * 3600_000).toISOString() }), /ends before it starts/],
      [sitBody({ startedAt: new Date(Date.now() - 60 * 3600_000).toISOString() }), /at most 24 hours/],
      [sitBody({ windFrom: 400 }), /0 to 360|16 names/],
      [sitBody({ windFrom: 'NORTHISH' }), /16 names/],
      [sitBody({ standUnitId: plotId }), /not a stand site/],
    ];
    for (const [body, message] of cases) {
      const res = await postSit(consultant, newKey(), body);
      expect(res.status, JSON.stringify(res.body)).toBe(422);
      expect(JSON.stringify(res.body)).toMatch(message);
    }
    const noKey = await postSit(consultant, null, sitBody());
    expect(noKey.status).toBe(400);
    expect(noKey.body.error).toMatch(/Idempotency-Key/);
    expect(await Sit.count({ where: { propertyId } })).toBe(before);
  });

  it('logs a sit once per idempotency key: the resend answers the first again', async () => {
    const key = newKey();
    const first = await postSit(consultant, key, sitBody({ windFrom: 185 }));
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const sit = SitSchema.parse(first.body.data);
    expect(sit).toMatchObject({ standUnitId: standId, standName: 'Oak ladder', windFrom: 'S', windSuitable: false, seen: { bucks: 1, does: 3, fawns: 2 } });
    const again = await postSit(consultant, key, sitBody({ windFrom: 185 }));
    expect(again.status).toBe(200);
    expect(again.body.replayed).toBe(true);
    expect(again.body.data.id).toBe(sit.id);
    expect(await Sit.count({ where: { idempotencyKey: key } })).toBe(1);
  });

  it('lets the client’s contacts log only when the consultant turns it on, and only on their own land', async () => {
    const refused = await postSit(client, newKey(), sitBody());
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/not turned on/);
    const on = await send(consultant, 'put', `/api/clients/${ctx.client.id}/sit-logging`, { allowed: true });
    expect(on.status).toBe(200);
    const ok = await postSit(client, newKey(), sitBody());
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    const otherClient = await makeClient(ctx.firm.id);
    const notMine = await makeProperty(ctx.firm.id, otherClient.id);
    const elsewhere = await postSit(client, newKey(), sitBody(), notMine.id);
    expect(elsewhere.status).toBe(404);
    const crewTry = await postSit(crew, newKey(), sitBody());
    expect(crewTry.status).toBe(403);
    const list = await client.get(`/api/properties/${propertyId}/sits`);
    expect(list.status).toBe(200);
    expect(list.body.data.length).toBeGreaterThanOrEqual(2);
  });
});

describe('pressure', () => {
  it('answers sits, hours, days rested, deer per hour and sits on an unsuitable wind per stand, and warns over the weekly limit', async () => {
    // A fresh property: three sits in the last week (limit 2 by default), one on a wind from the south.
    const property = await makeProperty(ctx.firm.id, ctx.client.id);
    const stand = await send(consultant, 'post', `/api/properties/${property.id}/units`, { kind: 'stand-site', name: 'Ridge', geometry: { type: 'Point', coordinates: STAND } });
    await send(consultant, 'post', `/api/properties/${property.id}/units`, { kind: 'bedding-area', name: 'Bed', geometry: rectangle(STAND[0] - 0.0004, STAND[1] + 120 * M_LAT, 60, 60) });
    const sid = stand.body.data.id as number;
    const hoursAgo = (h: number) => new Date(Date.now() - h * 3600_000).toISOString();
    for (const [start, end, wind, seen] of [
      [50, 47, 'N', { bucks: 1, does: 2, fawns: 0 }],
      [30, 28, 'S', { bucks: 0, does: 1, fawns: 0 }],
      [10, 9, 'N', { bucks: 0, does: 0, fawns: 0 }],
    ] as const) {
      const res = await postSit(consultant, newKey(), sitBody({ standUnitId: sid, startedAt: hoursAgo(start), endedAt: hoursAgo(end), windFrom: wind, seen }), property.id);
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    const res = await client.get(`/api/properties/${property.id}/pressure`);
    expect(res.status).toBe(200);
    const answer = PressureAnswerSchema.parse(res.body);
    const row = answer.data.find((r) => r.unitId === sid)!;
    // Hours 3 + 2 + 1 = 6; deer 3 + 1 + 0 = 4 → 0.67 per hour; one sit on a wind from the south (scent over the bedding).
    expect(row).toMatchObject({ sits: 3, hours: 6, deerPerHour: 0.67, sitsOnUnsuitableWind: 1, sitsThisWeek: 3, overPressured: true });
    expect(row.daysSinceLastSit).toBeLessThanOrEqual(1);
    expect(answer.meta.maxSitsPerWeek).toBe(2);
    // The Desk and the portal read the same warning.
    const warnings = await client.get('/api/pressure-warnings');
    expect(warnings.body.data).toContainEqual(expect.objectContaining({ unitId: sid, propertyId: property.id, sitsThisWeek: 3 }));
    const owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
    const set = await send(owner, 'patch', '/api/firm/hunting-settings', { maxSitsPerWeek: 3 });
    expect(set.status).toBe(200);
    const relaxed = PressureAnswerSchema.parse((await consultant.get(`/api/properties/${property.id}/pressure`)).body);
    expect(relaxed.data.find((r) => r.unitId === sid)!.overPressured).toBe(false);
    const badSetting = await send(owner, 'patch', '/api/firm/hunting-settings', { coneReachYd: -5 });
    expect(badSetting.status).toBe(422);
    const consultantSetting = await send(consultant, 'patch', '/api/firm/hunting-settings', { coneReachYd: 200 });
    expect(consultantSetting.status).toBe(403);
    await makeUser(ctx.firm.id, 'consultant');
  });
});
