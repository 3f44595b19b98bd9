/**
 * Overdue reminders: once an open invoice is past its due date, its client gets a reminder by
 * e-mail (through the outbox), then at most one a week. Runs on a schedule in the server process
 * and is called directly by tests. Rows are claimed with SKIP LOCKED, so several instances never
 * remind twice.
 */
import { emailFirmContact } from '../services/firm-profile';
import { Op } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Firm, Invoice, Property } from '../models';
import { clientRecipients } from '../services/mail/client-recipients';
import { recordAudit } from './audit-recorder';
import { enqueueEmail } from '../services/mail/outbox';
import { overdueReminderEmail } from '../../templates/email/invoice';
import { config } from '../config';
import { logger } from '../logger';
import { addDays } from '../../shared/domain/planting-windows';
import { firmToday, now } from '../services/clock';
import { todayIn } from '../../shared/domain/clock';
import { REMINDER_INTERVAL_DAYS, daysPastDue, reminderDue } from '../../shared/domain/invoicing';

/**
 * Queues the reminders due today — each firm's today in its own time zone, or `onDate` (YYYY-MM-DD)
 * for every firm when given — and answers how many invoices were reminded.
 */
export async function sendOverdueReminders(onDate?: string): Promise<number> {
  // No zone is more than a day ahead of UTC: this bound finds every candidate; each is then checked against its firm's today.
  const bound = onDate ?? addDays(todayIn('UTC', now()), 1);
  const todays = new Map<number, string>();
  const todayOf = async (firmId: number): Promise<string> => {
    if (onDate) return onDate;
    if (!todays.has(firmId)) todays.set(firmId, await firmToday(firmId));
    return todays.get(firmId)!;
  };
  const candidates = await Invoice.findAll({
    where: {
      status: 'open',
      dueOn: { [Op.lt]: bound },
      [Op.or]: [{ lastReminderOn: null }, { lastReminderOn: { [Op.lte]: addDays(bound, -REMINDER_INTERVAL_DAYS) } }],
    },
    attributes: ['id', 'firmId'],
    order: [['id', 'ASC']],
    limit: 500,
  });
  let reminded = 0;
  for (const { id, firmId } of candidates) {
    const today = await todayOf(firmId);
    const done = await sequelize.transaction(async (transaction) => {
      const invoice = await Invoice.findOne({ where: { id }, lock: transaction.LOCK.UPDATE, skipLocked: true, transaction });
      if (!invoice || invoice.status !== 'open' || !invoice.dueOn) return false;
      if (!reminderDue({ dueOn: invoice.dueOn, today, lastReminderOn: invoice.lastReminderOn })) return false;
      const balanceCents = Math.max(0, invoice.totalCents - invoice.amountPaidCents);
      if (balanceCents === 0) return false;
      const [firm, property] = await Promise.all([Firm.findByPk(invoice.firmId, { transaction }), invoice.propertyId ? Property.findByPk(invoice.propertyId, { attributes: ['name'], transaction }) : null]);
      const recipients = await clientRecipients(invoice.clientId, transaction);
      for (const to of recipients) {
        await enqueueEmail(
          {
            firmId: invoice.firmId,
            kind: 'invoice-overdue',
            to,
            email: overdueReminderEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), propertyName: property?.name ?? 'your property', number: invoice.number, balanceCents, dueOn: invoice.dueOn, daysOverdue: daysPastDue(invoice.dueOn, today), url: `${config.publicUrl}/portal/invoices/${invoice.id}` }),
          },
          transaction,
        );
      }
      await invoice.update({ lastReminderOn: today, reminderCount: invoice.reminderCount + 1 }, { transaction });
      await recordAudit({ firmId: invoice.firmId, userId: null, action: 'invoice.reminded', subjectType: 'Invoice', subjectId: invoice.id, data: { to: recipients, balanceCents } }, transaction);
      return true;
    });
    if (done) reminded++;
  }
  return reminded;
}

/** Starts the hourly reminder job; returns a function that stops it. */
export function startReminderJob(intervalMs = config.reminderPollMs): () => void {
  const tick = () =>
    sendOverdueReminders().then(
      (n) => n > 0 && logger.info({ reminded: n }, 'overdue reminders queued'),
      (err: unknown) => logger.error({ err }, 'overdue reminder job failed'),
    );
  const timer = setInterval(() => void tick(), intervalMs);
  timer.unref();
  void tick();
  return () => clearInterval(timer);
}
