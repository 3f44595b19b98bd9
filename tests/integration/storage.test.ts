/**
 * Files in object storage: the whole file path (shared files, task photos, season report PDFs and
 * their photos, imagery overlays) against a local S3-compatible fake, the 404 for a missing object,
 * and the sweep of files no row points to.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { encode } from 'fast-png';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { startS3Fake, type S3Fake } from '../support/s3-fake';
import { OutboxMessage, SharedFile, Task, TaskPhoto } from '../../server/models';
import { createS3Storage } from '../../server/services/storage/s3-storage';
import { saveFile, storage, useStorage, type Storage } from '../../server/services/storage/storage';
import { sweepOrphanFiles } from '../../server/services/storage/orphan-sweeper';
import { ObservationPhoto } from '../../server/models';
import { makeJpeg } from '../support/photo-fixtures';
import { OBSERVATION_PHOTO_FOLDERS } from '../../server/commands/observation-logger';

let fake: S3Fake;
let previous: Storage | null;
/** A second client of the same bucket: what another app instance sees. */
let elsewhere: Storage;
let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let client: Agent;
let propertyId: number;

// "%PDF-" is the PDF header (ISO 32000-1:2008, 7.5.2); a minimal body is enough for content sniffing.
const PDF = Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');
const png = (shade: number) => Buffer.from(encode({ width: 4, height: 3, data: new Uint8Array(36).fill(shade), channels: 3 }));
const send = (agent: Agent, method: 'post' | 'patch' | 'delete', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);
const bytesOf = (agent: Agent, url: string) =>
  agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
