import { describe, expect, it } from 'vitest';
import { OutboxMessage } from '../../server/models';
import { deliverDueMessages, enqueueEmail, retryDelayMs } from '../../server/services/mail/outbox';
import { mailTransport } from '../../server/services/mail/mailer';
import { renderEmail } from '../../templates/email/layout';
import { capturedMailTo, capturedMessage } from '../support/test-app';
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
});
