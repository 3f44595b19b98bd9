import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { anonymousAgent, capturedMailTo, capturedMessage, signedInAgent, testApp } from '../support/test-app';
import { deliverAllMail } from '../support/test-app';
import { makeFirm, makeUser, PASSWORD } from '../support/factories';
import { SessionUserSchema } from '../../shared/schemas/auth';

describe('sign-in', () => {
  it('signs in with the right password and answers the user and a fresh CSRF token', async () => {
    const { users } = await makeFirm();
    const res = await request(testApp()).post('/api/auth/login').send({ email: users.owner.email.toUpperCase(), password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: users.owner.id, email: users.owner.email, role: 'owner' });
    SessionUserSchema.parse(res.body.user);
    expect(res.body.csrfToken).toMatch(/^[\w-]{20,}$/);
    expect(res.headers['set-cookie'][0]).toMatch(/browseline\.sid=.*HttpOnly.*SameSite=Lax/i);
  });

  it('gives one neutral 401 message for a wrong password and for an unknown e-mail', async () => {
    const { users } = await makeFirm();
    const wrong = await request(testApp()).post('/api/auth/login').send({ email: users.owner.email, password: 'not-the-password' });
    const unknown = await request(testApp()).post('/api/auth/login').send({ email: 'nobody-here@example.test', password: 'whatever-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toBe(unknown.body.error);
    expect(wrong.body.error).not.toMatch(/exist|unknown|no account/i);
  });

  it('regenerates the session on sign-in (the anonymous session id is not kept)', async () => {
    const { users } = await makeFirm();
    const agent = await anonymousAgent();
    const before = await agent.get('/api/auth/csrf');
    const cookieBefore = String(before.headers['set-cookie'] ?? '');
    const login = await agent.post('/api/auth/login').send({ email: users.consultant.email, password: PASSWORD });
    const cookieAfter = String(login.headers['set-cookie']);
    expect(cookieAfter).toMatch(/browseline\.sid=/);
    expect(cookieAfter.split(';')[0]).not.toBe(cookieBefore.split(';')[0]);
    expect(login.body.csrfToken).not.toBe(agent.csrf);
  });

  it('answers /me for the signed-in user and 401 after sign-out', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.crew.email, PASSWORD);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email: users.crew.email, role: 'crew' });
    await agent.post('/api/auth/logout').set('X-CSRF-Token', agent.csrf).expect(204);
    await agent.get('/api/auth/me').expect(401);
  });

  it('refuses a disabled account with the same neutral message', async () => {
    const { firm } = await makeFirm();
    const disabled = await makeUser(firm.id, 'consultant', null, { active: false });
    const res = await request(testApp()).post('/api/auth/login').send({ email: disabled.email, password: PASSWORD });
    expect(res.status).toBe(401);
  });

  it('limits repeated failed sign-ins for one address with 429', async () => {
    const { users } = await makeFirm();
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      const res = await request(testApp()).post('/api/auth/login').send({ email: users.client.email, password: `wrong-${i}-password` });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    // Even the right password waits until the window passes.
    const locked = await request(testApp()).post('/api/auth/login').send({ email: users.client.email, password: PASSWORD });
    expect(locked.status).toBe(429);
  });

  it('validates the sign-in body with a message a person can act on', async () => {
    const res = await request(testApp()).post('/api/auth/login').send({ email: 'not-an-email' });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/e-mail/);
    expect(res.body.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['email', 'password']));
  });
});

describe('CSRF', () => {
  it('refuses a cookie-authenticated write without the token (403) and accepts it with the token', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.consultant.email, PASSWORD);
    const without = await agent.post('/api/clients').send({ name: 'No Token Farm' });
    expect(without.status).toBe(403);
    expect(without.body.error).toMatch(/security token/);
    const wrong = await agent.post('/api/clients').set('X-CSRF-Token', 'x'.repeat(43)).send({ name: 'Wrong Token Farm' });
    expect(wrong.status).toBe(403);
    const ok = await agent.post('/api/clients').set('X-CSRF-Token', agent.csrf).send({ name: 'Token Farm' });
    expect(ok.status).toBe(201);
    const list = await agent.get('/api/clients').expect(200);
    expect(list.body.data.map((c: { name: string }) => c.name)).toContain('Token Farm');
    expect(list.body.data.map((c: { name: string }) => c.name)).not.toContain('No Token Farm');
  });
});

