/**
 * Paying invoices through the payments service: the hosted checkout page for the client, the
 * signed webhook events that tell the app money arrived (processed once per event id, in any
 * order), and refunds by the owner. Every create call carries an idempotency key derived from the
 * invoice's state, so a retry after an outage replays the first call instead of charging twice.
 */
import { emailFirmContact } from '../services/firm-profile';
import type Stripe from 'stripe';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Op } from 'sequelize';
import { Client, Firm, Invoice, InvoicePayment, InvoiceRefund, Property, User } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { CheckoutInput, RefundInput } from '../../shared/schemas/invoice';
import { conflict, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { clientRecipients } from '../services/mail/client-recipients';
import { lockInvoice } from './invoice-writer';
import { callPayments, payments } from '../services/payments/payments-client';
import { checkoutAmountCents, paymentStanding } from '../../shared/domain/invoicing';
import { enqueueEmail } from '../services/mail/outbox';
import { paymentReceiptEmail, paymentReceivedStaffEmail, refundEmail } from '../../templates/email/invoice';
import { config } from '../config';
import { logger } from '../logger';
import { usableZone } from '../services/clock';
import { todayIn } from '../../shared/domain/clock';

/**
 * The idempotency key of a checkout: the same payer, invoice, paid-so-far and amount always gives the
 * same key. The payer is part of it: the service refuses a key reused with other parameters (another
 * contact's e-mail) for 24 hours, which would lock a second contact of the client out of paying.
 */
export function checkoutIdempotencyKey(invoice: Pick<Invoice, 'id' | 'firmId' | 'amountPaidCents'>, amountCents: number, payerUserId: number): string {
  return `browseline-checkout-f${invoice.firmId}-i${invoice.id}-u${payerUserId}-paid${invoice.amountPaidCents}-amt${amountCents}`;
}

/** The client's hosted payment page for their own open invoice (the balance, or a part of it). */
export async function startCheckout(actor: SessionUser, id: number, input: CheckoutInput): Promise<{ url: string; amountCents: number; sessionId: string }> {
  const invoice = await Invoice.findOne({ where: { id, firmId: actor.firmId } });
  if (!invoice || invoice.clientId !== actor.clientId || invoice.status === 'draft') throw notFound('That invoice');
  if (invoice.status === 'paid') throw conflict(`Invoice ${invoice.number} is paid already; there is nothing to pay.`);
  if (invoice.status === 'void') throw conflict(`Invoice ${invoice.number} is void; nothing is due on it.`);
  const balanceCents = Math.max(0, invoice.totalCents - invoice.amountPaidCents);
  let amountCents: number;
  try {
    amountCents = checkoutAmountCents(balanceCents, input.amountCents);
  } catch (err) {
    throw unprocessable(`amountCents: ${(err as Error).message}`);
  }
  const metadata = { invoiceId: String(invoice.id), firmId: String(invoice.firmId), invoiceNumber: invoice.number, amountCents: String(amountCents) };
  const portalUrl = `${config.publicUrl}/portal/invoices/${invoice.id}`;
  const session = await callPayments('open the payment page', () =>
    payments().checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            price_data: { currency: invoice.currency.toLowerCase(), unit_amount: amountCents, product_data: { name: `Invoice ${invoice.number}${amountCents < balanceCents ? ' (part payment)' : ''}` } },
            quantity: 1,
          },
        ],
        metadata,
        payment_intent_data: { metadata, description: `Invoice ${invoice.number}`, receipt_email: actor.email },
        client_reference_id: `invoice-${invoice.id}`,
        customer_email: actor.email,
        success_url: `${portalUrl}?paid=1&session={CHECKOUT_SESSION_ID}`,
        cancel_url: portalUrl,
      },
      { idempotencyKey: checkoutIdempotencyKey(invoice, amountCents, actor.id) },
    ),
  );
  if (session.amount_total !== amountCents) {
    logger.error({ invoiceId: invoice.id, amountCents, sessionAmount: session.amount_total }, 'checkout amount differs from the invoice');
    throw conflict('The payment page came back with a different amount. Nothing was charged; please try again.');
  }
  if (session.status === 'complete') throw conflict('This payment has gone through already; the invoice will show it within a minute.');
  if (!session.url) throw conflict('The payment page is no longer open. Reload the invoice and press Pay again.');
  return { url: session.url, amountCents, sessionId: session.id };
}

