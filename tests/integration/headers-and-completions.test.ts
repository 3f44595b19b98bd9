/**
 * Answer headers and concurrent completions: the content security policy is built per request from
 * the signed-in firm's own settings (https only; another firm's setting never widens it; a second
 * app instance agrees at once); API answers are no-store and carry a Permissions-Policy; the same
 * completion sent several times at once answers the same result and leaves no stray photo files.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, testApp, type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';

import { createApp } from '../../server/app';
import { config } from '../../server/config';
import { TaskPhoto } from '../../server/models';
import { isHerbicideTask } from '../../shared/domain/spray-records';

const JPEG = fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/photos/field-plot.jpg'));
const send = (agent: Agent, method: 'post' | 'patch', url: string, body: object = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body);

describe('the content security policy', () => {
  it('allows only the signed-in firm’s own https tile service, and every instance agrees at once', async () => {
    const a = await makeFirm();
    const b = await makeFirm();
    const ownerA = await signedInAgent(a.users.owner.email, PASSWORD);
    const consultantA = await signedInAgent(a.users.consultant.email, PASSWORD);
    const ownerB = await signedInAgent(b.users.owner.email, PASSWORD);
    // A second app instance (another server behind the load balancer), sharing only the database.
    const second = request.agent(createApp());
    const login = await second.post('/api/auth/login').send({ email: a.users.consultant.email, password: PASSWORD });
    expect(login.status).toBe(200);

    const http = await send(ownerA, 'patch', '/api/firm/settings', { tileUrlTemplate: 'http://tiles.firm-a.test/{z}/{x}/{y}.png' });
    expect(http.status).toBe(422);
    expect(http.body.error).toMatch(/https/);
    expect((await send(ownerA, 'patch', '/api/firm/settings', { tileUrlTemplate: 'https://tiles.firm-a.test/{z}/{x}/{y}.png' })).status).toBe(200);

    const cspOf = async (agent: ReturnType<typeof request.agent>, url = '/api/auth/me') => (await agent.get(url)).headers['content-security-policy'] as string;
    expect(await cspOf(consultantA)).toMatch(/img-src 'self' data: blob: https:\/\/tiles\.firm-a\.test;/);
    expect(await cspOf(consultantA)).toMatch(/connect-src 'self' https:\/\/tiles\.firm-a\.test;/);
    expect(await cspOf(second)).toMatch(/https:\/\/tiles\.firm-a\.test/); // no minute-long cache on the other instance
    expect(await cspOf(ownerB)).not.toMatch(/firm-a/);
    expect((await request(testApp()).get('/api/health')).headers['content-security-policy']).not.toMatch(/firm-a/);

    expect((await send(ownerA, 'patch', '/api/firm/settings', { tileUrlTemplate: null })).status).toBe(200);
    expect(await cspOf(second)).not.toMatch(/firm-a/);
  });
});

describe('answer headers', () => {
  it('marks API answers no-store and switches off unused browser features', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.consultant.email, PASSWORD);
    for (const res of [await request(testApp()).get('/api/health'), await agent.get('/api/clients'), await agent.get('/api/no-such-route'), await request(testApp()).post('/api/auth/login').send({})]) {
      expect(res.headers['cache-control']).toBe('no-store');
      expect(res.headers['permissions-policy']).toMatch(/microphone=\(\)/);
      // "Log sign" asks for the phone's position: allowed for our own origin only (W3C Permissions Policy, allowlist "self").
      expect(res.headers['permissions-policy']).toMatch(/geolocation=\(self\)/);
    }
  });
});

describe('the same completion sent several times at once', () => {
  let crew: Agent;
  let taskIds: number[];

  beforeAll(async () => {
    const ctx = await makeFirm();
    const consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
    const client = await signedInAgent(ctx.users.client.email, PASSWORD);
    crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
    const propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { depositPct: 0 });
    expect((await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`)).status).toBe(200);
    expect((await send(client, 'post', `/api/proposals/${draft.body.data.id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(200);
    const tasks = await consultant.get(`/api/tasks?propertyId=${propertyId}`);
    // Herbicide steps need their spray record to be completed (tests/integration/spray-records.test.ts).
    taskIds = tasks.body.data.tasks.filter((t: { kind: string; cautions?: { id: string }[] }) => !isHerbicideTask(t)).map((t: { id: number }) => t.id);
    expect(taskIds.length).toBeGreaterThanOrEqual(3);
    for (const id of taskIds) expect((await send(consultant, 'patch', `/api/tasks/${id}`, { assigneeId: ctx.users.crew.id })).status).toBe(200);
  });

  const photoFiles = () => {
    const dir = path.join(config.uploadsDir, 'photos');
    return fs.existsSync(dir) ? fs.readdirSync(dir).length : 0;
  };

  it('answers every copy with the one completion (no 409) and keeps exactly one set of photos', async () => {
    for (const taskId of taskIds.slice(0, 3)) {
      const key = `race-${crypto.randomUUID()}`;
      const before = photoFiles();
      const answers = await Promise.all(
        Array.from({ length: 4 }, () =>
          crew.post(`/api/tasks/${taskId}/complete`).set('X-CSRF-Token', crew.csrf).set('Idempotency-Key', key).field('doneOn', '2026-03-02').attach('photos', JPEG, { filename: 'plot.jpg', contentType: 'image/jpeg' }),
        ),
      );
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses, JSON.stringify(answers.map((a) => a.body.error ?? null))).toEqual([200, 200, 200, 201]);
      expect(new Set(answers.map((a) => a.body.data.id))).toEqual(new Set([taskId]));
      expect(answers.filter((a) => a.body.replayed === true)).toHaveLength(3);
      expect(await TaskPhoto.count({ where: { taskId } })).toBe(1);
      expect(photoFiles() - before).toBe(1);
    }
  });
});
