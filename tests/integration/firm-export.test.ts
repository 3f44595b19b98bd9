/**
 * Take your data with you: the owner's whole-firm zip, built by a background job (the worker runs in
 * this process), with progress, an e-mail through the outbox, and a download only the firm's owner
 * can make. The zip is read back with yauzl and its CSV, GeoJSON and files compared with the database.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import yauzl from 'yauzl';
import { anonymousAgent, propertyWithBrassicaPlot, signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { send } from '../support/firm-settings';
import { OutboxMessage } from '../../server/models';
import { FirmExport } from '../../server/models/firm-export';
import { waitForJob } from '../../server/services/jobs/job-queue';
import { FirmExportSchema } from '../../shared/schemas/firm-export';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let owner: Agent;
let consultant: Agent;
let propertyId: number;
const PDF = Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');


/** Every entry of a zip, name → bytes. */
function unzip(bytes: Buffer): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(bytes, { lazyEntries: true }, (err, zip) => {
      if (err || !zip) return reject(err);
      const out = new Map<string, Buffer>();
      zip.on('entry', (entry: yauzl.Entry) => {
        zip.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            out.set(entry.fileName, Buffer.concat(chunks));
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(out));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}

const rawBody = (agent: Agent, url: string) =>
  agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  ctx = await makeFirm();
  await ctx.client.update({ name: 'Halvorsen, "Big" Trust', notes: '=HYPERLINK("x")' });
  owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
  const file = await consultant.post('/api/files').set('X-CSRF-Token', consultant.csrf).field('clientId', String(ctx.client.id)).field('category', 'soil-test').attach('file', PDF, 'soil test.pdf');
  expect(file.status).toBe(201);
  const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { taxRatePct: 5.5, depositPct: 30 });
  expect(draft.status).toBe(201);
  // Another firm, whose records must never be in this firm's zip.
  const other = await makeFirm();
  await other.client.update({ name: 'Other Firm Client Zebulon' });
});

describe('the whole-firm export', () => {
  it('is built in the background with progress, e-mailed when ready, and holds a CSV per table, a GeoJSON per property, the PDFs and the files', async () => {
    const started = await send(owner, 'post', '/api/firm-exports');
    expect(started.status).toBe(202);
    const dto = FirmExportSchema.parse(started.body.data);
    expect(dto).toMatchObject({ status: 'building', downloadUrl: null });
    // One at a time: a second request while the first is building is refused with a sentence.
    const record = await FirmExport.findByPk(dto.id);
    if (record!.status === 'building') {
      const twice = await send(owner, 'post', '/api/firm-exports');
      expect([202, 409]).toContain(twice.status);
      if (twice.status === 409) expect(twice.body.error).toMatch(/already being built/);
    }
    expect((await waitForJob(dto.jobId!, 60_000))!.status).toBe('done');
    const list = await owner.get('/api/firm-exports').expect(200);
    const ready = FirmExportSchema.parse(list.body.data.find((e: { id: number }) => e.id === dto.id));
    expect(ready).toMatchObject({ status: 'ready', progress: 100, downloadUrl: `/api/firm-exports/${dto.id}/download` });
    expect(ready.fileCount).toBeGreaterThan(10);

    const mail = await OutboxMessage.findOne({ where: { firmId: ctx.firm.id, kind: 'firm-export-ready' } });
    expect(mail!.toAddress).toBe(ctx.users.owner.email);
    expect(mail!.textBody).toMatch(/\/settings\/export/);

    const res = await rawBody(owner, ready.downloadUrl!);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="firm-[a-f0-9]+-export-\d{4}-\d{2}-\d{2}\.zip"$/);
    const entries = await unzip(res.body as Buffer);
    const names = [...entries.keys()];
    for (const table of ['firms', 'clients', 'properties', 'units', 'proposals', 'proposal_lines', 'users', 'practices', 'shared_files']) expect(names, table).toContain(`tables/${table}.csv`);
    for (const secret of ['auth_tokens', 'outbox_messages', 'background_jobs', 'calendar_feeds']) expect(names).not.toContain(`tables/${secret}.csv`);
    const clients = entries.get('tables/clients.csv')!.toString('utf8');
    // RFC 4180 quoting, a formula defused (OWASP CSV injection), no other firm's rows.
    expect(clients).toContain('"Halvorsen, ""Big"" Trust"');
    expect(clients).toContain(`"'=HYPERLINK(""x"")"`);
    expect(clients).not.toContain('Zebulon');
    expect(clients.split('\r\n').filter(Boolean)).toHaveLength(2);
    const users = entries.get('tables/users.csv')!.toString('utf8');
    expect(users.split('\r\n')[0]).not.toContain('password_hash');
    expect(users).toContain(ctx.users.owner.email);

    const geo = names.find((n) => n.startsWith(`properties/${propertyId}-`))!;
    const collection = JSON.parse(entries.get(geo)!.toString('utf8'));
    expect(collection.type).toBe('FeatureCollection');
    expect(collection.features[0].properties.role).toBe('boundary');
    expect(collection.features.some((f: { properties: { role: string } }) => f.properties.role === 'unit')).toBe(true);

    const proposalPdf = names.find((n) => n.startsWith('documents/proposals/'))!;
    expect(entries.get(proposalPdf)!.subarray(0, 5).toString()).toBe('%PDF-');
    const shared = names.find((n) => n.startsWith('files/shared-files/') && n.endsWith('soil-test.pdf'))!;
    expect(entries.get(shared)!.equals(PDF)).toBe(true);
    expect(entries.get('README.txt')!.toString()).toMatch(/one CSV file per table/);
  }, 120_000);

  it('is for the owner of the firm only: consultants, other firms and strangers cannot start, list or download it', async () => {
    const mine = await FirmExport.findOne({ where: { firmId: ctx.firm.id, status: 'ready' } });
    expect((await send(consultant, 'post', '/api/firm-exports')).status).toBe(403);
    expect((await consultant.get('/api/firm-exports')).status).toBe(403);
    expect((await consultant.get(`/api/firm-exports/${mine!.id}/download`)).status).toBe(403);
    const other = await makeFirm();
    const otherOwner = await signedInAgent(other.users.owner.email, PASSWORD);
    expect((await otherOwner.get(`/api/firm-exports/${mine!.id}/download`)).status).toBe(404);
    expect((await otherOwner.get(`/api/firm-exports/${mine!.id}`)).status).toBe(404);
    expect((await (await anonymousAgent()).get(`/api/firm-exports/${mine!.id}/download`)).status).toBe(401);
  });

  it('answers 409 with a sentence for an export not ready yet, and 422 for a bad id', async () => {
    const building = await FirmExport.create({ firmId: ctx.firm.id, requestedById: null, jobId: null, storageKey: null, byteSize: null, fileCount: null, finishedAt: null });
    const res = await owner.get(`/api/firm-exports/${building.id}/download`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/not ready yet/);
    await building.destroy();
    expect((await owner.get('/api/firm-exports/0x10/download')).status).toBe(422);
  });
});
