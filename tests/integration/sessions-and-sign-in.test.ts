/**
 * Sessions and sign-in hardening: a reset or change of password ends the person's other sessions;
 * an idle session ends after the firm's idle timeout; guessable passwords are refused; failed
 * sign-ins are limited per account across addresses; reset, reset completion and invitation
 * acceptance each have their own bucket.
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { signedInAgent, testApp, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { sequelize } from '../../server/db/sequelize';
import { AuthToken, Firm } from '../../server/models';
import { newToken } from '../../server/services/auth/passwords';

const send = (agent: Agent, url: string, body: object) => agent.post(url).set('X-CSRF-Token', agent.csrf).send(body);
/** Test addresses from the documentation range (RFC 5737), so these buckets touch no other test's. */
const ip = (n: number) => `198.51.100.${n}`;

afterAll(async () => {
  await sequelize.query(`DELETE FROM rate_limit_hits WHERE key LIKE '%198.51.100.%' OR key LIKE 'login-account:%sessions-limit%'`);
});

async function resetToken(userId: number): Promise<string> {
  const { token, tokenHash } = newToken();
  await AuthToken.create({ userId, purpose: 'reset', tokenHash, expiresAt: new Date(Date.now() + 3_600_000), usedAt: null, createdById: null });
  return token;
}

describe('ending other sessions', () => {
  it('a password reset signs the person out everywhere', async () => {
    const { users } = await makeFirm();
    const laptop = await signedInAgent(users.consultant.email, PASSWORD);
    const phone = await signedInAgent(users.consultant.email, PASSWORD);
    await laptop.get('/api/auth/me').expect(200);
    const token = await resetToken(users.consultant.id);
    const done = await request(testApp()).post('/api/auth/password-reset/complete').send({ token, password: 'sassafras-ridge-lantern', confirmPassword: 'sassafras-ridge-lantern' });
    expect(done.status).toBe(200);
    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
  });

  it('a password change keeps this session and ends the others', async () => {
    const { users } = await makeFirm();
    const here = await signedInAgent(users.crew.email, PASSWORD);
    const elsewhere = await signedInAgent(users.crew.email, PASSWORD);
    const other = await signedInAgent(users.consultant.email, PASSWORD);
    const res = await send(here, '/api/auth/password', { currentPassword: PASSWORD, password: 'walnut-creek-bedding-47', confirmPassword: 'walnut-creek-bedding-47' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.data.sessionsEnded).toBe(1);
    expect(res.body.data.message).toMatch(/signed out on one other device/);
    await here.get('/api/auth/me').expect(200);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
    await other.get('/api/auth/me').expect(200); // another person's session is untouched
    await request(testApp()).post('/api/auth/login').send({ email: users.crew.email, password: 'walnut-creek-bedding-47' }).expect(200);
  });

  it('refuses a wrong current password and a guessable new one with a sentence, changing nothing', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.owner.email, PASSWORD);
    const wrong = await send(agent, '/api/auth/password', { currentPassword: 'not-my-password', password: 'walnut-creek-bedding-47', confirmPassword: 'walnut-creek-bedding-47' });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error).toMatch(/not your current password/);
    // "password1234" is on every common-password list (zxcvbn-ts language-common dictionary).
    const common = await send(agent, '/api/auth/password', { currentPassword: PASSWORD, password: 'password1234', confirmPassword: 'password1234' });
    expect(common.status).toBe(422);
    expect(common.body.error).toMatch(/password: choose another password/);
    const ownEmail = await send(agent, '/api/auth/password', { currentPassword: PASSWORD, password: users.owner.email, confirmPassword: users.owner.email });
    expect(ownEmail.status).toBe(422);
    await request(testApp()).post('/api/auth/login').send({ email: users.owner.email, password: PASSWORD }).expect(200);
  });

  it('refuses a guessable password from a reset link without spending the link', async () => {
    const { users } = await makeFirm();
    const token = await resetToken(users.crew.id);
    const weak = await request(testApp()).post('/api/auth/password-reset/complete').send({ token, password: 'qwertyuiop', confirmPassword: 'qwertyuiop' });
    expect(weak.status).toBe(422);
    expect(weak.body.error).toMatch(/most used passwords|commonly used|easy to guess/);
    const strong = await request(testApp()).post('/api/auth/password-reset/complete').send({ token, password: 'hickory-draw-at-dusk', confirmPassword: 'hickory-draw-at-dusk' });
    expect(strong.status).toBe(200);
  });
});

