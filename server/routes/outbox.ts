/** The owner's view of mail that could not be delivered, and resending it. */
import { Op } from 'sequelize';
import { defineRoutes, OWNER } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { IdParamsSchema } from '../../shared/schemas/common';
import type { UndeliveredMailDto } from '../../shared/schemas/outbox';
import { OutboxMessage } from '../models';
import { actor } from '../policies/firm-scope';
import { resendUndeliveredMail } from '../commands/mail-resender';

const r = defineRoutes('/outbox');

const present = (m: OutboxMessage): UndeliveredMailDto => ({
  id: m.id,
  kind: m.kind,
  to: m.toAddress,
  subject: m.subject,
  status: m.status === 'failed' ? 'failed' : 'retrying',
  attempts: m.attempts,
  lastError: m.lastError,
  queuedAt: m.createdAt.toISOString(),
  nextAttemptAt: m.status === 'failed' ? null : m.nextAttemptAt.toISOString(),
});

r.get('/undelivered', OWNER, async (req, res) => {
  const rows = await OutboxMessage.findAll({
    where: { firmId: actor(req).firmId, [Op.or]: [{ status: 'failed' }, { status: 'pending', attempts: { [Op.gt]: 0 } }] },
    attributes: ['id', 'kind', 'toAddress', 'subject', 'status', 'attempts', 'lastError', 'createdAt', 'nextAttemptAt'],
    order: [['id', 'DESC']],
    limit: 200,
  });
  res.json({ data: rows.map(present) });
});

r.post('/:id/resend', OWNER, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const message = await resendUndeliveredMail(actor(req), params.id, req.ip ?? null);
  res.json({ data: present(message) });
}));

export const outboxRouter = r.router;
