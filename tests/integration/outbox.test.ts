import { describe, expect, it } from 'vitest';
import { OutboxMessage } from '../../server/models';
import { afterFailedTry, deliverDueMessages, enqueueEmail, RETRY_WINDOW_MS, retryDelayMs } from '../../server/services/mail/outbox';
import { mailTransport } from '../../server/services/mail/mailer';
import { renderEmail } from '../../templates/email/layout';
import { capturedMailTo, capturedMessage, signedInAgent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { sequelize } from '../../server/db/sequelize';

const email = (subject: string) => renderEmail({ subject, firmName: 'Outbox Test Firm', greeting: 'Hello,', paragraphs: ['A test message.'] });

describe('the e-mail outbox', () => {
  it('delivers a queued message over SMTP exactly once, with its attachment', async () => {
    const to = `outbox-${Date.now()}@example.test`;
    const msg = await enqueueEmail({ firmId: null, kind: 'test', to, email: email('Once only'), attachments: [{ filename: 'note.txt', contentType: 'text/plain', contentBase64: Buffer.from('hello').toString('base64') }] });
    await deliverDueMessages();
    await deliverDueMessages();
    const mails = await capturedMailTo(to);
    expect(mails).toHaveLength(1);
    const full = await capturedMessage(mails[0].id);
    expect(full.text).toMatch(/A test message/);
    expect(full.attachments[0].filename).toBe('note.txt');
    await msg.reload();
    expect(msg.status).toBe('sent');
  });

  it('keeps a message when the action’s transaction rolls back (nothing half-written)', async () => {
    const to = `rollback-${Date.now()}@example.test`;
    await expect(
      sequelize.transaction(async (transaction) => {
        await enqueueEmail({ firmId: null, kind: 'test', to, email: email('Never') }, transaction);
        throw new Error('the action failed');
      }),
    ).rejects.toThrow('the action failed');
    expect(await OutboxMessage.count({ where: { toAddress: to } })).toBe(0);
  });

  it('keeps a message through a mail outage and delivers it when the server is back', async () => {
    const to = `outage-${Date.now()}@example.test`;
    const msg = await enqueueEmail({ firmId: null, kind: 'test', to, email: email('After the outage') });
    const transport = mailTransport();
    const realSend = transport.sendMail.bind(transport);
    transport.sendMail = (() => Promise.reject(new Error('connect ECONNREFUSED 127.0.0.1:25'))) as typeof transport.sendMail;
    try {
      const result = await deliverDueMessages();
      expect(result.failed).toBeGreaterThanOrEqual(1);
    } finally {
      transport.sendMail = realSend;
    }
    await msg.reload();
    expect(msg.status).toBe('pending');
    expect(msg.attempts).toBe(1);
    expect(msg.lastError).toMatch(/ECONNREFUSED/);
    expect(msg.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
    // Time passes: make it due again.
    await msg.update({ nextAttemptAt: new Date(Date.now() - 1000) });
    await deliverDueMessages();
    await msg.reload();
    expect(msg.status).toBe('sent');
    expect(await capturedMailTo(to)).toHaveLength(1);
  });

  it('backs off 1, 2, 4 … minutes up to an hour', () => {
    expect([1, 2, 3, 7, 12].map((n) => retryDelayMs(n) / 60000)).toEqual([1, 2, 4, 60, 60]);
  });

  it('keeps trying with backoff for at least 3 days before it gives up (not 8 tries, about 2 hours)', () => {
    const queued = new Date('2026-03-02T08:00:00Z');
    const retryUntil = new Date(queued.getTime() + RETRY_WINDOW_MS);
    let now = queued;
    let tries = 0;
    let status: 'pending' | 'failed' = 'pending';
    while (status === 'pending' && tries < 1000) {
      tries++;
      const next = afterFailedTry(tries, now, retryUntil);
      status = next.status;
      if (tries === 8) expect(status).toBe('pending'); // where the old outbox gave up
      now = next.nextAttemptAt;
    }
    expect(status).toBe('failed');
    const gaveUpAfterHours = (now.getTime() - queued.getTime()) / 3_600_000;
    expect(gaveUpAfterHours).toBeGreaterThanOrEqual(72);
    expect(tries).toBeGreaterThan(60); // hourly tries once the backoff reaches its cap
  });

  it('still retries a message on its twentieth failed try inside the window', async () => {
    const msg = await enqueueEmail({ firmId: null, kind: 'test', to: `stubborn-${Date.now()}@example.test`, email: email('Twentieth try') });
    await msg.update({ attempts: 19 });
    const transport = mailTransport();
    const realSend = transport.sendMail.bind(transport);
    transport.sendMail = (() => Promise.reject(new Error('connect ECONNREFUSED 127.0.0.1:25'))) as typeof transport.sendMail;
    try {
      await deliverDueMessages();
    } finally {
      transport.sendMail = realSend;
    }
    await msg.reload();
    expect(msg.attempts).toBe(20);
    expect(msg.status).toBe('pending');
    await msg.update({ status: 'sent' }); // keep it out of the other tests' way
  });

  it('shows the owner the mail that could not be sent, and resends it on demand', async () => {
    const a = await makeFirm();
    const b = await makeFirm();
    const to = `failed-${Date.now()}@example.test`;
    const msg = await enqueueEmail({ firmId: a.firm.id, kind: 'invoice-sent', to, email: email('Invoice INV-2026-0042') });
    await msg.update({ status: 'failed', attempts: 77, lastError: 'connect ECONNREFUSED 127.0.0.1:25', retryUntil: new Date(Date.now() - 1000) });
    const owner = await signedInAgent(a.users.owner.email, PASSWORD);
    const list = await owner.get('/api/outbox/undelivered');
    expect(list.status).toBe(200);
    const row = list.body.data.find((m: { id: number }) => m.id === msg.id);
    expect(row).toMatchObject({ to, subject: 'Invoice INV-2026-0042', status: 'failed', attempts: 77, lastError: expect.stringMatching(/ECONNREFUSED/) });
    expect(JSON.stringify(row)).not.toMatch(/A test message/); // no bodies: they may hold sign-in links
    expect((await (await signedInAgent(a.users.consultant.email, PASSWORD)).get('/api/outbox/undelivered')).status).toBe(403);
    const otherOwner = await signedInAgent(b.users.owner.email, PASSWORD);
    expect((await otherOwner.get('/api/outbox/undelivered')).body.data.some((m: { id: number }) => m.id === msg.id)).toBe(false);
    expect((await otherOwner.post(`/api/outbox/${msg.id}/resend`).set('X-CSRF-Token', otherOwner.csrf)).status).toBe(404);

    const resent = await owner.post(`/api/outbox/${msg.id}/resend`).set('X-CSRF-Token', owner.csrf);
    expect(resent.status).toBe(200);
    expect(resent.body.data.status).toBe('retrying');
    await msg.reload();
    expect(msg.retryUntil.getTime()).toBeGreaterThan(Date.now() + RETRY_WINDOW_MS - 60_000);
    await deliverDueMessages(100);
    expect(await capturedMailTo(to)).toHaveLength(1);
    expect((await owner.post(`/api/outbox/${msg.id}/resend`).set('X-CSRF-Token', owner.csrf)).status).toBe(409);
  });
});