const s3Options = () => ({ bucket: fake.bucket, region: 'us-east-1', endpoint: fake.endpoint, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', forcePathStyle: true });

beforeAll(async () => {
  fake = await startS3Fake();
  previous = useStorage(createS3Storage(s3Options()));
  elsewhere = createS3Storage(s3Options());
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
});

afterAll(async () => {
  useStorage(previous);
  await fake.close();
});

describe('STORAGE=s3', () => {
  it('keeps an uploaded file in the bucket, so another instance serves it, and removes it on delete', async () => {
    expect(storage().kind).toBe('s3');
    const res = await consultant.post('/api/files').set('X-CSRF-Token', consultant.csrf).field('clientId', String(ctx.client.id)).field('category', 'soil-test').attach('file', PDF, 'soil.pdf');
    expect(res.status).toBe(201);
    const row = await SharedFile.findByPk(res.body.data.id);
    expect((await elsewhere.get(row!.storageKey)).equals(PDF)).toBe(true);

    const dl = await bytesOf(client, res.body.data.url);
    expect(dl.status).toBe(200);
    expect(dl.headers['content-length']).toBe(String(PDF.length));
    expect((dl.body as Buffer).equals(PDF)).toBe(true);

    expect((await send(consultant, 'delete', `/api/files/${row!.id}`)).status).toBe(204);
    await expect(elsewhere.get(row!.storageKey)).rejects.toThrow(/missing/);
  });

  it('answers 404 with a sentence when the row’s object is gone, never a 500', async () => {
    const res = await consultant.post('/api/files').set('X-CSRF-Token', consultant.csrf).field('clientId', String(ctx.client.id)).field('category', 'map').attach('file', png(40), 'map.png');
    expect(res.status).toBe(201);
    const row = await SharedFile.findByPk(res.body.data.id);
    await elsewhere.remove(row!.storageKey);
    const dl = await consultant.get(res.body.data.url);
    expect(dl.status).toBe(404);
    expect(dl.body).toMatchObject({ code: 'stored_file_missing', error: expect.stringMatching(/missing from storage.*Upload it again/) });
  });

  it('serves a task photo and puts photos read from the bucket into the season report, whose PDF lands there too', async () => {
    const plot = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'food-plot', name: 'Hollow plot', geometry: rectangle(-90.937, 43.2665, 120, 80) });
    expect(plot.status).toBe(201);
    const base = { firmId: ctx.firm.id, propertyId, unitId: plot.body.data.id, prescriptionId: null, proposalId: null, kind: 'planting', practiceName: 'Fall brassica plot', unitName: 'Hollow plot', earliest: '2024-08-01', latest: '2024-09-15', startDate: null, endDate: null, assigneeId: null };
    const sow = await Task.create({ ...base, stepKey: 'sow', name: 'Sow the brassica blend', status: 'done', doneOn: '2024-08-20', costCents: 30_000 });
    const photoBytes = png(120);
    // Written by "another instance": straight into the bucket, not through this process.
    const storageKey = `photos/${'ab'.repeat(16)}.png`;
    await elsewhere.put(storageKey, photoBytes, 'image/png');
    const photo = await TaskPhoto.create({ firmId: ctx.firm.id, taskId: sow.id, storageKey, originalName: 'plot.png', contentType: 'image/png', byteSize: photoBytes.length, latitude: null, longitude: null, takenAt: null, uploadedById: null });

    const shown = await bytesOf(client, `/api/task-photos/${photo.id}`);
    expect(shown.status).toBe(200);
    expect((shown.body as Buffer).equals(photoBytes)).toBe(true);

    const made = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2024 });
    expect(made.status).toBe(201);
    const pdf = await bytesOf(consultant, made.body.data.pdfUrl);
    expect(pdf.status).toBe(200);
    const images = execFileSync('pdfimages', ['-list', '-'], { input: pdf.body as Buffer }).toString();
    expect(images.split('\n').filter((l) => /^\s+\d+\s+\d+\s+image/.test(l)).length).toBe(1); // the photo from the bucket
    const reportFile = await SharedFile.findOne({ where: { propertyId, category: 'season-report' } });
    expect((await elsewhere.get(reportFile!.storageKey)).equals(pdf.body as Buffer)).toBe(true);

    // Sending reads the PDF back from the bucket and attaches it.
    const sent = await send(consultant, 'post', `/api/season-reports/${made.body.data.id}/send`);
    expect(sent.status).toBe(200);
    const mail = await OutboxMessage.findOne({ where: { kind: 'season-report-sent', toAddress: ctx.users.client.email } });
    expect(Buffer.from(mail!.attachments[0].contentBase64, 'base64').equals(pdf.body as Buffer)).toBe(true);
  });

  it('sweeps files no row points to once they are older than the grace period, and keeps the rest', async () => {
    const orphan = await saveFile('photos', png(10), 'png');
    const fresh = await saveFile('photos', png(20), 'png');
    const kept = await consultant.post('/api/files').set('X-CSRF-Token', consultant.csrf).field('clientId', String(ctx.client.id)).field('category', 'soil-test').attach('file', PDF, 'kept.pdf');
    const keptKey = (await SharedFile.findByPk(kept.body.data.id))!.storageKey;

    // A grace of zero at "an hour from now": everything is old enough, so only references protect a file.
    const later = new Date(Date.now() + 60 * 60 * 1000);
    const { removed } = await sweepOrphanFiles({ graceMs: 0, now: later });
    expect(removed).toContain(orphan);
    expect(removed).toContain(fresh);
    expect(removed).not.toContain(keptKey);
    await expect(elsewhere.get(orphan)).rejects.toThrow(/missing/);
    expect((await elsewhere.get(keptKey)).equals(PDF)).toBe(true);

    // With the default hour of grace, a file saved just now is left alone (its row may be on its way).
    const young = await saveFile('photos', png(30), 'png');
    expect((await sweepOrphanFiles()).removed).not.toContain(young);
  });

  it('sweeps the observation photo and thumbnail folders too, keeping the files an observation points to', async () => {
    // A scrape with a photo whose EXIF GPS is inside the factory's property boundary (lon −90.94…−90.93, lat 43.265…43.27).
    const photo = await makeJpeg({ width: 640, height: 480, takenAt: '2026:10:14 07:31:05', latitude: 43.266, longitude: -90.937 });
    const logged = await consultant
      .post(`/api/properties/${propertyId}/observations`)
      .set('X-CSRF-Token', consultant.csrf)
      .set('Idempotency-Key', `sweep-${Date.now()}`)
      .field('kind', 'scrape')
      .attach('photos', photo, { filename: 'scrape.jpg', contentType: 'image/jpeg' });
    expect(logged.status).toBe(201);
    const row = await ObservationPhoto.findOne({ where: { observationId: logged.body.data.id } });
    expect(row?.thumbnailKey).toBeTruthy();
    const keptPhoto = row!.storageKey;
    const keptThumb = row!.thumbnailKey!;
    expect(keptPhoto.startsWith(`${OBSERVATION_PHOTO_FOLDERS.photos}/`)).toBe(true);
    expect(keptThumb.startsWith(`${OBSERVATION_PHOTO_FOLDERS.thumbnails}/`)).toBe(true);
    // What a lost transaction leaves behind in each folder.
    const orphanPhoto = await saveFile(OBSERVATION_PHOTO_FOLDERS.photos, photo, 'jpg');
    const orphanThumb = await saveFile(OBSERVATION_PHOTO_FOLDERS.thumbnails, png(40), 'png');

    const { removed } = await sweepOrphanFiles({ graceMs: 0, now: new Date(Date.now() + 60 * 60 * 1000) });
    expect(removed).toEqual(expect.arrayContaining([orphanPhoto, orphanThumb]));
    expect(removed).not.toContain(keptPhoto);
    expect(removed).not.toContain(keptThumb);
    await expect(elsewhere.get(orphanPhoto)).rejects.toThrow(/missing/);
    await expect(elsewhere.get(orphanThumb)).rejects.toThrow(/missing/);
    expect((await elsewhere.get(keptPhoto)).length).toBeGreaterThan(0);
    expect((await elsewhere.get(keptThumb)).length).toBeGreaterThan(0);
  });
});
