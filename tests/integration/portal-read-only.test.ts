/**
 * The portal is read-only, proven over every registered route: a signed-in client with a valid CSRF
 * token is refused every write except the few it owns (deciding its sent proposals, paying its
 * invoices, uploading and logging field observations, sits and harvests where allowed, and its own session/password). The routes are enumerated at run
 * time from the registry, so routes other branches add are covered without editing this file.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { routeRegistry, type RouteRecord } from '../../server/middlewares/access';
import { signedInAgent, testApp, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';

/** Writes a client may make, each only on its own records (the handlers check ownership). */
const CLIENT_WRITES: { pattern: RegExp; why: string }[] = [
  { pattern: /^post \/proposals\/:id\/(approve|decline)$/, why: 'decide its own sent proposal' },
  { pattern: /^post \/invoices\/:id\/(checkout|pay)$/, why: 'pay its own invoice' },
  { pattern: /^post \/files$/, why: 'upload a file when its consultant allows it' },
  { pattern: /^post \/properties\/:id\/observations$/, why: 'log a field observation on its own land when its consultant allows it' },
  { pattern: /^post \/properties\/:id\/sits$/, why: 'log a sit on its own land when its consultant allows it' },
  { pattern: /^post \/properties\/:id\/harvests$/, why: 'record a deer taken on its own land (stand, sit, disease-sampling number) when its consultant allows sit logging' },
  { pattern: /^(post|put|patch) \/auth\/(logout|password.*|me.*)$/, why: 'its own session and password' },
];
/** Public routes are nobody's writes: each is guarded by its own token, signature or credentials (sign-up by its rate limit and e-mail confirmation). */
const PUBLIC_WRITES = [/^post \/auth\/(login|invitations|password-reset|verify-email)/, /^post \/webhooks\//, /^post \/signup$/];
/** Calling these would end the agent's own session; they are only checked against the allow-list. */
const NOT_CALLED = [/^post \/auth\/logout$/];

const REFUSALS = [400, 401, 403, 404, 405, 409, 413, 415, 422, 429];
/** An id no record has, so that even allowed routes cannot touch anything. */
const DUMMY_ID = '2147480000';
const concrete = (path: string) => `/api${path.replace(/:token/g, 'x'.repeat(43)).replace(/:[a-zA-Z]+/g, DUMMY_ID)}`;
const key = (r: RouteRecord) => `${r.method} ${r.path}`;
const admitsClient = (r: RouteRecord) => r.access === 'signed-in' || (Array.isArray(r.access) && r.access.includes('client'));

let client: Agent;
let propertyId: number;

beforeAll(async () => {
  testApp();
  const ctx = await makeFirm();
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
});

describe('the client role is read-only', () => {
  it('declares client access on no write outside the allow-list', () => {
    const writes = routeRegistry.filter((r) => r.method !== 'get');
    expect(writes.length).toBeGreaterThan(20);
    const clientWrites = writes.filter(admitsClient).map(key);
    const unexpected = clientWrites.filter((k) => !CLIENT_WRITES.some((a) => a.pattern.test(k)));
    expect(unexpected, `client-reachable writes missing from the allow-list: ${unexpected.join(', ')}`).toEqual([]);
    // The allow-list is not stale: the proposal decisions and the upload exist today.
    expect(clientWrites).toEqual(expect.arrayContaining(['post /proposals/:id/approve', 'post /proposals/:id/decline', 'post /files', 'post /properties/:id/observations']));
  });

  it('refuses every other write with a 4xx and a sentence, never a 2xx or a 500', async () => {
    const checked: string[] = [];
    const failures: string[] = [];
    for (const r of routeRegistry.filter((x) => x.method !== 'get')) {
      const k = key(r);
      if (NOT_CALLED.some((re) => re.test(k))) continue;
      const url = concrete(r.path);
      const res = await client[r.method](url).set('X-CSRF-Token', client.csrf).send({ id: Number(DUMMY_ID), propertyId, name: 'x', title: 'x' });
      checked.push(k);
      const allowed = CLIENT_WRITES.some((a) => a.pattern.test(k)) || PUBLIC_WRITES.some((re) => re.test(k));
      if (res.status >= 500) failures.push(`${k} → ${res.status} (a crash)`);
      else if (!allowed && !REFUSALS.includes(res.status)) failures.push(`${k} → ${res.status}, expected a refusal`);
      else if (allowed && res.status < 300) failures.push(`${k} → ${res.status} with a dummy id: it touched something`);
      else if (typeof res.body?.error !== 'string' || res.body.error.length < 10) failures.push(`${k} → ${res.status} without an error sentence`);
    }
    expect(failures).toEqual([]);
    expect(checked.length).toBeGreaterThan(20);
  });

  it('refuses the staff writes with 403 specifically (role, not a missing record)', async () => {
    const staffWrites = routeRegistry.filter((r) => r.method !== 'get' && !admitsClient(r) && r.access !== 'public');
    for (const r of staffWrites) {
      const res = await client[r.method](concrete(r.path)).set('X-CSRF-Token', client.csrf).send({});
      expect(res.status, key(r)).toBe(403);
    }
    expect(staffWrites.length).toBeGreaterThan(20);
  });

  it('never crashes on a read either', async () => {
    const failures: string[] = [];
    for (const r of routeRegistry.filter((x) => x.method === 'get')) {
      const res = await client.get(concrete(r.path));
      if (res.status >= 500) failures.push(`${key(r)} → ${res.status}`);
    }
    expect(failures).toEqual([]);
  });

  it('still refuses a write without the CSRF token, even on allowed routes', async () => {
    const res = await client.post('/api/files').send({});
    expect(res.status).toBe(403);
    expect(res.body.code).toBe('csrf');
  });
});