/** Sums payments and refunds into the invoice and moves it to paid when the balance is 0. */
async function settle(invoice: Invoice, transaction: Transaction): Promise<void> {
  const rows = await InvoicePayment.findAll({ where: { invoiceId: invoice.id }, transaction });
  const refunded = rows.reduce((s, p) => s + p.refundedCents, 0);
  const standing = paymentStanding({ status: invoice.status, totalCents: invoice.totalCents, paymentsCents: rows.map((p) => p.amountCents) });
  await invoice.update(
    {
      amountPaidCents: standing.amountPaidCents,
      amountRefundedCents: refunded,
      status: standing.status,
      ...(standing.status === 'paid' && !invoice.paidAt ? { paidAt: new Date() } : {}),
    },
    { transaction },
  );
  if (standing.overpaidCents > 0) logger.warn({ invoiceId: invoice.id, overpaidCents: standing.overpaidCents }, 'invoice overpaid: refund the difference');
}

interface PaymentFacts {
  paymentIntentId: string;
  sessionId: string | null;
  amountCents: number;
  currency: string;
  metadata: Record<string, string>;
  createdUnix: number;
}

/** Records one payment (once per payment intent) and queues the receipt; answers false when it was known already. */
async function recordPayment(facts: PaymentFacts, transaction: Transaction): Promise<boolean> {
  const invoiceId = Number(facts.metadata.invoiceId);
  const firmId = Number(facts.metadata.firmId);
  if (!Number.isInteger(invoiceId) || !Number.isInteger(firmId)) {
    logger.warn({ paymentIntentId: facts.paymentIntentId }, 'payment without invoice metadata: ignored');
    return false;
  }
  // The invoice row lock serializes the events of one invoice, whatever order they arrive in.
  const invoice = await Invoice.findOne({ where: { id: invoiceId, firmId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!invoice) {
    logger.warn({ invoiceId, firmId }, 'payment for an unknown invoice: ignored');
    return false;
  }
  const existing = await InvoicePayment.findOne({ where: { processorPaymentId: facts.paymentIntentId }, transaction });
  if (existing) {
    if (!existing.processorSessionId && facts.sessionId) await existing.update({ processorSessionId: facts.sessionId }, { transaction });
    return false;
  }
  const payment = await InvoicePayment.create(
    { firmId, invoiceId, amountCents: facts.amountCents, currency: facts.currency.toUpperCase(), processorPaymentId: facts.paymentIntentId, processorSessionId: facts.sessionId, receivedAt: new Date(facts.createdUnix * 1000) },
    { transaction },
  );
  await settle(invoice, transaction);
  const [firm, property] = await Promise.all([Firm.findByPk(firmId, { transaction }), invoice.propertyId ? Property.findByPk(invoice.propertyId, { attributes: ['name'], transaction }) : null]);
  for (const to of await clientRecipients(invoice.clientId, transaction)) {
    await enqueueEmail(
      {
        firmId,
        kind: 'payment-receipt',
        to,
        email: paymentReceiptEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), propertyName: property?.name ?? 'your property', number: invoice.number, amountCents: payment.amountCents, balanceCents: Math.max(0, invoice.totalCents - invoice.amountPaidCents), receivedOn: todayIn(usableZone(firm?.timezone), payment.receivedAt), url: `${config.publicUrl}/portal/invoices/${invoice.id}` }),
      },
      transaction,
    );
  }
  // The consultant who made the invoice (and the firm's owners) hear of it in the same transaction.
  const [client, staff] = await Promise.all([
    Client.findByPk(invoice.clientId, { attributes: ['name'], transaction }),
    User.findAll({ where: { firmId, active: true, role: ['owner', 'consultant'], [Op.or]: [{ id: invoice.createdById ?? 0 }, { role: 'owner' }] }, attributes: ['email'], transaction }),
  ]);
  for (const user of staff) {
    await enqueueEmail(
      {
        firmId,
        kind: 'payment-received',
        to: user.email,
        email: paymentReceivedStaffEmail({ firmName: firm?.name ?? '', clientName: client?.name ?? 'A client', propertyName: property?.name ?? 'no property', number: invoice.number, amountCents: payment.amountCents, balanceCents: Math.max(0, invoice.totalCents - invoice.amountPaidCents), receivedOn: payment.receivedAt.toISOString().slice(0, 10), url: `${config.publicUrl}/invoices/${invoice.id}` }),
      },
      transaction,
    );
  }
  await recordAudit({ firmId, userId: null, action: 'invoice.payment-received', subjectType: 'Invoice', subjectId: invoice.id, data: { paymentIntentId: facts.paymentIntentId, amountCents: facts.amountCents } }, transaction);
  return true;
}