describe('password reset', () => {
  it('mails a single-use link that sets a new password', async () => {
    const { users } = await makeFirm();
    const res = await request(testApp()).post('/api/auth/password-reset').send({ email: users.crew.email });
    expect(res.status).toBe(202);
    await deliverAllMail();
    const [mail] = await capturedMailTo(users.crew.email);
    expect(mail.subject).toMatch(/Reset your Browseline password/);
    const text = (await capturedMessage(mail.id)).text;
    const token = /reset-password\/([\w-]+)/.exec(text)![1];
    await request(testApp()).get(`/api/auth/password-reset/${token}`).expect(200);
    const done = await request(testApp()).post('/api/auth/password-reset/complete').send({ token, password: 'a-brand-new-password', confirmPassword: 'a-brand-new-password' });
    expect(done.status).toBe(200);
    const again = await request(testApp()).post('/api/auth/password-reset/complete').send({ token, password: 'another-new-password', confirmPassword: 'another-new-password' });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/no longer valid/);
    await request(testApp()).post('/api/auth/login').send({ email: users.crew.email, password: 'a-brand-new-password' }).expect(200);
    await request(testApp()).post('/api/auth/login').send({ email: users.crew.email, password: PASSWORD }).expect(401);
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const address = `ghost-${Date.now()}@example.test`;
    const res = await request(testApp()).post('/api/auth/password-reset').send({ email: address });
    expect(res.status).toBe(202);
    await deliverAllMail();
    expect(await capturedMailTo(address)).toHaveLength(0);
  });
});

describe('invitations', () => {
  it('lets a consultant invite a crew member who sets a password and lands signed in', async () => {
    const { users } = await makeFirm();
    const consultant = await signedInAgent(users.consultant.email, PASSWORD);
    const email = `new-crew-${Date.now()}@example.test`;
    const res = await consultant.post('/api/team/invitations').set('X-CSRF-Token', consultant.csrf).send({ email, name: 'Nell Crew', role: 'crew' });
    expect(res.status).toBe(201);
    expect(res.body.data).toMatchObject({ email, role: 'crew', status: 'invited' });
    await deliverAllMail();
    const [mail] = await capturedMailTo(email);
    const token = /invite\/([\w-]+)/.exec((await capturedMessage(mail.id)).text)![1];
    const info = await request(testApp()).get(`/api/auth/invitations/${token}`).expect(200);
    expect(info.body.data.name).toBe('Nell Crew');
    const accepted = await request(testApp()).post('/api/auth/invitations/accept').send({ token, password: 'crew-password-123', confirmPassword: 'crew-password-123' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ email, role: 'crew' });
    await request(testApp()).post('/api/auth/invitations/accept').send({ token, password: 'crew-password-456', confirmPassword: 'crew-password-456' }).expect(400);
  });

  it('requires a client for a client contact, and only the owner may invite consultants', async () => {
    const { users, client } = await makeFirm();
    const consultant = await signedInAgent(users.consultant.email, PASSWORD);
    const noClient = await consultant.post('/api/team/invitations').set('X-CSRF-Token', consultant.csrf).send({ email: `c-${Date.now()}@example.test`, name: 'Contact', role: 'client' });
    expect(noClient.status).toBe(422);
    expect(noClient.body.error).toMatch(/client/);
    const asConsultant = await consultant.post('/api/team/invitations').set('X-CSRF-Token', consultant.csrf).send({ email: `k-${Date.now()}@example.test`, name: 'Kay', role: 'consultant' });
    expect(asConsultant.status).toBe(403);
    const contact = await consultant.post('/api/team/invitations').set('X-CSRF-Token', consultant.csrf).send({ email: `cc-${Date.now()}@example.test`, name: 'Contact', role: 'client', clientId: client.id });
    expect(contact.status).toBe(201);
  });

  it('cannot invite a contact onto another firm’s client', async () => {
    const a = await makeFirm();
    const b = await makeFirm();
    const consultant = await signedInAgent(a.users.consultant.email, PASSWORD);
    const res = await consultant.post('/api/team/invitations').set('X-CSRF-Token', consultant.csrf).send({ email: `x-${Date.now()}@example.test`, name: 'X', role: 'client', clientId: b.client.id });
    expect(res.status).toBe(422);
  });

  it('does not reveal or take over an address that already has an account', async () => {
    const a = await makeFirm();
    const b = await makeFirm();
    const consultant = await signedInAgent(a.users.consultant.email, PASSWORD);
    const res = await consultant.post('/api/team/invitations').set('X-CSRF-Token', consultant.csrf).send({ email: b.users.crew.email, name: 'Taken', role: 'crew' });
    expect(res.status).toBe(409);
    await request(testApp()).post('/api/auth/login').send({ email: b.users.crew.email, password: PASSWORD }).expect(200);
  });
});
