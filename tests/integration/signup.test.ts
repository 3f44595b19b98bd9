import { beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { anonymousAgent, signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { sequelize } from '../../server/db/sequelize';
import { AuthToken, Client, Firm, Material, OutboxMessage, Practice, Property, User } from '../../server/models';
import { config } from '../../server/config';
import { DeskSummarySchema } from '../../shared/schemas/desk';

const unique = () => crypto.randomBytes(5).toString('hex');
const post = (agent: Agent, url: string, body: unknown) => agent.post(url).set('X-CSRF-Token', agent.csrf).send(body as object);

/** The confirmation link's token from the newest sign-up e-mail to the address. */
async function linkTokenFor(email: string): Promise<string> {
  const mail = await OutboxMessage.findOne({ where: { toAddress: email, kind: 'signup-verify' }, order: [['id', 'DESC']] });
  const match = /\/verify-email\/([A-Za-z0-9_-]+)/.exec(mail!.textBody);
  return match![1]!;
}

// The rate limit counts per IP in PostgreSQL across runs; each test starts from a clean count.
beforeEach(async () => {
  await sequelize.query(`DELETE FROM rate_limit_hits WHERE key LIKE 'signup:%'`, { type: QueryTypes.DELETE });
});

describe('POST /api/signup', () => {
  it('makes a firm and its owner with the starter library and nothing else, confirmed by an e-mail link before sign-in', async () => {
    const email = `Owner-${unique()}@Example.test`;
    const agent = await anonymousAgent();
    const res = await post(agent, '/api/signup', { firmName: 'Coulee Ridge Habitat', name: 'Dana Whitford', email, password: 'a long enough password' });
    expect(res.status).toBe(202);
    expect(res.body.data.message).toMatch(/Check your e-mail/);

    const user = (await User.findOne({ where: { email: email.toLowerCase() } }))!;
    expect(user).toMatchObject({ role: 'owner', name: 'Dana Whitford', emailVerified: false, active: true });
    const firm = (await Firm.findByPk(user.firmId))!;
    expect(firm.name).toBe('Coulee Ridge Habitat');
    expect(firm.slug).toMatch(/^coulee-ridge-habitat-[a-f0-9]{6}$/);
    expect(await Practice.count({ where: { firmId: firm.id } })).toBeGreaterThan(5);
    expect(await Material.count({ where: { firmId: firm.id } })).toBeGreaterThan(5);
    expect(await Client.count({ where: { firmId: firm.id } })).toBe(0);
    expect(await Property.count({ where: { firmId: firm.id } })).toBe(0);
    expect(await User.count({ where: { firmId: firm.id } })).toBe(1);

    // Only the token's hash is kept.
    const token = await linkTokenFor(email.toLowerCase());
    const row = (await AuthToken.findOne({ where: { userId: user.id, purpose: 'verify' } }))!;
    expect(row.tokenHash).not.toContain(token);
    expect(row.tokenHash).toBe(crypto.createHash('sha256').update(token).digest('hex'));
    expect(row.expiresAt.getTime() - Date.now()).toBeGreaterThan(47 * 3_600_000);

    const early = await post(await anonymousAgent(), '/api/auth/login', { email, password: 'a long enough password' });
    expect(early.status).toBe(403);
    expect(early.body.error).toMatch(/Confirm your e-mail address first/);

    const confirmed = await post(await anonymousAgent(), '/api/auth/verify-email', { token });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.data.email).toBe(email.toLowerCase());
    // Single use.
    const again = await post(await anonymousAgent(), '/api/auth/verify-email', { token });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/no longer valid/);

    const owner = await signedInAgent(email, 'a long enough password');
    const me = (await owner.get('/api/auth/me').expect(200)).body.user;
    expect(me).toMatchObject({ role: 'owner', firmName: 'Coulee Ridge Habitat' });
    expect((await owner.get('/api/clients').expect(200)).body.data).toEqual([]);
  });

  it('answers a used e-mail exactly as a new one, makes nothing, and tells the holder instead', async () => {
    const { users } = await makeFirm();
    const used = await post(await anonymousAgent(), '/api/signup', { firmName: 'Someone Else', name: 'Other Person', email: users.consultant.email.toUpperCase(), password: 'another long password' });
    const fresh = await post(await anonymousAgent(), '/api/signup', { firmName: 'Someone New', name: 'New Person', email: `new-${unique()}@example.test`, password: 'another long password' });
    expect(used.status).toBe(fresh.status);
    // Both answers wait for the same floor, so time does not tell them apart (medians in tests/bench/signup-timing.ts).
    expect(config.signupAnswerFloorMs).toBeGreaterThanOrEqual(500);
    expect(used.body).toEqual(fresh.body);
    expect(Object.keys(used.headers).sort()).toEqual(Object.keys(fresh.headers).sort());
    expect(await Firm.count({ where: { name: 'Someone Else' } })).toBe(0);
    expect(await Firm.count({ where: { name: 'Someone New' } })).toBeGreaterThanOrEqual(1);
    const note = await OutboxMessage.findOne({ where: { toAddress: users.consultant.email, kind: 'signup-existing' } });
    expect(note!.textBody).toMatch(/already has an account/);
    // The existing account is untouched and still signs in.
    await signedInAgent(users.consultant.email, PASSWORD);
  });

  it('refuses an expired link', async () => {
    const email = `late-${unique()}@example.test`;
    await post(await anonymousAgent(), '/api/signup', { firmName: 'Late Firm', name: 'Late Owner', email, password: 'a long enough password' }).expect(202);
    const token = await linkTokenFor(email);
    const user = (await User.findOne({ where: { email } }))!;
    await AuthToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id, purpose: 'verify' } });
    expect((await post(await anonymousAgent(), '/api/auth/verify-email', { token })).status).toBe(400);
    expect((await User.findByPk(user.id))!.emailVerified).toBe(false);
  });

  it('refuses a guessable password as every other password form does (zxcvbn score under 3), and makes nothing', async () => {
    const email = `weak-${unique()}@example.test`;
    // "password1234" passes the 10-character rule; zxcvbn-ts's common-password list knows it (from its dictionary).
    const res = await post(await anonymousAgent(), '/api/signup', { firmName: 'Guessable Firm', name: 'Weak Owner', email, password: 'password1234' });
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body)).toMatch(/choose another password/);
    expect(await User.count({ where: { email } })).toBe(0);
    expect(await OutboxMessage.count({ where: { toAddress: email } })).toBe(0);
  });

  it('refuses bad input with sentences, and garbage tokens without a 500', async () => {
    const agent = await anonymousAgent();
    const bad = await post(agent, '/api/signup', { firmName: '', name: 'x', email: 'not-an-address', password: 'short' });
    expect(bad.status).toBe(422);
    const text = JSON.stringify(bad.body);
    expect(text).toMatch(/enter your firm’s name/);
    expect(text).toMatch(/e-mail address like/);
    expect(text).toMatch(/at least 10 characters/);
    expect((await post(agent, '/api/auth/verify-email', { token: 'x'.repeat(43) })).status).toBe(400);
    expect((await post(agent, '/api/auth/verify-email', { token: 42 })).status).toBe(422);
  });

  it('gives the new firm an empty Desk whose first steps (home area, profile, first client) tick themselves off', async () => {
    const email = `steps-${unique()}@example.test`;
    expect((await post(await anonymousAgent(), '/api/signup', { firmName: 'Kickapoo Valley Habitat', name: 'Rosa Lindqvist', email, password: 'a long enough password' })).status).toBe(202);
    await post(await anonymousAgent(), '/api/auth/verify-email', { token: await linkTokenFor(email) });
    const owner = await signedInAgent(email, 'a long enough password');
    const desk = async () => DeskSummarySchema.parse((await owner.get('/api/desk').expect(200)).body.data);
    const fresh = await desk();
    expect(fresh.firstSteps).toEqual([
      { key: 'home-area', done: false },
      { key: 'profile', done: false },
      { key: 'first-client', done: false },
    ]);
    expect(fresh.counts).toMatchObject({ clients: 0, properties: 0 });
    expect(fresh.recentProperties).toEqual([]);
    expect(fresh.waiting).toEqual([]);
    expect(fresh.activity.every((a) => a.action.startsWith('firm.') || a.action.startsWith('user.'))).toBe(true);

    expect((await owner.patch('/api/firm').set('X-CSRF-Token', owner.csrf).send({ address: '212 Main St, Viroqua, WI 54665', phone: '608-555-0144' })).status).toBe(200);
    expect((await desk()).firstSteps?.find((s) => s.key === 'profile')?.done).toBe(true);
    expect((await post(owner, '/api/clients', { name: 'Rockton Bottoms Trust' })).status).toBe(201);
    expect((await desk()).firstSteps?.find((s) => s.key === 'first-client')?.done).toBe(true);
    // The home area is chosen by the firm (kept in settings.homeArea): then the list is gone.
    const me = (await User.findOne({ where: { email } }))!;
    const firm = (await Firm.findByPk(me.firmId))!;
    await firm.update({ settings: { ...firm.settings, homeArea: { counties: ['55123'] } } });
    expect((await desk()).firstSteps).toBeNull();
  });

  it('is rate-limited per address: the next sign-up after the limit gets 429 with a sentence', async () => {
    const agent = await anonymousAgent();
    for (let i = 0; i < config.signupRateLimit.max; i++) {
      expect((await post(agent, '/api/signup', { firmName: `Burst ${i}`, name: 'Burst Owner', email: `burst-${unique()}@example.test`, password: 'a long enough password' })).status).toBe(202);
    }
    const over = await post(agent, '/api/signup', { firmName: 'One Too Many', name: 'Burst Owner', email: `burst-${unique()}@example.test`, password: 'a long enough password' });
    expect(over.status).toBe(429);
    expect(over.body.error).toMatch(/Too many sign-ups/);
    expect(await Firm.count({ where: { name: 'One Too Many' } })).toBe(0);
  });
});
