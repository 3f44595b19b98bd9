/**
 * Field observations through HTTP against a real PostgreSQL/PostGIS: logging with photos the test
 * makes (sharp draws the JPEG, piexifjs writes EXIF GPS and time), the position's source, placement
 * in the plan's units, the far-away confirmation, idempotent sends, filters and counts, who may log,
 * photos served to the right people, and the exports.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, makeClient, PASSWORD } from '../support/factories';
import { makeJpeg } from '../support/photo-fixtures';
import { Observation, ObservationPhoto } from '../../server/models';
import { ObservationSchema, ObservationSummarySchema } from '../../shared/schemas/observation';

// The plot: a rectangle inside the factory's property boundary (lon −90.94…−90.93, lat 43.265…43.27).
const PLOT: Polygon = { type: 'Polygon', coordinates: [[[-90.938, 43.2655], [-90.9365, 43.2655], [-90.9365, 43.2665], [-90.938, 43.2665], [-90.938, 43.2655]]] };
// Metres per degree of longitude at 43.266°N on WGS84: (π/180)·a·cos φ/√(1−e²sin²φ) = 81,289 m (from the ellipsoid formula, a = 6378137 m, e² = 0.00669438).
const M_PER_DEG_LON = 81_289;
const eastOfPlot = (metres: number): [number, number] => [-90.9365 + metres / M_PER_DEG_LON, 43.266];

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
let client: Agent;
let propertyId: number;
let plotId: number;
let n = 0;
const key = () => `obs-test-${Date.now()}-${++n}`;

beforeAll(async () => {
  ctx = await makeFirm();
  await ctx.firm.update({ timezone: 'America/Chicago' });
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  const plot = await consultant.post(`/api/properties/${propertyId}/units`).set('X-CSRF-Token', consultant.csrf).send({ kind: 'food-plot', name: 'North plot', geometry: PLOT });
  expect(plot.status).toBe(201);
  plotId = plot.body.data.id;
});

function log(agent: Agent, fields: Record<string, string>, photos: Buffer[] = [], idempotency = key(), property = propertyId) {
  let req = agent.post(`/api/properties/${property}/observations`).set('X-CSRF-Token', agent.csrf).set('Idempotency-Key', idempotency);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  photos.forEach((p, i) => {
    req = req.attach('photos', p, { filename: `sign-${i}.jpg`, contentType: 'image/jpeg' });
  });
  return req;
}

describe('logging an observation', () => {
  it('places a scrape by its photo\u2019s EXIF GPS, reads the EXIF time in the firm\u2019s zone, and answers the contract', async () => {
    const photo = await makeJpeg({ width: 800, height: 600, takenAt: '2026:10:14 07:31:05', latitude: 43.266, longitude: -90.937 });
    const res = await log(crew, { kind: 'scrape', notes: 'Fresh, licking branch above' }, [photo]);
    expect(res.status).toBe(201);
    const data = ObservationSchema.parse(res.body.data);
    expect(data).toMatchObject({ kind: 'scrape', positionSource: 'photo', unitId: plotId, unitName: 'North plot', insideBoundary: true, notes: 'Fresh, licking branch above' });
    expect(data.position[0]).toBeCloseTo(-90.937, 6);
    expect(data.position[1]).toBeCloseTo(43.266, 6);
    // 07:31:05 on Oct 14, 2026 in Chicago is CDT, UTC−5 (IANA tz database): 12:31:05Z.
    expect(data.observedAt).toBe('2026-10-14T12:31:05.000Z');
    expect(data.photos).toHaveLength(1);
    const full = await consultant.get(data.photos[0].url).buffer(true);
    expect(full.status).toBe(200);
    expect(full.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(full.body as Buffer, photo)).toBe(0);
    const thumb = await consultant.get(data.photos[0].thumbnailUrl!);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
  });

  it('answers the same observation again for the same Idempotency-Key and stores nothing twice', async () => {
    const k = key();
    const photo = await makeJpeg({ rgb: [10, 200, 10] });
    const fields = { kind: 'rub', lon: '-90.937', lat: '43.266', positionSource: 'device', observedAt: '2026-11-02T08:15:00-06:00' };
    const first = await log(crew, fields, [photo], k);
    expect(first.status).toBe(201);
    const before = [await Observation.count({ where: { firmId: ctx.firm.id } }), await ObservationPhoto.count({ where: { firmId: ctx.firm.id } })];
    const again = await log(crew, fields, [photo], k);
    expect(again.status).toBe(200);
    expect(again.body.replayed).toBe(true);
    expect(again.body.data.id).toBe(first.body.data.id);
    expect([await Observation.count({ where: { firmId: ctx.firm.id } }), await ObservationPhoto.count({ where: { firmId: ctx.firm.id } })]).toEqual(before);
  });

  it('says which position it used: the phone\u2019s (device) or a tap on the map', async () => {
    const res = await log(consultant, { kind: 'bed', lon: '-90.937', lat: '43.266', positionSource: 'map' });
    expect(res.status).toBe(201);
    expect(res.body.data.positionSource).toBe('map');
    expect(res.body.data.unitId).toBe(plotId);
  });

  it('gives a position 10 m (33 ft) outside the plot to the plot, and one 25 m (82 ft) outside to no unit, under the default 50 ft', async () => {
    const near = await log(consultant, { kind: 'tracks', lon: String(eastOfPlot(10)[0]), lat: '43.266', positionSource: 'device' });
    expect(near.status).toBe(201);
    expect(near.body.data).toMatchObject({ unitId: plotId, insideBoundary: true });
    const off = await log(consultant, { kind: 'tracks', lon: String(eastOfPlot(25)[0]), lat: '43.266', positionSource: 'device' });
    expect(off.status).toBe(201);
    expect(off.body.data).toMatchObject({ unitId: null, insideBoundary: true });
  });

  it('follows the firm\u2019s own snap distance', async () => {
    const owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
    expect((await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ observationSnapFt: 100 })).status).toBe(200);
    const res = await log(consultant, { kind: 'droppings', lon: String(eastOfPlot(25)[0]), lat: '43.266', positionSource: 'device' });
    expect(res.body.data.unitId).toBe(plotId);
    expect((await owner.get('/api/firm')).body.data.settings.observationSnapFt).toBe(100);
    await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ observationSnapFt: 50 });
  });

  it('asks for confirmation far outside the property, and keeps it flagged once confirmed', async () => {
    const far = { kind: 'standing-water', lon: '-90.915', lat: '43.2675', positionSource: 'map' }; // about 1.2 km east of the boundary
    const asked = await log(consultant, far);
    expect(asked.status).toBe(422);
    expect(asked.body.error).toMatch(/outside the property.*confirmFarAway/);
    const kept = await log(consultant, { ...far, confirmFarAway: 'true' });
    expect(kept.status).toBe(201);
    expect(kept.body.data).toMatchObject({ insideBoundary: false, unitId: null });
  });
});

describe('bad input', () => {
  it('refuses a file that is not a photo by content (415) and stores nothing', async () => {
    const before = await Observation.count({ where: { firmId: ctx.firm.id } });
    const res = await crew
      .post(`/api/properties/${propertyId}/observations`)
      .set('X-CSRF-Token', crew.csrf)
      .set('Idempotency-Key', key())
      .field('kind', 'rub')
      .field('lon', '-90.937')
      .field('lat', '43.266')
      .field('positionSource', 'device')
      .attach('photos', Buffer.from('%PDF-1.7 not a picture'), { filename: 'rub.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(res.body.error).toContain('"rub.jpg" is not a photo');
    expect(await Observation.count({ where: { firmId: ctx.firm.id } })).toBe(before);
  });

  it('refuses a photo with absurd EXIF as the only position, with the sentence, and flags it when a position is given', async () => {
    const absurd = await makeJpeg({ takenAt: '2099:01:01 10:00:00', latitude: 0, longitude: 0 });
    const refused = await log(crew, { kind: 'shed' }, [absurd]);
    expect(refused.status).toBe(422);
    expect(refused.body.error).toMatch(/0°, 0°/);
    const kept = await log(crew, { kind: 'shed', lon: '-90.937', lat: '43.266', positionSource: 'device', observedAt: '2026-11-20T09:00:00-06:00' }, [absurd]);
    expect(kept.status).toBe(201);
    expect(kept.body.data.photos[0].exifProblems).toHaveLength(2);
    expect(kept.body.data.photos[0].takenAt).toBeNull();
  });

  it('refuses a missing key (400), an unknown kind, a lone lon, a time in the future (422), each with a sentence', async () => {
    const noKey = await crew.post(`/api/properties/${propertyId}/observations`).set('X-CSRF-Token', crew.csrf).field('kind', 'rub');
    expect(noKey.status).toBe(400);
    expect(noKey.body.error).toMatch(/Idempotency-Key/);
    const kind = await log(crew, { kind: 'bigfoot', lon: '-90.937', lat: '43.266', positionSource: 'device' });
    expect(kind.status).toBe(422);
    expect(kind.body.error).toMatch(/choose a kind of sign/);
    const lone = await log(crew, { kind: 'rub', lon: '-90.937' });
    expect(lone.status).toBe(422);
    const future = await log(crew, { kind: 'rub', lon: '-90.937', lat: '43.266', positionSource: 'device', observedAt: '2099-01-01T10:00:00Z' });
    expect(future.status).toBe(422);
    expect(future.body.error).toMatch(/in the future/);
    const nowhere = await log(crew, { kind: 'rub' });
    expect(nowhere.status).toBe(422);
    expect(nowhere.body.error).toMatch(/Where was this/);
  });
});

describe('reading observations over time', () => {
  it('filters by kind and by dates in the firm\u2019s zone, and counts by unit and by month', async () => {
    const list = await consultant.get(`/api/properties/${propertyId}/observations?kind=scrape,rub`);
    expect(list.status).toBe(200);
    const all = list.body.data.map((o: unknown) => ObservationSchema.parse(o));
    expect(all.length).toBeGreaterThanOrEqual(2);
    expect(new Set(all.map((o: { kind: string }) => o.kind))).toEqual(new Set(['scrape', 'rub']));
    // The scrape is Oct 14 (Chicago), the rub Nov 2: October alone holds only the scrape.
    const october = await consultant.get(`/api/properties/${propertyId}/observations?kind=scrape,rub&from=2026-10-01&to=2026-10-31`);
    expect(october.body.data.map((o: { kind: string }) => o.kind)).toEqual(['scrape']);
    const byUnit = ObservationSummarySchema.parse((await consultant.get(`/api/properties/${propertyId}/observations/summary?by=unit`)).body.data);
    const plotRow = byUnit.rows.find((r) => r.key === String(plotId));
    expect(plotRow?.label).toBe('North plot');
    expect(plotRow?.byKind.scrape).toBe(1);
    expect(byUnit.rows.some((r) => r.key === 'none' && r.label === 'Outside every unit')).toBe(true);
    const byMonth = ObservationSummarySchema.parse((await consultant.get(`/api/properties/${propertyId}/observations/summary?by=month&kind=scrape,rub`)).body.data);
    expect(byMonth.rows.map((r) => [r.key, r.label, r.total])).toEqual([
      ['2026-10', 'Oct 2026', 1],
      ['2026-11', 'Nov 2026', 1],
    ]);
    const bad = await consultant.get(`/api/properties/${propertyId}/observations?from=2026-11-01&to=2026-10-01`);
    expect(bad.status).toBe(422);
  });

  it('carries observations in the GeoJSON, KML and CSV exports', async () => {
    const geojson = await consultant.get(`/api/properties/${propertyId}/export?format=geojson`);
    expect(geojson.status).toBe(200);
    const features = JSON.parse(geojson.text).features as { properties: { family: string; kind: string; observedAt?: string } }[];
    const scrape = features.find((f) => f.properties.family === 'observation' && f.properties.kind === 'scrape');
    expect(scrape?.properties.observedAt).toBe('2026-10-14T12:31:05.000Z');
    const kml = await consultant.get(`/api/properties/${propertyId}/export?format=kml`);
    expect(kml.text).toContain('<name>Observations</name>');
    expect(kml.text).toContain('Scrape');
    const csv = await consultant.get(`/api/properties/${propertyId}/export?format=csv`);
    expect(csv.text).toMatch(/\r\n[^\r\n]*,scrape,observation,/);
  });
});

describe('who may log and see', () => {
  it('refuses the client\u2019s contact until the consultant turns logging on, then accepts it on its own land only', async () => {
    const fields = { kind: 'browse', lon: '-90.937', lat: '43.266', positionSource: 'device' };
    const refused = await log(client, fields);
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/Ask your consultant/);
    const allow = await consultant.patch(`/api/clients/${ctx.client.id}`).set('X-CSRF-Token', consultant.csrf).send({ portalObservationsAllowed: true });
    expect(allow.status).toBe(200);
    expect(allow.body.data.portalObservationsAllowed).toBe(true);
    const ok = await log(client, fields, [await makeJpeg({ rgb: [5, 5, 250] })]);
    expect(ok.status).toBe(201);
    expect((await client.get(ok.body.data.photos[0].url)).status).toBe(200);
    // Another client's property in the same firm: not found, and not readable either.
    const other = await makeProperty(ctx.firm.id, (await makeClient(ctx.firm.id)).id);
    expect((await log(client, fields, [], key(), other.id)).status).toBe(404);
    expect((await client.get(`/api/properties/${other.id}/observations`)).status).toBe(404);
  });

  it('keeps another firm out of the observations and their photos (404)', async () => {
    const outsider = await makeFirm();
    const stranger = await signedInAgent(outsider.users.consultant.email, PASSWORD);
    const photo = await ObservationPhoto.findOne({ where: { firmId: ctx.firm.id } });
    expect((await stranger.get(`/api/observation-photos/${photo!.id}`)).status).toBe(404);
    expect((await stranger.get(`/api/properties/${propertyId}/observations`)).status).toBe(404);
    expect((await log(stranger, { kind: 'rub', lon: '-90.937', lat: '43.266', positionSource: 'device' })).status).toBe(404);
  });
});

describe('the demo', () => {
  it('seeds a few dozen observations of many kinds and months on Kettle Hollow Farm, each in a unit, once', async () => {
    const { seedDemo } = await import('../../server/db/seeds/demo');
    const firm = await seedDemo();
    await seedDemo();
    const rows = await Observation.findAll({ where: { firmId: firm.id } });
    expect(rows.length).toBe(38);
    expect(new Set(rows.map((r) => r.kind)).size).toBeGreaterThanOrEqual(10);
    expect(new Set(rows.map((r) => r.observedAt.toISOString().slice(0, 7))).size).toBeGreaterThanOrEqual(8);
    expect(rows.every((r) => r.unitId !== null)).toBe(true);
  });
});