describe('the idle timeout', () => {
  async function ageSession(userId: number, hoursAgo: number) {
    await sequelize.query(`UPDATE session SET sess = jsonb_set(sess::jsonb, '{lastSeenAt}', to_jsonb(:at::bigint))::json WHERE sess->'passport'->>'user' = :uid`, {
      replacements: { at: Date.now() - hoursAgo * 3_600_000, uid: String(userId) },
    });
  }

  it('ends a session unused for longer than the firm’s setting (default 8 hours)', async () => {
    const { users } = await makeFirm();
    const agent = await signedInAgent(users.consultant.email, PASSWORD);
    await agent.get('/api/auth/me').expect(200); // notes the activity
    await ageSession(users.consultant.id, 7.5);
    await agent.get('/api/auth/me').expect(200);
    await ageSession(users.consultant.id, 8.5);
    const res = await agent.get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.headers['x-session-ended']).toBe('idle');
  });

  it('follows the owner’s idle setting', async () => {
    const { firm, users } = await makeFirm();
    const owner = await signedInAgent(users.owner.email, PASSWORD);
    const set = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ idleTimeoutHours: 24 });
    expect(set.status).toBe(200);
    expect(set.body.data.settings.idleTimeoutHours).toBe(24);
    expect(((await Firm.findByPk(firm.id))!.settings as { idleTimeoutHours: number }).idleTimeoutHours).toBe(24);
    const agent = await signedInAgent(users.crew.email, PASSWORD);
    await agent.get('/api/auth/me').expect(200);
    await ageSession(users.crew.id, 20);
    await agent.get('/api/auth/me').expect(200);
    const bad = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ idleTimeoutHours: 0 });
    expect(bad.status).toBe(422);
  });
});

describe('sign-in limits', () => {
  it('limits failed sign-ins per account, however many addresses they come from', async () => {
    const { users } = await makeFirm();
    const statuses: number[] = [];
    // 30 failures per account in the window (LOGIN_ACCOUNT_RATE_MAX default), each from a new address.
    for (let i = 1; i <= 31; i++) {
      const res = await request(testApp()).post('/api/auth/login').set('X-Forwarded-For', ip(i)).send({ email: users.client.email, password: 'wrong-password-guess' });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 30).every((s) => s === 401)).toBe(true);
    expect(statuses[30]).toBe(429);
    const right = await request(testApp()).post('/api/auth/login').set('X-Forwarded-For', ip(40)).send({ email: users.client.email, password: PASSWORD });
    expect(right.status).toBe(429);
    expect(right.body.error).toMatch(/this account/);
    // Another account is not affected.
    await request(testApp()).post('/api/auth/login').set('X-Forwarded-For', ip(41)).send({ email: users.owner.email, password: PASSWORD }).expect(200);
    await sequelize.query(`DELETE FROM rate_limit_hits WHERE key = :k`, { replacements: { k: `login-account:${users.client.email}` } });
  });

  it('keeps reset requests, reset completion and invitation acceptance in separate buckets', async () => {
    const from = ip(90);
    for (let i = 0; i < 20; i++) await request(testApp()).post('/api/auth/password-reset').set('X-Forwarded-For', from).send({ email: `nobody-${i}@example.test` }).expect(202);
    const over = await request(testApp()).post('/api/auth/password-reset').set('X-Forwarded-For', from).send({ email: 'nobody@example.test' });
    expect(over.status).toBe(429);
    const complete = await request(testApp()).post('/api/auth/password-reset/complete').set('X-Forwarded-For', from).send({ token: 'x'.repeat(43), password: 'hickory-draw-at-dusk', confirmPassword: 'hickory-draw-at-dusk' });
    expect(complete.status).toBe(400); // the link is refused on its merits, not for the reset requests
    const accept = await request(testApp()).post('/api/auth/invitations/accept').set('X-Forwarded-For', from).send({ token: 'x'.repeat(43), password: 'hickory-draw-at-dusk', confirmPassword: 'hickory-draw-at-dusk' });
    expect(accept.status).toBe(400);
  });
});
