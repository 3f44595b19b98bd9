import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { testApp, signedInAgent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';

describe('health', () => {
  it('reports the server and its database', async () => {
    const res = await request(testApp()).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok' });
  });
});

describe('bad input never gets a stack trace or an HTML page', () => {
  it('answers malformed JSON with 400 and a message', async () => {
    const res = await request(testApp()).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "a@b.c",');
    expect(res.status).toBe(400);
    expect(res.type).toBe('application/json');
    expect(res.body.error).toMatch(/not valid JSON/);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('answers an unknown /api path with 404 JSON', async () => {
    const res = await request(testApp()).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.type).toBe('application/json');
    expect(res.body.error).toMatch(/was not found/);
  });

  it('answers an over-size body with 413', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.consultant.email, PASSWORD);
    const huge = JSON.stringify({ name: 'x', notes: 'y'.repeat(3 * 1024 * 1024) });
    const res = await agent.post('/api/clients').set('X-CSRF-Token', agent.csrf).set('Content-Type', 'application/json').send(huge);
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/too large/);
  });

  it('answers a wrong id type with 422 naming the field', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.consultant.email, PASSWORD);
    const res = await agent.get('/api/clients/abc');
    expect(res.status).toBe(422);
    expect(res.body.details[0].path).toBe('id');
  });

  it('sends security headers with a same-origin content security policy', async () => {
    const res = await request(testApp()).get('/api/health');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['content-security-policy']).toMatch(/worker-src 'self' blob:/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('firms are tenants', () => {
  it('never shows or edits another firm’s client', async () => {
    const a = await makeFirm();
    const b = await makeFirm();
    const agent = await signedInAgent(a.users.owner.email, PASSWORD);
    const list = await agent.get('/api/clients').expect(200);
    const ids = list.body.data.map((c: { id: number }) => c.id);
    expect(ids).toContain(a.client.id);
    expect(ids).not.toContain(b.client.id);
    await agent.get(`/api/clients/${b.client.id}`).expect(404);
    const patch = await agent.patch(`/api/clients/${b.client.id}`).set('X-CSRF-Token', agent.csrf).send({ name: 'Taken over' });
    expect(patch.status).toBe(404);
    await b.client.reload();
    expect(b.client.name).not.toBe('Taken over');
  });
});

describe('the Desk', () => {
  it('answers this week’s stacks and the season strip for the firm', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.consultant.email, PASSWORD);
    const res = await agent.get('/api/desk').expect(200);
    const { DeskSummarySchema } = await import('../../shared/schemas/desk');
    const desk = DeskSummarySchema.parse(res.body.data);
    expect(desk.season.windows.length).toBeGreaterThanOrEqual(12);
    expect(desk.season.windows.every((w) => w.earliest <= w.latest)).toBe(true);
    expect(desk.waiting).toEqual([]);
  });
});
