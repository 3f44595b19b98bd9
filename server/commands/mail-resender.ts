/** The owner resends mail that could not be delivered, with its audit record. */
import { sequelize } from '../db/sequelize';
import type { OutboxMessage } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import { resendMessage } from '../services/mail/outbox';
import { conflict, notFound } from '../errors';
import { recordAudit } from './audit-recorder';

/** Queues a failed or retrying message of the firm again now (404 for another firm's, 409 once delivered). */
export async function resendUndeliveredMail(me: SessionUser, messageId: number, ip: string | null): Promise<OutboxMessage> {
  return sequelize.transaction(async (transaction) => {
    const message = await resendMessage(me.firmId, messageId, transaction);
    if (!message) throw notFound('That message');
    if (message.status === 'sent') throw conflict('That message was delivered already; nothing to resend.');
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'mail.resent', subjectType: 'OutboxMessage', subjectId: message.id, ip }, transaction);
    return message;
  });
}
