/**
 * The e-mail outbox. Actions write their messages in their own transaction; the worker delivers
 * them with retries, so a mail outage delays messages but never loses them.
 */
import { Op, type Transaction } from 'sequelize';
import { OutboxMessage, type OutboxAttachment } from '../../models';
import { sequelize } from '../../db/sequelize';
import { mailTransport } from './mailer';
import { config } from '../../config';
import { logger } from '../../logger';
import type { RenderedEmail } from '../../../templates/email/layout';

export interface EnqueueInput {
  firmId: number | null;
  kind: string;
  to: string;
  email: RenderedEmail;
  attachments?: OutboxAttachment[];
}

/** Writes one message to the outbox inside the caller's transaction. */
export async function enqueueEmail(input: EnqueueInput, transaction?: Transaction): Promise<OutboxMessage> {
  return OutboxMessage.create(
    {
      firmId: input.firmId,
      kind: input.kind,
      toAddress: input.to,
      subject: input.email.subject,
      textBody: input.email.text,
      htmlBody: input.email.html,
      attachments: input.attachments ?? [],
      lastError: null,
      sentAt: null,
    },
    { transaction },
  );
}

/** How long a message is retried from the moment it is queued (or resent by the owner): 3 days. */
export const RETRY_WINDOW_MS = 3 * 24 * 3_600_000;

/** Minutes to wait before the next try: 1, 2, 4, … capped at an hour. */
export const retryDelayMs = (attempts: number): number => Math.min(60, 2 ** Math.max(0, attempts - 1)) * 60_000;

/**
 * After a failed try: wait by `retryDelayMs` and try again while the retry window lasts; the try
 * that falls after `retryUntil` gives up ('failed', shown to the owner, who may resend it).
 */
export function afterFailedTry(attempts: number, now: Date, retryUntil: Date): { status: 'pending' | 'failed'; nextAttemptAt: Date } {
  const next = new Date(now.getTime() + retryDelayMs(attempts));
  if (now.getTime() >= retryUntil.getTime()) return { status: 'failed', nextAttemptAt: next };
  return { status: 'pending', nextAttemptAt: next.getTime() > retryUntil.getTime() ? retryUntil : next };
}

/**
 * Delivers the messages that are due. Rows are claimed with SKIP LOCKED, so several server
 * instances can run the worker at once without sending a message twice.
 */
export async function deliverDueMessages(limit = 20): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const done = await sequelize.transaction(async (transaction) => {
      const message = await OutboxMessage.findOne({
        where: { status: 'pending', nextAttemptAt: { [Op.lte]: new Date() } },
        order: [['id', 'ASC']],
        lock: transaction.LOCK.UPDATE,
        skipLocked: true,
        transaction,
      });
      if (!message) return null;
      try {
        await mailTransport().sendMail({
          from: config.smtp.from,
          to: message.toAddress,
          subject: message.subject,
          text: message.textBody,
          html: message.htmlBody ?? undefined,
          attachments: message.attachments.map((a) => ({
            filename: a.filename,
            contentType: a.contentType,
            content: Buffer.from(a.contentBase64, 'base64'),
          })),
          headers: { 'X-Browseline-Message': `${message.id}`, 'X-Browseline-Kind': message.kind },
        });
        await message.update({ status: 'sent', sentAt: new Date(), attempts: message.attempts + 1, lastError: null }, { transaction });
        return 'sent';
      } catch (err) {
        const attempts = message.attempts + 1;
        const { status, nextAttemptAt } = afterFailedTry(attempts, new Date(), message.retryUntil);
        await message.update({ attempts, lastError: (err as Error).message.slice(0, 500), status, nextAttemptAt }, { transaction });
        logger.warn({ messageId: message.id, attempts, err: (err as Error).message }, 'mail delivery failed');
        return 'failed';
      }
    });
    if (done === null) break;
    if (done === 'sent') sent++;
    else failed++;
  }
  return { sent, failed };
}

/** Puts a failed (or waiting) message of the firm back in the queue now, with a fresh 3-day retry window, inside the caller's transaction (null when it is not the firm's). */
export async function resendMessage(firmId: number, id: number, transaction: Transaction): Promise<OutboxMessage | null> {
  const message = await OutboxMessage.findOne({ where: { id, firmId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!message) return null;
  if (message.status === 'sent') return message;
  const now = new Date();
  await message.update({ status: 'pending', attempts: 0, nextAttemptAt: now, retryUntil: new Date(now.getTime() + RETRY_WINDOW_MS) }, { transaction });
  return message;
}

/** Starts polling the outbox; returns a function that stops it. */
export function startOutboxWorker(intervalMs = config.outboxPollMs): () => void {
  let running = false;
  const tick = async () => {
    if (running) return;
    running = true;
    try {
      await deliverDueMessages();
    } catch (err) {
      logger.error({ err }, 'outbox worker tick failed');
    } finally {
      running = false;
    }
  };
  const timer = setInterval(tick, intervalMs);
  timer.unref();
  void tick();
  return () => clearInterval(timer);
}
