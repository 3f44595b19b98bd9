import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { makeJpeg, makePng } from '../support/photo-fixtures';
import { BackgroundJob, CameraPhoto, Property } from '../../server/models';
import { waitForJob } from '../../server/services/jobs/job-queue';
import { readFile } from '../../server/services/storage/storage';
import {
  BuckDtoSchema,
  CameraDtoSchema,
  CardPullDtoSchema,
  CardUploadResultSchema,
  CameraPhotoDtoSchema,
  DeploymentDtoSchema,
  DeploymentEventsDtoSchema,
  DuePullDtoSchema,
} from '../../shared/schemas/cameras';
import { cameraSurveyEstimates } from '../../shared/domain/survey-estimates';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let other: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let otherConsultant: Agent;
let client: Agent;
let crew: Agent;
let propertyId: number;
let siteA: number;
let siteB: number;
let plotId: number;

const send = (agent: Agent, method: 'post' | 'patch' | 'delete', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

/** Uploads photos as a card batch; `files` are [name, bytes]. */
function upload(agent: Agent, deploymentId: number, files: [string, Buffer][]) {
  let req = agent.post(`/api/deployments/${deploymentId}/photos`).set('X-CSRF-Token', agent.csrf);
  for (const [name, bytes] of files) req = req.attach('photos', bytes, { filename: name, contentType: 'image/jpeg' });
  return req;
}

/** Distinct JPEGs (distinct colours → distinct bytes and hashes) with EXIF DateTimeOriginal. */
const shot = (i: number, takenAt: string) => makeJpeg({ rgb: [(i * 37) % 256, (i * 91) % 256, (i * 53) % 256], takenAt });

beforeAll(async () => {
  ctx = await makeFirm();
  other = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  otherConsultant = await signedInAgent(other.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  const property = await makeProperty(ctx.firm.id, ctx.client.id);
  propertyId = property.id;
  const unit = async (body: object) => {
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/units`, body);
    expect(res.status).toBe(201);
    return res.body.data.id as number;
  };
  siteA = await unit({ kind: 'camera-site', name: 'Creek crossing', geometry: { type: 'Point', coordinates: [-90.938, 43.267] } });
  siteB = await unit({ kind: 'camera-site', name: 'Ridge saddle', geometry: { type: 'Point', coordinates: [-90.932, 43.268] } });
  plotId = await unit({ kind: 'food-plot', name: 'Hollow plot', geometry: { type: 'Polygon', coordinates: [[[-90.937, 43.2665], [-90.936, 43.2665], [-90.936, 43.2672], [-90.937, 43.2672], [-90.937, 43.2665]]] } });
  await unit({ kind: 'access-route', name: 'South lane', geometry: { type: 'LineString', coordinates: [[-90.94, 43.2655], [-90.938, 43.2665]] } });
});

describe('cameras, deployments and card pulls', () => {
  let cameraId: number;
  let deploymentId: number;

  it('adds a camera (201) and refuses a second with the same label (409)', async () => {
    const res = await send(consultant, 'post', '/api/cameras', { label: 'Cam 1', serial: 'SN-0001' });
    expect(res.status).toBe(201);
    const camera = CameraDtoSchema.parse(res.body.data);
    expect(camera).toMatchObject({ label: 'Cam 1', serial: 'SN-0001', retired: false, deployment: null });
    cameraId = camera.id;
    const again = await send(consultant, 'post', '/api/cameras', { label: 'Cam 1' });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatch(/already has a camera labelled/);
  });

  it('deploys it at a camera site (201), and refuses a unit that is not a camera site (422)', async () => {
    const wrong = await send(consultant, 'post', `/api/cameras/${cameraId}/deployments`, { unitId: plotId, startedOn: '2026-10-01', mode: 'photo' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error).toMatch(/is not a camera site/);
    const res = await send(consultant, 'post', `/api/cameras/${cameraId}/deployments`, { unitId: siteA, startedOn: '2026-10-01', mode: 'photo', notes: 'Facing the creek trail' });
    expect(res.status).toBe(201);
    const deployment = DeploymentDtoSchema.parse(res.body.data);
    expect(deployment).toMatchObject({ cameraLabel: 'Cam 1', unitName: 'Creek crossing', startedOn: '2026-10-01', endedOn: null, mode: 'photo', photoCount: 0 });
    deploymentId = deployment.id;
  });

  it('refuses a mode it does not know and a date that does not exist (422)', async () => {
    expect((await send(consultant, 'post', `/api/cameras/${cameraId}/deployments`, { unitId: siteB, startedOn: '2026-10-01', mode: 'timelapse' })).status).toBe(422);
    expect((await send(consultant, 'post', `/api/cameras/${cameraId}/deployments`, { unitId: siteB, startedOn: '2026-02-30', mode: 'photo' })).status).toBe(422);
  });

  it('records card pulls (201) and refuses one before the camera was set (422)', async () => {
    const early = await send(crew, 'post', `/api/deployments/${deploymentId}/pulls`, { pulledOn: '2026-09-20' });
    expect(early.status).toBe(422);
    expect(early.body.error).toMatch(/cannot be pulled before/);
    const res = await send(crew, 'post', `/api/deployments/${deploymentId}/pulls`, { pulledOn: '2026-10-22', batteryPct: 64, photoCount: 12 });
    expect(res.status).toBe(201);
    expect(CardPullDtoSchema.parse(res.body.data)).toMatchObject({ pulledOn: '2026-10-22', batteryPct: 64, photoCount: 12 });
  });

  it('lists the deployment as due for a pull after 21 days, with the access route to walk in on', async () => {
    // Last pull Oct 22; "today" (the firm's) is later than Nov 12 whenever these tests run after that.
    const res = await crew.get('/api/deployments/due');
    expect(res.status).toBe(200);
    const due = res.body.data.map((d: unknown) => DuePullDtoSchema.parse(d));
    const mine = due.find((d: { deploymentId: number }) => d.deploymentId === deploymentId);
    expect(mine).toMatchObject({ cameraLabel: 'Cam 1', since: '2026-10-22', dueOn: '2026-11-12', accessRoute: { name: 'South lane' } });
    // The lane ends 0.0005° of latitude (≈ 55.5 m ≈ 182 ft, hand-worked at 111.1 km per degree) south of the camera.
    expect(mine.accessRoute.distanceFt).toBeGreaterThanOrEqual(178);
    expect(mine.accessRoute.distanceFt).toBeLessThanOrEqual(186);
    // Another firm never sees it.
    const theirs = await otherConsultant.get('/api/deployments/due');
    expect(theirs.body.data.some((d: { deploymentId: number }) => d.deploymentId === deploymentId)).toBe(false);
  });

  it('ends the running deployment when the camera moves to another site', async () => {
    const moved = await send(consultant, 'post', `/api/cameras/${cameraId}/deployments`, { unitId: siteB, startedOn: '2026-11-01', mode: 'hybrid' });
    expect(moved.status).toBe(201);
    expect(moved.body.ended).toMatchObject({ id: deploymentId, endedOn: '2026-11-01' });
    const list = await consultant.get(`/api/cameras/${cameraId}/deployments`);
    expect(list.body.data.map((d: { unitName: string; endedOn: string | null }) => [d.unitName, d.endedOn])).toEqual([
      ['Ridge saddle', null],
      ['Creek crossing', '2026-11-01'],
    ]);
    const cameras = await consultant.get('/api/cameras');
    expect(cameras.body.data.find((c: { id: number }) => c.id === cameraId).deployment).toMatchObject({ unitName: 'Ridge saddle' });
  });

  it('keeps another firm out (404) and the client and crew out of the fleet (403)', async () => {
    expect((await otherConsultant.get(`/api/deployments/${deploymentId}`)).status).toBe(404);
    expect((await send(otherConsultant, 'post', `/api/deployments/${deploymentId}/pulls`, { pulledOn: '2026-10-25' })).status).toBe(404);
    expect((await send(otherConsultant, 'post', `/api/cameras/${cameraId}/deployments`, { unitId: siteA, startedOn: '2026-10-01', mode: 'photo' })).status).toBe(404);
    expect((await client.get('/api/cameras')).status).toBe(403);
    expect((await send(crew, 'post', '/api/cameras', { label: 'Crew cam' })).status).toBe(403);
  });
});

describe('a card of photos, its review and its numbers', () => {
  let deploymentId: number;
  let photoIds: number[];
  let buckIds: number[];
  // The card: camera set Oct 1 (Central daylight time, UTC−5), pulled Oct 15 → 14 camera-nights.
  // The camera's clock ran 10 minutes slow: offset +600 s.
  const card: [string, string, string][] = [
    ['IMG_0001.JPG', '2026:10:03 06:50:00', 'buck'], // 07:00 CDT
    ['IMG_0002.JPG', '2026:10:03 07:05:00', 'buck'], // 15 min later: same event
    ['IMG_0003.JPG', '2026:10:03 07:30:00', 'doe'], // 25 min later: same event
    ['IMG_0004.JPG', '2026:10:04 19:50:00', 'doe'], // 20:00 CDT next evening: new event
    ['IMG_0005.JPG', '2026:10:04 19:55:00', 'fawn'],
    ['IMG_0006.JPG', '2026:10:06 12:50:00', 'buck'], // 13:00 CDT, new event
    ['IMG_0007.JPG', '2026:10:08 01:50:00', 'doe'], // 02:00 CDT, new event
    ['IMG_0008.JPG', '2026:10:09 10:00:00', 'person'],
    ['IMG_0009.JPG', '2026:10:10 03:00:00', 'empty'],
  ];

  beforeAll(async () => {
    const cam = await send(consultant, 'post', '/api/cameras', { label: 'Cam 2' });
    const dep = await send(consultant, 'post', `/api/cameras/${cam.body.data.id}/deployments`, { unitId: siteA, startedOn: '2026-10-01', mode: 'photo', clockOffsetSeconds: 600 });
    expect(dep.status).toBe(201);
    deploymentId = dep.body.data.id;
    expect((await send(consultant, 'post', `/api/deployments/${deploymentId}/pulls`, { pulledOn: '2026-10-15' })).status).toBe(201);
  });

  it('adds a card in batches: EXIF time corrected by the clock offset, answer says added and skipped', async () => {
    const files = await Promise.all(card.map(async ([name, t], i) => [name, await shot(i, t)] as [string, Buffer]));
    const first = await upload(consultant, deploymentId, files.slice(0, 5));
    expect(first.status).toBe(201);
    const a = CardUploadResultSchema.parse(first.body.data);
    expect(a).toMatchObject({ added: 5, skipped: 0 });
    // 06:50 on the camera's clock + 10 min = 07:00 CDT = 12:00 UTC.
    expect(a.photos[0]).toMatchObject({ cameraTime: '2026-10-03T06:50:00', takenAt: '2026-10-03T12:00:00.000Z' });
    // A dropped connection: the page asks which it has, then resends the rest; a resent photo is skipped.
    const hashes = await Promise.all(files.map(async ([, b]) => (await import('node:crypto')).createHash('sha256').update(b).digest('hex')));
    const known = await send(consultant, 'post', `/api/deployments/${deploymentId}/photos/known`, { hashes });
    expect(known.status).toBe(200);
    expect(new Set(known.body.data.known)).toEqual(new Set(hashes.slice(0, 5)));
    const second = await upload(consultant, deploymentId, files.slice(4));
    const b = CardUploadResultSchema.parse(second.body.data);
    expect(b).toMatchObject({ added: 4, skipped: 1 });
    expect(b.skips[0]).toMatchObject({ name: 'IMG_0005.JPG', reason: 'duplicate' });
    expect(b.skips[0].message).toMatch(/already on this deployment/);
    const list = await consultant.get(`/api/deployments/${deploymentId}/photos`);
    expect(list.body.page.total).toBe(9);
    photoIds = list.body.data.map((p: unknown) => CameraPhotoDtoSchema.parse(p).id);
  });

  it('makes thumbnails in a background job, not on the upload request', async () => {
    const jobs = await BackgroundJob.findAll({ where: { firmId: ctx.firm.id, kind: 'camera-thumbnails' } });
    expect(jobs.length).toBeGreaterThanOrEqual(2);
    for (const job of jobs) expect((await waitForJob(job.id, 20_000))?.status).toBe('done');
    const photo = await CameraPhoto.findByPk(photoIds[0]);
    expect(photo?.thumbnailKey).toBeTruthy();
    const thumb = await readFile(photo!.thumbnailKey!);
    expect(thumb.subarray(0, 2)).toEqual(Buffer.from([0xff, 0xd8]));
    const res = await consultant.get(`/api/camera-photos/${photoIds[0]}/thumbnail`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
  });

  it('skips what is not a photo and flags absurd EXIF, keeping the rest of the batch', async () => {
    const res = await upload(consultant, deploymentId, [
      ['notes.txt', Buffer.from('not a photo at all')],
      ['IMG_2099.JPG', await makeJpeg({ rgb: [1, 2, 3], takenAt: '2099:01:01 00:00:00' })],
      ['IMG_ZERO.JPG', await makeJpeg({ rgb: [4, 5, 6], takenAt: '2026:10:05 08:00:00', latitude: 0, longitude: 0 })],
      ['plot.png', await makePng()],
    ]);
    expect(res.status).toBe(201);
    const r = CardUploadResultSchema.parse(res.body.data);
    expect(r.added).toBe(3);
    expect(r.skips).toEqual([expect.objectContaining({ name: 'notes.txt', reason: 'not-a-photo' })]);
    expect(r.flagged.find((f) => f.name === 'IMG_2099.JPG')?.message).toMatch(/in the future/);
    expect(r.flagged.find((f) => f.name === 'IMG_ZERO.JPG')?.message).toMatch(/0°, 0°/);
    expect(r.flagged.find((f) => f.name === 'plot.png')?.message).toMatch(/no capture time/);
    // Clean up: these three photos stay out of the numbers below (they are untagged anyway).
  });

  it('refuses another firm’s deployment before reading the files (404)', async () => {
    const res = await upload(otherConsultant, deploymentId, [['x.jpg', await shot(99, '2026:10:05 08:00:00')]]);
    expect(res.status).toBe(404);
  });

  it('keeps a roster of bucks with age classes per season (201), names unique (409)', async () => {
    const made = [];
    for (const [name, age] of [['Split G2', '3.5'], ['Tall eight', '4.5']] as const) {
      const res = await send(consultant, 'post', `/api/properties/${propertyId}/bucks`, { name, notes: 'Seen on the creek trail', ageEstimates: [{ season: 2026, ageClass: age }] });
      expect(res.status).toBe(201);
      made.push(BuckDtoSchema.parse(res.body.data).id);
    }
    buckIds = made;
    expect((await send(consultant, 'post', `/api/properties/${propertyId}/bucks`, { name: 'Split G2' })).status).toBe(409);
    const patched = await send(consultant, 'patch', `/api/properties/${propertyId}/bucks/${buckIds[0]}`, { ageEstimates: [{ season: 2025, ageClass: '2.5' }, { season: 2026, ageClass: '3.5' }] });
    expect(patched.status).toBe(200);
    expect(patched.body.data.ageEstimates).toEqual([{ season: 2025, ageClass: '2.5' }, { season: 2026, ageClass: '3.5' }]);
  });

  it('tags photos (buck with a roster buck); another firm’s photo is a 404; a buck id on a doe is a 422', async () => {
    const buckFor = [buckIds[0], buckIds[1], null, null, null, buckIds[0]];
    for (const [i, [, , tag]] of card.entries()) {
      const body = tag === 'buck' ? { tag, buckId: buckFor[i] } : { tag };
      const res = await send(consultant, 'patch', `/api/camera-photos/${photoIds[i]}`, body);
      expect(res.status).toBe(200);
      expect(CameraPhotoDtoSchema.parse(res.body.data).tag).toBe(tag);
    }
    expect((await send(otherConsultant, 'patch', `/api/camera-photos/${photoIds[0]}`, { tag: 'doe' })).status).toBe(404);
    const bad = await send(consultant, 'patch', `/api/camera-photos/${photoIds[2]}`, { tag: 'doe', buckId: buckIds[0] });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/only a photo tagged buck/);
    expect((await send(consultant, 'patch', `/api/camera-photos/${photoIds[0]}`, { tag: 'moose' })).status).toBe(422);
  });

  it('answers the events: 30-minute grouping, camera-nights, events per 100 camera-nights, daylight share', async () => {
    const res = await consultant.get(`/api/deployments/${deploymentId}/events`);
    expect(res.status).toBe(200);
    const e = DeploymentEventsDtoSchema.parse(res.body.data);
    // Hand-worked from the card above: deer events Oct 3 07:00, Oct 4 20:00, Oct 6 13:00, Oct 8 02:00 CDT → 4;
    // the person makes one event of its own; the empty photo none.
    expect(e.eventCount).toBe(4);
    expect(e.eventsByKind).toEqual({ deer: 4, 'other-species': 0, person: 1 });
    expect(e.cameraNights).toBe(14); // set Oct 1, last pull Oct 15
    expect(e.eventsPer100CameraNights).toBeCloseTo((4 / 14) * 100, 6);
    expect(e.events[0]).toMatchObject({ kind: 'deer', photoIds: photoIds.slice(0, 3), tags: { buck: 2, doe: 1 } });
    // Sunrise at 43.27° N, 90.94° W on Oct 3 is about 7:04 CDT and sunset about 18:41 CDT (suncalc,
    // checked against NOAA's equations in the unit test): 07:00 is before sunrise (dawn), 20:00 after
    // sunset, 13:00 in daylight, 02:00 at night → one of four in daylight.
    expect(e.activity.daylightShare).toBeCloseTo(0.25, 6);
    expect([e.activity.byHour[7], e.activity.byHour[20], e.activity.byHour[13], e.activity.byHour[2]]).toEqual([1, 1, 1, 1]);
    expect(e.activity.bySun).toEqual({ dawn: 1, day: 1, dusk: 0, night: 2 });
  });

  it('a corrected clock offset moves the photos’ times', async () => {
    const res = await send(consultant, 'patch', `/api/deployments/${deploymentId}`, { clockOffsetSeconds: 0 });
    expect(res.status).toBe(200);
    const photo = await consultant.get(`/api/deployments/${deploymentId}/photos?limit=1`);
    expect(photo.body.data[0].takenAt).toBe('2026-10-03T11:50:00.000Z');
    expect((await send(consultant, 'patch', `/api/deployments/${deploymentId}`, { clockOffsetSeconds: 600 })).status).toBe(200);
  });

  it('makes a survey from the tagged photos whose estimates match the tallies, for the area the cameras cover', async () => {
    await Property.update({ acres: 640 }, { where: { id: propertyId } });
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { name: 'October card', fromPhotos: { deploymentIds: [deploymentId], from: '2026-10-01', to: '2026-10-14' } });
    expect(res.status).toBe(201);
    const s = res.body.data;
    // Tags: buck photos 3 (two of Split G2, one of Tall eight) → 2 unique bucks; doe photos 3; fawn 1.
    expect(s).toMatchObject({ buckPhotos: 3, uniqueBucks: 2, doePhotos: 3, fawnPhotos: 1, cameraCount: 1, areaAcres: 100, cameraUnitIds: [siteA] });
    const expected = cameraSurveyEstimates({ buckPhotos: 3, uniqueBucks: 2, doePhotos: 3, fawnPhotos: 1, cameraCount: 1, propertyAcres: 100, startDate: '2026-10-01', endDate: '2026-10-14' });
    expect(s.estimates).toEqual(expected.estimates);
    // Hand-worked: 1.5 photos per buck; does 3 ÷ 1.5 = 2; fawns 1 ÷ 1.5 = 0.667; total 4.667 on 100 acres → 29.9 per mi².
    expect(s.display.deerPerSqMi).toBe('29.9');
    expect(s.bucks).toEqual([{ label: 'Split G2', ageClass: '3.5' }, { label: 'Tall eight', ageClass: '4.5' }]);
  });

  it('refuses a survey from photos with nothing to estimate or another property’s deployment (422)', async () => {
    const none = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { name: 'Empty', fromPhotos: { deploymentIds: [deploymentId], from: '2026-10-11', to: '2026-10-14' } });
    expect(none.status).toBe(422);
    expect(none.body.error).toMatch(/tagged buck/);
    const elsewhere = await makeProperty(ctx.firm.id, ctx.client.id);
    const wrong = await send(consultant, 'post', `/api/properties/${elsewhere.id}/surveys`, { name: 'Wrong', fromPhotos: { deploymentIds: [deploymentId], from: '2026-10-01', to: '2026-10-14' } });
    expect(wrong.status).toBe(422);
    expect((await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { name: 'Back', fromPhotos: { deploymentIds: [deploymentId], from: '2026-10-14', to: '2026-10-01' } })).status).toBe(422);
  });

  it('shows the landowner only the featured roster photos, never a person', async () => {
    expect((await send(consultant, 'patch', `/api/camera-photos/${photoIds[0]}`, { tag: 'buck', buckId: buckIds[0], featured: true })).status).toBe(200);
    const person = await send(consultant, 'patch', `/api/camera-photos/${photoIds[7]}`, { tag: 'person', featured: true });
    expect(person.status).toBe(422);
    const roster = await client.get(`/api/properties/${propertyId}/bucks`);
    expect(roster.status).toBe(200);
    const split = roster.body.data.map((b: unknown) => BuckDtoSchema.parse(b)).find((b: { name: string }) => b.name === 'Split G2');
    expect(split.photos.map((p: { id: number }) => p.id)).toEqual([photoIds[0]]);
    expect((await client.get(`/api/camera-photos/${photoIds[0]}/file`)).status).toBe(200);
    expect((await client.get(`/api/camera-photos/${photoIds[5]}/file`)).status).toBe(404); // not featured
    expect((await client.get(`/api/camera-photos/${photoIds[7]}/file`)).status).toBe(404); // a person
    const staff = await consultant.get(`/api/properties/${propertyId}/bucks`);
    expect(staff.body.data.find((b: { name: string }) => b.name === 'Split G2').photoCount).toBe(2);
  });
});

describe('the firm’s camera settings', () => {
  it('a shorter event gap splits the card into more events; a longer pull interval takes a camera off the due list', async () => {
    const owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
    const cam = await send(consultant, 'post', '/api/cameras', { label: 'Cam settings' });
    const dep = await send(consultant, 'post', `/api/cameras/${cam.body.data.id}/deployments`, { unitId: siteB, startedOn: '2026-11-20', mode: 'photo' });
    const files: [string, Buffer][] = [
      ['A.JPG', await shot(201, '2026:11:21 07:00:00')],
      ['B.JPG', await shot(202, '2026:11:21 07:20:00')],
    ];
    const up = await upload(consultant, dep.body.data.id, files);
    for (const p of up.body.data.photos) await send(consultant, 'patch', `/api/camera-photos/${p.id}`, { tag: 'doe' });
    const before = await consultant.get(`/api/deployments/${dep.body.data.id}/events`);
    expect(before.body.data.eventCount).toBe(1); // 20 minutes apart, gap 30
    expect((await send(owner, 'patch', '/api/firm/settings', { eventGapMinutes: 10 })).status).toBe(200);
    const after = await consultant.get(`/api/deployments/${dep.body.data.id}/events`);
    expect(after.body.data).toMatchObject({ eventCount: 2, gapMinutes: 10 });
    expect((await send(owner, 'patch', '/api/firm/settings', { cardPullIntervalDays: 365 })).status).toBe(200);
    expect((await consultant.get('/api/deployments/due')).body.data).toEqual([]);
    expect((await send(owner, 'patch', '/api/firm/settings', { eventGapMinutes: 0 })).status).toBe(422);
    await send(owner, 'patch', '/api/firm/settings', { eventGapMinutes: 30, cardPullIntervalDays: 21 });
  });
});
