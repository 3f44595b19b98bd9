/**
 * The development mail reader: off unless DEV_MAIL_READER=true (and refused in production); when on,
 * an owner reads only the mail their own firm sent — never another firm's password-reset links.
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { capturedMailTo, deliverAllMail, signedInAgent, testApp } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { config, configurationProblems } from '../../server/config';

const setReader = (on: boolean) => ((config as { devMailReader: boolean }).devMailReader = on);
afterAll(() => setReader(false));

describe('the development mail reader', () => {
  it('is off unless switched on explicitly, and production refuses the switch', async () => {
    setReader(false);
    const { users } = await makeFirm();
    const owner = await signedInAgent(users.owner.email, PASSWORD);
    expect((await owner.get('/api/dev/mail')).status).toBe(404);
    expect(configurationProblems({ isProduction: true, devMailReader: true })[0]).toMatch(/DEV_MAIL_READER=true is refused/);
    expect(configurationProblems({ isProduction: false, devMailReader: true })).toEqual([]);
    expect(configurationProblems({ isProduction: true, devMailReader: false })).toEqual([]);
  });

  it('shows an owner only their own firm’s mail', async () => {
    setReader(true);
    const a = await makeFirm();
    const b = await makeFirm();
    await request(testApp()).post('/api/auth/password-reset').send({ email: a.users.crew.email }).expect(202);
    await request(testApp()).post('/api/auth/password-reset').send({ email: b.users.crew.email }).expect(202);
    await deliverAllMail();
    const [mailA] = await capturedMailTo(a.users.crew.email);
    const [mailB] = await capturedMailTo(b.users.crew.email);
    expect(mailA && mailB).toBeTruthy();

    const ownerA = await signedInAgent(a.users.owner.email, PASSWORD);
    const list = await ownerA.get('/api/dev/mail');
    expect(list.status).toBe(200);
    const ids = list.body.data.map((m: { id: number }) => m.id);
    expect(ids).toContain(mailA.id);
    expect(ids).not.toContain(mailB.id);
    expect(list.body.data.every((m: { to: string[] }) => !m.to.includes(b.users.crew.email))).toBe(true);
    expect((await ownerA.get(`/api/dev/mail/${mailA.id}`)).body.data.text).toMatch(/reset-password\//);
    const other = await ownerA.get(`/api/dev/mail/${mailB.id}`);
    expect(other.status).toBe(404);
    expect(JSON.stringify(other.body)).not.toMatch(/reset-password/);
  });
});
