import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeClient, makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { SharedFileSchema } from '../../shared/schemas/file';
import { demoPhotoPng } from '../../server/db/seeds/demo-portal';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let client: Agent;
let crew: Agent;
let otherClient: Agent;
let propertyId: number;
let otherPropertyId: number;

// "%PDF-" is the PDF header (ISO 32000-1:2008, 7.5.2); a minimal body is enough for content sniffing.
const PDF = Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');
// "MZ" is the DOS/PE executable header (Microsoft PE/COFF specification, "MS-DOS stub").
const EXE = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(200, 0)]);

const upload = (agent: Agent, bytes: Buffer, name: string, fields: Record<string, string>) => {
  let req = agent.post('/api/files').set('X-CSRF-Token', agent.csrf);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', bytes, name);
};
const rawBody = (agent: Agent, url: string) =>
  agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  const other = await makeClient(ctx.firm.id);
  otherClient = await signedInAgent((await makeUser(ctx.firm.id, 'client', other.id)).email, PASSWORD);
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  otherPropertyId = (await makeProperty(ctx.firm.id, other.id)).id;
});

describe('staff share files with a client', () => {
  it('uploads a PDF for a client’s property and the client can list and download it', async () => {
    const res = await upload(consultant, PDF, 'soil.pdf', { clientId: String(ctx.client.id), propertyId: String(propertyId), category: 'soil-test', title: 'Soil test 2026' });
    expect(res.status).toBe(201);
    const file = SharedFileSchema.parse(res.body.data);
    expect(file).toMatchObject({ title: 'Soil test 2026', category: 'soil-test', contentType: 'application/pdf', visibleToClient: true, uploadedByRole: 'staff', propertyId });
    const list = await client.get('/api/files');
    expect(list.body.data.map((f: { id: number }) => f.id)).toContain(file.id);
    const dl = await rawBody(client, file.url);
    expect(dl.status).toBe(200);
    expect(dl.headers['content-type']).toBe('application/pdf');
    expect(dl.headers['content-disposition']).toMatch(/^attachment; filename="Soil test 2026\.pdf"/);
    expect(dl.headers['content-security-policy']).toMatch(/sandbox/);
    expect((dl.body as Buffer).equals(PDF)).toBe(true);
  });

  it('keeps a private file from the client until it is shared, and back', async () => {
    const res = await upload(consultant, demoPhotoPng(), 'map.png', { clientId: String(ctx.client.id), category: 'map', visibleToClient: 'false' });
    expect(res.status).toBe(201);
    const id = res.body.data.id as number;
    expect(res.body.data.contentType).toBe('image/png');
    expect((await client.get(`/api/files/${id}`)).status).toBe(404);
    expect((await client.get('/api/files')).body.data.map((f: { id: number }) => f.id)).not.toContain(id);
    const shared = await consultant.patch(`/api/files/${id}`).set('X-CSRF-Token', consultant.csrf).send({ visibleToClient: true, title: 'Plan map' });
    expect(shared.status).toBe(200);
    expect(shared.body.data).toMatchObject({ visibleToClient: true, title: 'Plan map' });
    expect((await client.get(`/api/files/${id}`)).status).toBe(200);
  });

  it('filters the staff list by client and property', async () => {
    const byClient = await consultant.get(`/api/files?clientId=${ctx.client.id}`);
    expect(byClient.body.data.length).toBeGreaterThanOrEqual(2);
    expect(byClient.body.data.every((f: { clientId: number }) => f.clientId === ctx.client.id)).toBe(true);
    const byProperty = await consultant.get(`/api/files?propertyId=${propertyId}`);
    expect(byProperty.body.data.every((f: { propertyId: number }) => f.propertyId === propertyId)).toBe(true);
  });

  it('refuses a property of another client, an unknown category and a missing file with a sentence to act on', async () => {
    const wrong = await upload(consultant, PDF, 'a.pdf', { clientId: String(ctx.client.id), propertyId: String(otherPropertyId), category: 'map' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error).toMatch(/belongs to another client/);
    const cat = await upload(consultant, PDF, 'a.pdf', { clientId: String(ctx.client.id), category: 'client-upload' });
    expect(cat.status).toBe(422);
    expect(cat.body.error).toMatch(/category/);
    const none = await consultant.post('/api/files').set('X-CSRF-Token', consultant.csrf).field('clientId', String(ctx.client.id)).field('category', 'map');
    expect(none.status).toBe(400);
    expect(none.body.error).toMatch(/Attach the file/);
  });
});

describe('uploads are checked by content', () => {
  const fields = () => ({ clientId: String(ctx.client.id), category: 'other' });
  it.each([
    ['an executable renamed .pdf', EXE, 'report.pdf', /EXE file/],
    ['HTML renamed .txt', Buffer.from('<!DOCTYPE html><html><script>alert(1)</script></html>'), 'notes.txt', /markup or script/],
    ['an SVG image', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'logo.svg', /could not be recognised/],
    ['SVG renamed .csv', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"></svg>'), 'data.csv', /markup or script/],
    ['binary bytes renamed .txt', Buffer.from([0x41, 0x00, 0x42, 0x01]), 'notes.txt', /not plain UTF-8 text/],
    ['an empty file', Buffer.alloc(0), 'empty.txt', /empty/],
  ])('refuses %s with 415', async (_label, bytes, name, message) => {
    const res = await upload(consultant, bytes, name, fields());
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(message);
    expect(res.body.error).toMatch(/Upload a PDF/);
  });

  it('accepts a CSV table and a plain-text note and serves them as text, as attachments', async () => {
    const csv = await upload(consultant, Buffer.from('unit,acres\nNorth plot,2.37\n'), 'acres.csv', fields());
    expect(csv.status).toBe(201);
    expect(csv.body.data.contentType).toBe('text/csv; charset=utf-8');
    const txt = await upload(consultant, Buffer.from('Gate code is on the lockbox. Cattle out until June.\n'), 'note.txt', fields());
    expect(txt.status).toBe(201);
    const dl = await client.get(txt.body.data.url);
    expect(dl.headers['content-type']).toBe('text/plain; charset=utf-8');
    expect(dl.headers['content-disposition']).toMatch(/^attachment; filename="note\.txt"/);
  });

  it('refuses a file over the size cap with 413', async () => {
    const big = Buffer.concat([PDF, Buffer.alloc(15 * 1024 * 1024 + 1, 32)]);
    const res = await upload(consultant, big, 'big.pdf', fields());
    expect(res.status).toBe(413);
  });
});

describe('client uploads and ownership', () => {
  it('refuses a client upload until the consultant allows it, then stores it as the client’s own', async () => {
    const refused = await upload(client, PDF, 'deed.pdf', { title: 'Deed' });
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/Ask your consultant/);
    const allow = await consultant.patch(`/api/clients/${ctx.client.id}`).set('X-CSRF-Token', consultant.csrf).send({ portalUploadsAllowed: true });
    expect(allow.status).toBe(200);
    expect(allow.body.data.portalUploadsAllowed).toBe(true);
    const ok = await upload(client, PDF, 'deed.pdf', { title: 'Deed', category: 'map', propertyId: String(propertyId) });
    expect(ok.status).toBe(201);
    expect(ok.body.data).toMatchObject({ category: 'client-upload', uploadedByRole: 'client', visibleToClient: true, clientId: ctx.client.id });
    // A client cannot attach its upload to another client's property.
    const foreign = await upload(client, PDF, 'deed.pdf', { propertyId: String(otherPropertyId) });
    expect(foreign.status).toBe(404);
    // Staff cannot hide a client's own upload from them.
    const hide = await consultant.patch(`/api/files/${ok.body.data.id}`).set('X-CSRF-Token', consultant.csrf).send({ visibleToClient: false });
    expect(hide.status).toBe(400);
    expect(hide.body.error).toMatch(/client uploaded this file/);
  });

  it('hides a client’s files from another client and from crew, and lets only staff edit or delete', async () => {
    const mine = (await client.get('/api/files')).body.data as { id: number }[];
    const id = mine[0].id;
    expect((await otherClient.get(`/api/files/${id}`)).status).toBe(404);
    expect((await otherClient.get('/api/files')).body.data).toEqual([]);
    expect((await crew.get('/api/files')).status).toBe(403);
    expect((await crew.get(`/api/files/${id}`)).status).toBe(403);
    expect((await client.patch(`/api/files/${id}`).set('X-CSRF-Token', client.csrf).send({ title: 'x' })).status).toBe(403);
    expect((await client.delete(`/api/files/${id}`).set('X-CSRF-Token', client.csrf)).status).toBe(403);
    const del = await consultant.delete(`/api/files/${id}`).set('X-CSRF-Token', consultant.csrf);
    expect(del.status).toBe(204);
    expect((await client.get(`/api/files/${id}`)).status).toBe(404);
  });

  it('answers another firm 404 for a file id', async () => {
    const stranger = await makeFirm();
    const outsider = await signedInAgent(stranger.users.consultant.email, PASSWORD);
    const id = (await client.get('/api/files')).body.data[0].id;
    expect((await outsider.get(`/api/files/${id}`)).status).toBe(404);
    expect((await outsider.delete(`/api/files/${id}`).set('X-CSRF-Token', outsider.csrf)).status).toBe(404);
  });
});

describe('preview of a client’s files', () => {
  it('answers staff the client’s visible list, the same as the client reads', async () => {
    const own = (await client.get('/api/files')).body.data;
    const preview = await consultant.get(`/api/portal/preview/${ctx.client.id}/files`);
    expect(preview.status).toBe(200);
    expect(preview.body.data).toEqual(own);
  });
});
