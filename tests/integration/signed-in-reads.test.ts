/**
 * A signed-in read costs little: the session user is read lean (what authorization needs, never the
 * password hash) yet still honours deactivation and role changes at once; the plan read checks its
 * revision first and sends its cached answer precompressed in the encoding the browser accepts.
 */
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import request from 'supertest';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { signedInAgent, testApp, type Agent } from '../support/test-app';
import { readSessionUser } from '../../server/services/auth/passport';
import { User } from '../../server/models';
import { sequelize } from '../../server/db/sequelize';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let propertyId: number;

/** The bytes of an answer as a Buffer (after supertest's inflating). */
const raw = (res: request.Response) => res.body as Buffer;
const rawParser = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  const res = await consultant
    .post(`/api/properties/${propertyId}/units`)
    .set('X-CSRF-Token', consultant.csrf)
    .send({ kind: 'food-plot', name: 'Clover Plot', geometry: { type: 'Polygon', coordinates: [[[-90.938, 43.268], [-90.936, 43.268], [-90.936, 43.267], [-90.938, 43.267], [-90.938, 43.268]]] } });
  expect(res.status).toBe(201);
});

describe('the session user', () => {
  it('is read without the password hash, with the firm name', async () => {
    const user = await readSessionUser(ctx.users.consultant.id);
    expect(user).toEqual({ id: ctx.users.consultant.id, email: ctx.users.consultant.email, name: ctx.users.consultant.name, role: 'consultant', firmId: ctx.firm.id, firmName: ctx.firm.name, firmTimezone: ctx.firm.timezone, firmAreaUnit: 'acres', firmLengthUnit: 'feet', clientId: null });
    expect(Object.keys(user!)).not.toContain('passwordHash');
  });

  it('is read with the session itself: a signed-in read makes no query of its own for the user or the firm settings', async () => {
    const spy = vi.spyOn(sequelize, 'query');
    try {
      const res = await consultant.get(`/api/properties/${propertyId}/units`);
      expect(res.status).toBe(200);
      const sqls = spy.mock.calls.map(([sql]) => String(typeof sql === 'object' && sql !== null && 'query' in sql ? (sql as { query: string }).query : sql));
      expect(sqls.filter((q) => /FROM users u JOIN firms f/.test(q))).toEqual([]);
      expect(sqls.filter((q) => /settings->>'idleTimeoutHours'/.test(q))).toEqual([]);
      // The firm's answer headers still come from its settings (read along with the session).
      expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    } finally {
      spy.mockRestore();
    }
  });

  it('signs out a deactivated user on the next request, and a role change applies at once', async () => {
    const crew = await makeUser(ctx.firm.id, 'crew');
    const agent = await signedInAgent(crew.email, PASSWORD);
    await agent.get(`/api/properties/${propertyId}/units`).expect(403);
    await User.update({ role: 'consultant' }, { where: { id: crew.id } });
    await agent.get(`/api/properties/${propertyId}/units`).expect(200);
    await User.update({ active: false }, { where: { id: crew.id } });
    const res = await agent.get(`/api/properties/${propertyId}/units`);
    expect(res.status).toBe(401);
  });
});

describe('the plan read', () => {
  it('sends brotli to a browser that takes it, gzip to one that takes only gzip, plain JSON otherwise — the same answer', async () => {
    const url = `/api/properties/${propertyId}/units`;
    const plain = await consultant.get(url).set('Accept-Encoding', 'identity').buffer(true).parse(rawParser).expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const json = JSON.parse(raw(plain).toString('utf8')) as { data: { name: string }[] };
    expect(json.data.map((u) => u.name)).toEqual(['Clover Plot']);

    const br = await consultant.get(url).set('Accept-Encoding', 'gzip, deflate, br').buffer(true).parse(rawParser).expect(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers.vary).toMatch(/Accept-Encoding/i);
    // supertest inflates the answer: what arrives is the plain answer, what was sent is smaller.
    expect(raw(br).equals(raw(plain))).toBe(true);
    expect(Number(br.headers['content-length'])).toBeLessThan(raw(plain).length);
    expect(Number(br.headers['content-length'])).toBe(brotliCompressSync(raw(plain), { params: { [constants.BROTLI_PARAM_QUALITY]: 5, [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT, [constants.BROTLI_PARAM_SIZE_HINT]: raw(plain).length } }).length);

    const gz = await consultant.get(url).set('Accept-Encoding', 'gzip').buffer(true).parse(rawParser).expect(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(raw(gz).equals(raw(plain))).toBe(true);
    expect(Number(gz.headers['content-length'])).toBe(gzipSync(raw(plain), { level: 6 }).length);
    expect(gz.headers.etag).toBe(br.headers.etag);
  });

  it('answers 304 to its ETag (also in a list), and a new answer after a write', async () => {
    const url = `/api/properties/${propertyId}/units`;
    const first = await consultant.get(url).expect(200);
    const etag = first.headers.etag as string;
    await consultant.get(url).set('If-None-Match', etag).expect(304);
    await consultant.get(url).set('If-None-Match', `"other", ${etag}`).expect(304);
    const unitId = (first.body.data as { id: number }[])[0].id;
    await consultant.patch(`/api/units/${unitId}`).set('X-CSRF-Token', consultant.csrf).send({ name: 'Clover Plot East' }).expect(200);
    const after = await consultant.get(url).set('If-None-Match', etag).expect(200);
    expect(after.headers.etag).not.toBe(etag);
    expect((after.body.data as { name: string }[])[0].name).toBe('Clover Plot East');
  });

  it('is a 404 for another firm’s property, before anything is read or sent', async () => {
    const other = await makeFirm();
    const theirs = await makeProperty(other.firm.id, other.client.id);
    const res = await consultant.get(`/api/properties/${theirs.id}/units`).expect(404);
    expect(res.headers.etag ?? '').not.toMatch(/plan-/);
    expect(res.body.error).toMatch(/property/i);
    await request(testApp()).get(`/api/properties/${propertyId}/units`).expect(401);
  });
});