function factsFromIntent(pi: Stripe.PaymentIntent, sessionId: string | null): PaymentFacts {
  return { paymentIntentId: pi.id, sessionId, amountCents: pi.amount_received || pi.amount, currency: pi.currency, metadata: (pi.metadata ?? {}) as Record<string, string>, createdUnix: pi.created };
}

/** Records a refund (once per refund id) against its payment; fetches the payment first when its event has not arrived yet. */
async function recordRefund(refund: { id: string; amount: number; paymentIntentId: string; reason: string | null; createdById: number | null; requestKey: string | null }, transaction: Transaction): Promise<boolean> {
  if (await InvoiceRefund.findOne({ where: { processorRefundId: refund.id }, transaction })) return false;
  let payment = await InvoicePayment.findOne({ where: { processorPaymentId: refund.paymentIntentId }, transaction });
  if (!payment) {
    // Out of order: the refund's event came before the payment's. Learn the payment from the service.
    const pi = await callPayments('read the payment', () => payments().paymentIntents.retrieve(refund.paymentIntentId));
    if (pi.status !== 'succeeded') return false;
    await recordPayment(factsFromIntent(pi, null), transaction);
    payment = await InvoicePayment.findOne({ where: { processorPaymentId: refund.paymentIntentId }, transaction });
    if (!payment) return false;
  }
  const invoice = await Invoice.findOne({ where: { id: payment.invoiceId }, lock: transaction.LOCK.UPDATE, transaction });
  await payment.reload({ transaction });
  if (await InvoiceRefund.findOne({ where: { processorRefundId: refund.id }, transaction })) return false;
  await InvoiceRefund.create({ firmId: payment.firmId, invoiceId: payment.invoiceId, paymentId: payment.id, amountCents: refund.amount, reason: refund.reason, processorRefundId: refund.id, requestKey: refund.requestKey, createdById: refund.createdById }, { transaction });
  await payment.update({ refundedCents: payment.refundedCents + refund.amount }, { transaction });
  if (invoice) {
    await settle(invoice, transaction);
    const [firm, property, client] = await Promise.all([Firm.findByPk(invoice.firmId, { transaction }), invoice.propertyId ? Property.findByPk(invoice.propertyId, { attributes: ['name'], transaction }) : null, Client.findByPk(invoice.clientId, { transaction })]);
    for (const to of await clientRecipients(invoice.clientId, transaction)) {
      await enqueueEmail({ firmId: invoice.firmId, kind: 'invoice-refund', to, email: refundEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), propertyName: property?.name ?? client?.name ?? '', number: invoice.number, amountCents: refund.amount, url: `${config.publicUrl}/portal/invoices/${invoice.id}` }) }, transaction);
    }
  }
  await recordAudit({ firmId: payment.firmId, userId: refund.createdById, action: 'invoice.refunded', subjectType: 'Invoice', subjectId: payment.invoiceId, data: { refundId: refund.id, amountCents: refund.amount } }, transaction);
  return true;
}

/**
 * Processes one verified webhook event exactly once: its id is recorded in the same transaction as
 * its effects, so a duplicate delivery changes nothing and a failed one is retried whole.
 */
