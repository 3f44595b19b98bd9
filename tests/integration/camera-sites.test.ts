/**
 * A property's camera sites with their numbers summed over every deployment at a site
 * (`GET /api/properties/:id/camera-sites`). Values worked by hand beside each; summing camera-nights
 * over deployments is common practice, no source. The firm's clock is America/Chicago (CDT, UTC−5).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { makeJpeg } from '../support/photo-fixtures';
import { CameraSitesAnswerSchema } from '../../shared/schemas/cameras';

let consultant: Agent;
let crew: Agent;
let otherConsultant: Agent;
let propertyId: number;
let site: number;
let lonely: number;

const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

async function card(deploymentId: number, shots: [string, string][], tags: string[], seed: number) {
  let req = consultant.post(`/api/deployments/${deploymentId}/photos`).set('X-CSRF-Token', consultant.csrf);
  for (const [i, [name, t]] of shots.entries()) req = req.attach('photos', await makeJpeg({ rgb: [(seed + i * 41) % 256, (seed * 7 + i * 13) % 256, (i * 97) % 256], takenAt: t }), { filename: name, contentType: 'image/jpeg' });
  const res = await req;
  expect(res.status).toBe(201);
  const photos = res.body.data.photos as { id: number }[];
  for (const [i, p] of photos.entries()) expect((await send(consultant, 'patch', `/api/camera-photos/${p.id}`, { tag: tags[i] })).status).toBe(200);
}

beforeAll(async () => {
  const ctx = await makeFirm();
  const other = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  otherConsultant = await signedInAgent(other.users.consultant.email, PASSWORD);
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  const unit = async (name: string, coordinates: [number, number]) => (await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'camera-site', name, geometry: { type: 'Point', coordinates } })).body.data.id as number;
  site = await unit('Creek crossing', [-90.938, 43.267]);
  lonely = await unit('Ridge saddle', [-90.932, 43.268]);

  // Cam A at the crossing Oct 1 → Oct 22 (21 nights); Cam B there Oct 22 → Nov 5 (14 nights): 35 camera-nights.
  const camA = (await send(consultant, 'post', '/api/cameras', { label: 'Site cam A' })).body.data.id as number;
  const camB = (await send(consultant, 'post', '/api/cameras', { label: 'Site cam B' })).body.data.id as number;
  const depA = (await send(consultant, 'post', `/api/cameras/${camA}/deployments`, { unitId: site, startedOn: '2026-10-01', mode: 'photo' })).body.data.id as number;
  expect((await send(consultant, 'patch', `/api/deployments/${depA}`, { endedOn: '2026-10-22' })).status).toBe(200);
  const depB = (await send(consultant, 'post', `/api/cameras/${camB}/deployments`, { unitId: site, startedOn: '2026-10-22', mode: 'photo' })).body.data.id as number;
  expect((await send(consultant, 'patch', `/api/deployments/${depB}`, { endedOn: '2026-11-05' })).status).toBe(200);
  // Cam A: deer 06:10 + 06:25 (one event), deer 07:30 (second), a raccoon at noon.
  await card(depA, [['A1.JPG', '2026:10:03 06:10:00'], ['A2.JPG', '2026:10:03 06:25:00'], ['A3.JPG', '2026:10:03 07:30:00'], ['A4.JPG', '2026:10:05 12:00:00']], ['doe', 'fawn', 'doe', 'other-species'], 11);
  // Cam B: a buck at 19:00 and 19:20 (one event), a person at 10:00.
  await card(depB, [['B1.JPG', '2026:10:25 19:00:00'], ['B2.JPG', '2026:10:25 19:20:00'], ['B3.JPG', '2026:10:27 10:00:00']], ['buck', 'buck', 'person'], 23);
  // The ridge saddle: one camera Oct 10 → Oct 12, no photos (2 camera-nights, no events).
  const camC = (await send(consultant, 'post', '/api/cameras', { label: 'Site cam C' })).body.data.id as number;
  const depC = (await send(consultant, 'post', `/api/cameras/${camC}/deployments`, { unitId: lonely, startedOn: '2026-10-10', mode: 'video' })).body.data.id as number;
  expect((await send(consultant, 'patch', `/api/deployments/${depC}`, { endedOn: '2026-10-12' })).status).toBe(200);
});

describe('camera sites summed over their deployments', () => {
  it('sums camera-nights over a site’s deployments and rates its events per 100 camera-nights', async () => {
    const res = await consultant.get(`/api/properties/${propertyId}/camera-sites`);
    expect(res.status).toBe(200);
    const answer = CameraSitesAnswerSchema.parse(res.body);
    expect(answer.meta).toEqual({ gapMinutes: 30, timezone: expect.any(String) });
    const crossing = answer.data.find((s) => s.unitId === site)!;
    expect(crossing).toMatchObject({ name: 'Creek crossing', deploymentCount: 2, cameraNights: 35 });
    // Deer: 06:10–06:25, 07:30, 19:00–19:20 → 3 events; one other species; one person.
    expect(crossing.eventsByKind).toEqual({ deer: 3, 'other-species': 1, person: 1 });
    expect(crossing.eventsPer100CameraNights.deer).toBeCloseTo((3 / 35) * 100, 6); // 8.571…
    expect(crossing.eventsPer100CameraNights.person).toBeCloseTo((1 / 35) * 100, 6);
    // Activity by hour on the firm's clock: deer at 6, 7 and 19; the person at 10.
    expect(crossing.byHour.deer.map((n, h) => (n ? h : -1)).filter((h) => h >= 0)).toEqual([6, 7, 19]);
    expect(crossing.byHour.person[10]).toBe(1);
    const saddle = answer.data.find((s) => s.unitId === lonely)!;
    expect(saddle).toMatchObject({ deploymentCount: 1, cameraNights: 2, eventsByKind: { deer: 0, 'other-species': 0, person: 0 } });
    expect(saddle.eventsPer100CameraNights.deer).toBe(0);
  });

  it('keeps another firm out (404) and the crew out (403)', async () => {
    expect((await otherConsultant.get(`/api/properties/${propertyId}/camera-sites`)).status).toBe(404);
    expect((await crew.get(`/api/properties/${propertyId}/camera-sites`)).status).toBe(403);
  });

  it('answers 404 for a property that does not exist', async () => {
    const res = await otherConsultant.get(`/api/properties/999999999/camera-sites`);
    expect(res.status).toBe(404);
  });
});