export async function processPaymentEvent(event: Stripe.Event): Promise<{ duplicate: boolean; recorded: boolean }> {
  return sequelize.transaction(async (transaction) => {
    const inserted = await sequelize.query<{ event_id: string }>('INSERT INTO processed_events (event_id, type) VALUES (:id, :type) ON CONFLICT (event_id) DO NOTHING RETURNING event_id', {
      replacements: { id: event.id, type: event.type },
      type: QueryTypes.SELECT,
      transaction,
    });
    if (inserted.length === 0) return { duplicate: true, recorded: false };
    let recorded = false;
    switch (event.type) {
      case 'checkout.session.completed': {
        const session = event.data.object as Stripe.Checkout.Session;
        if (session.payment_status !== 'paid' || !session.payment_intent) break;
        const piId = typeof session.payment_intent === 'string' ? session.payment_intent : session.payment_intent.id;
        recorded = await recordPayment({ paymentIntentId: piId, sessionId: session.id, amountCents: session.amount_total ?? 0, currency: session.currency ?? 'usd', metadata: (session.metadata ?? {}) as Record<string, string>, createdUnix: event.created }, transaction);
        break;
      }
      case 'payment_intent.succeeded': {
        recorded = await recordPayment(factsFromIntent(event.data.object as Stripe.PaymentIntent, null), transaction);
        break;
      }
      case 'refund.created':
      case 'refund.updated': {
        const r = event.data.object as Stripe.Refund;
        if (r.status === 'failed' || r.status === 'canceled' || !r.payment_intent) break;
        const piId = typeof r.payment_intent === 'string' ? r.payment_intent : r.payment_intent.id;
        const requestKey = typeof r.metadata?.requestKey === 'string' ? r.metadata.requestKey : null;
        recorded = await recordRefund({ id: r.id, amount: r.amount, paymentIntentId: piId, reason: (r.metadata?.reason as string | undefined) ?? null, createdById: null, requestKey }, transaction);
        break;
      }
      default:
        // Other events (declines, expired sessions, customers) change nothing here.
        break;
    }
    return { duplicate: false, recorded };
  });
}

/**
 * The idempotency key of a refund: fixed by the owner's request (its key), not by the payment's
 * state. A retry after a lost answer sends the same key and gets the same refund back, even after
 * the webhook has changed what is refunded so far.
 */
export function refundIdempotencyKey(payment: Pick<InvoicePayment, 'id' | 'firmId'>, requestKey: string): string {
  return `browseline-refund-f${payment.firmId}-p${payment.id}-r${requestKey}`;
}

/** Refunds part or all of a payment (owner only); recorded at once and again, harmlessly, by the webhook. */
export async function refundPayment(actor: SessionUser, invoiceId: number, input: RefundInput, ip: string | null): Promise<Invoice> {
  const invoice = await Invoice.findOne({ where: { id: invoiceId, firmId: actor.firmId } });
  if (!invoice) throw notFound('That invoice');
  const payment = await InvoicePayment.findOne({ where: { id: input.paymentId, invoiceId: invoice.id } });
  if (!payment) throw notFound('That payment');
  // The same request again (its answer was lost, or the webhook came first): it is done, say so.
  const done = await InvoiceRefund.findOne({ where: { firmId: actor.firmId, requestKey: input.requestKey } });
  if (done) {
    if (done.paymentId !== payment.id || done.amountCents !== input.amountCents) throw conflict('This refund request was already used for another refund. Reload the invoice and start a new refund.');
    return invoice;
  }
  const refundable = payment.amountCents - payment.refundedCents;
  if (input.amountCents > refundable) throw unprocessable(`amountCents: at most ${refundable} cents of this payment can still be refunded.`);
  const refund = await callPayments(
    'refund the payment',
    () =>
      payments().refunds.create(
        { payment_intent: payment.processorPaymentId, amount: input.amountCents, metadata: { invoiceId: String(invoice.id), firmId: String(invoice.firmId), requestKey: input.requestKey, ...(input.reason ? { reason: input.reason } : {}) } },
        { idempotencyKey: refundIdempotencyKey(payment, input.requestKey) },
      ),
    'unknown',
  );
  return sequelize.transaction(async (transaction) => {
    // The client's e-mail is queued by recordRefund, once per refund, whichever of this and the webhook records it first.
    await recordRefund({ id: refund.id, amount: refund.amount, paymentIntentId: payment.processorPaymentId, reason: input.reason ?? null, createdById: actor.id, requestKey: input.requestKey }, transaction);
    const locked = await lockInvoice(invoice.id, actor.firmId, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'invoice.refund-requested', subjectType: 'Invoice', subjectId: locked.id, data: { refundId: refund.id, amountCents: refund.amount }, ip }, transaction);
    return locked;
  });
}
