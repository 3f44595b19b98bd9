// In-memory state of the local payments fake: customers, checkout sessions, payment intents,
// charges, refunds and events, with the rules the hosted service applies to them. Every change
// that the hosted service announces by webhook appends an event and hands it to `onEvent`.
// Objects are stored as the API shows them; callers get deep copies.

import { randomBytes } from 'node:crypto';
import { formatAmount } from './money';
import {
  type Params,
  asParams,
  assertKnownParams,
  invalidRequest,
  optionalInteger,
  optionalString,
  optionalUrl,
  readArray,
  readMetadata,
  requiredCurrency,
  requiredPositiveInteger,
  requiredString,
  resourceMissing,
} from './params';

type Json = Record<string, unknown>;

export interface FakeCustomer extends Json {
  id: string;
  object: 'customer';
  created: number;
  email: string | null;
  name: string | null;
  phone: string | null;
  description: string | null;
  metadata: Record<string, string>;
  livemode: false;
}

export interface FakeLineItem extends Json {
  id: string;
  object: 'item';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: {
    id: string;
    object: 'price';
    active: false;
    currency: string;
    livemode: false;
    product: string;
    type: 'one_time';
    unit_amount: number;
    unit_amount_decimal: string;
  };
}

export interface FakeCheckoutSession extends Json {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: string | null;
  customer_details: { email: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Record<string, string>;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  url: string | null;
}

export interface FakePaymentError {
  type: 'card_error';
  code: 'card_declined';
  decline_code: string;
  message: string;
  charge: string;
}

export interface FakePaymentIntent extends Json {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_received: number;
  capture_method: 'automatic';
  client_secret: string;
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  last_payment_error: FakePaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Record<string, string>;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  status: 'requires_payment_method' | 'succeeded' | 'canceled';
}

export interface FakeCharge extends Json {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  captured: boolean;
  created: number;
  currency: string;
  customer: string | null;
  failure_code: string | null;
  failure_message: string | null;
  livemode: false;
  metadata: Record<string, string>;
  paid: boolean;
  payment_intent: string;
  payment_method_details: { type: 'card'; card: { brand: string; last4: string; exp_month: number; exp_year: number } };
  refunded: boolean;
  status: 'succeeded' | 'failed';
}

export interface FakeRefund extends Json {
  id: string;
  object: 'refund';
  amount: number;
  charge: string;
  created: number;
  currency: string;
  metadata: Record<string, string>;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
}

export interface FakeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: Json; previous_attributes?: Json };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface FakeList<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

/** Where a change came from; copied into the event's `request` member. */
export interface RequestContext {
  requestId: string | null;
  idempotencyKey: string | null;
}

const NO_REQUEST: RequestContext = { requestId: null, idempotencyKey: null };

/** A card number the test page and the control API accept, and what paying with it does. */
export interface TestCard {
  number: string;
  brand: string;
  outcome: 'succeeded' | 'declined';
  declineCode?: string;
  message?: string;
}

/** Test cards the fake knows; numbers as published in the hosted service's testing docs (from memory). */
export const TEST_CARDS: readonly TestCard[] = [
  { number: '4242424242424242', brand: 'visa', outcome: 'succeeded' },
  { number: '4000000000000002', brand: 'visa', outcome: 'declined', declineCode: 'generic_decline', message: 'Your card was declined.' },
  {
    number: '4000000000009995',
    brand: 'visa',
    outcome: 'declined',
    declineCode: 'insufficient_funds',
    message: 'Your card has insufficient funds.',
  },
];

/** Outcome of a payment attempt on a checkout session. */
export type PayOutcome =
  | { outcome: 'paid'; session: FakeCheckoutSession; paymentIntent: FakePaymentIntent; redirectUrl: string }
  | { outcome: 'declined'; declineCode: string; message: string; paymentIntent: FakePaymentIntent };

export interface LedgerOptions {
  apiVersion: string;
  onEvent: (event: FakeEvent) => void;
  /** Current time in unix seconds; tests may pin it. */
  nowSec?: () => number;
}

const ALPHANUMERIC = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** A random id in the hosted service's style: prefix, underscore, alphanumerics. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let suffix = '';
  for (const byte of bytes) suffix += ALPHANUMERIC[byte % ALPHANUMERIC.length];
  return `${prefix}_${suffix}`;
}

// Checkout limits of the hosted service (from memory): 100 line items in payment mode,
// at least $0.50 for usd, at most 99,999,999 in the smallest unit; sessions live 30 min to 24 h.
const MAX_LINE_ITEMS = 100;
const MIN_AMOUNT_MINOR: Record<string, number> = { usd: 50, eur: 50, cad: 50, gbp: 30 };
const MAX_AMOUNT_MINOR = 99_999_999;
const SESSION_MIN_LIFETIME_SEC = 30 * 60;
const SESSION_MAX_LIFETIME_SEC = 24 * 60 * 60;

const SESSION_PARAMS = [
  'mode', 'line_items', 'metadata', 'client_reference_id', 'success_url', 'cancel_url', 'customer', 'customer_email',
  'payment_intent_data', 'expires_at', 'expand', 'payment_method_types', 'locale', 'submit_type',
  'billing_address_collection', 'customer_creation', 'allow_promotion_codes',
] as const;
const PAYMENT_INTENT_DATA_PARAMS = ['metadata', 'description', 'receipt_email', 'statement_descriptor', 'statement_descriptor_suffix'] as const;
const LINE_ITEM_PARAMS = ['price_data', 'quantity', 'price', 'amount', 'currency', 'name', 'description'] as const;
const PRICE_DATA_PARAMS = ['currency', 'unit_amount', 'unit_amount_decimal', 'product_data', 'product', 'tax_behavior'] as const;
const PRODUCT_DATA_PARAMS = ['name', 'description', 'metadata', 'images', 'tax_code'] as const;
const CUSTOMER_PARAMS = ['email', 'name', 'phone', 'description', 'metadata', 'expand'] as const;
const REFUND_PARAMS = ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'expand'] as const;
const REFUND_REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'];

/** Digits only, so "4242 4242 4242 4242" and "4242-4242-4242-4242" match the same card. */
export function normaliseCardNumber(card: string): string {
  return card.replace(/[\s-]/g, '');
}

/** Finds a test card by number, or explains which numbers work. */
export function findTestCard(card: unknown): TestCard {
  const number = typeof card === 'string' ? normaliseCardNumber(card) : '';
  const found = TEST_CARDS.find((c) => c.number === number);
  if (!found) {
    throw invalidRequest(
      `${number ? `Card number ending ${number.slice(-4)} is not a test card.` : 'Missing required param: card.'} ` +
        'Use 4242 4242 4242 4242 (pays), 4000 0000 0000 0002 (declined) or 4000 0000 0000 9995 (insufficient funds).',
      { param: 'card', code: 'unknown_test_card' },
    );
  }
  return found;
}

/** The state of one fake payments account. */
export class PaymentsLedger {
  private readonly customers = new Map<string, FakeCustomer>();
  private readonly sessions = new Map<string, FakeCheckoutSession>();
  private readonly sessionLineItems = new Map<string, FakeLineItem[]>();
  private readonly sessionPaymentIntentData = new Map<string, { metadata: Record<string, string>; description: string | null; receiptEmail: string | null }>();
  private readonly paymentIntents = new Map<string, FakePaymentIntent>();
  private readonly charges = new Map<string, FakeCharge>();
  private readonly refunds = new Map<string, FakeRefund>();
  private readonly events: FakeEvent[] = [];
  private readonly nowSec: () => number;

  constructor(private readonly options: LedgerOptions) {
    this.nowSec = options.nowSec ?? (() => Math.floor(Date.now() / 1000));
  }

  /** Forgets every object and event. */
  reset(): void {
    this.customers.clear();
    this.sessions.clear();
    this.sessionLineItems.clear();
    this.sessionPaymentIntentData.clear();
    this.paymentIntents.clear();
    this.charges.clear();
    this.refunds.clear();
    this.events.length = 0;
  }

  // ---- customers ----------------------------------------------------------------------------

  /** POST /v1/customers */
  createCustomer(params: Params, ctx: RequestContext = NO_REQUEST): FakeCustomer {
    assertKnownParams(params, CUSTOMER_PARAMS);
    const customer: FakeCustomer = {
      id: newId('cus', 14),
      object: 'customer',
      created: this.nowSec(),
      email: optionalString(params, 'email', 'email', 512),
      name: optionalString(params, 'name', 'name', 256),
      phone: optionalString(params, 'phone', 'phone', 20),
      description: optionalString(params, 'description', 'description', 350),
      metadata: readMetadata(params, 'metadata'),
      livemode: false,
    };
    this.customers.set(customer.id, customer);
    this.emit('customer.created', customer, ctx);
    return clone(customer);
  }

  /** GET /v1/customers/:id */
  getCustomer(id: string): FakeCustomer {
    return clone(this.customerRecord(id));
  }

  // ---- checkout sessions --------------------------------------------------------------------

  /** POST /v1/checkout/sessions; `payPageBase` is the fake's public origin for the `url` member. */
  createCheckoutSession(params: Params, payPageBase: string): FakeCheckoutSession {
    assertKnownParams(params, SESSION_PARAMS);
    const mode = requiredString(params, 'mode');
    if (mode !== 'payment') {
      throw invalidRequest(`Invalid mode: ${mode}. The local payments fake supports mode=payment only.`, { param: 'mode' });
    }
    const successUrl = optionalUrl(params, 'success_url');
    if (successUrl === null) throw invalidRequest('Missing required param: success_url.', { param: 'success_url' });
    const cancelUrl = optionalUrl(params, 'cancel_url');
    const customerId = optionalString(params, 'customer');
    const customerEmail = optionalString(params, 'customer_email', 'customer_email', 512);
    if (customerId !== null && customerEmail !== null) {
      throw invalidRequest('You may only specify one of these parameters: customer, customer_email.', { param: 'customer_email' });
    }
    if (customerId !== null) this.customerRecord(customerId, 'customer');

    const lineItems = this.buildLineItems(params);
    const currency = lineItems[0].currency;
    const amountTotal = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
    const minimum = MIN_AMOUNT_MINOR[currency] ?? 1;
    if (amountTotal < minimum) {
      throw invalidRequest(
        `The Checkout Session's total amount due must add up to at least ${formatAmount(minimum, currency)}; it is ${formatAmount(amountTotal, currency)}.`,
        { param: 'line_items', code: 'amount_too_small' },
      );
    }
    if (amountTotal > MAX_AMOUNT_MINOR) {
      throw invalidRequest(
        `The Checkout Session's total amount due must be at most ${formatAmount(MAX_AMOUNT_MINOR, currency)}; it is ${formatAmount(amountTotal, currency)}.`,
        { param: 'line_items', code: 'amount_too_large' },
      );
    }

    const created = this.nowSec();
    const expiresAt = optionalInteger(params, 'expires_at') ?? created + SESSION_MAX_LIFETIME_SEC;
    if (expiresAt < created + SESSION_MIN_LIFETIME_SEC || expiresAt > created + SESSION_MAX_LIFETIME_SEC) {
      throw invalidRequest('The `expires_at` timestamp must be between 30 minutes and 24 hours from Checkout Session creation.', {
        param: 'expires_at',
      });
    }

    const paymentIntentData = asParams(params.payment_intent_data, 'payment_intent_data');
    assertKnownParams(paymentIntentData, PAYMENT_INTENT_DATA_PARAMS, 'payment_intent_data');
    const id = newId('cs_test', 58);
    const session: FakeCheckoutSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: amountTotal,
      amount_total: amountTotal,
      cancel_url: cancelUrl,
      client_reference_id: optionalString(params, 'client_reference_id', 'client_reference_id', 200),
      created,
      currency,
      customer: customerId,
      customer_details: null,
      customer_email: customerEmail,
      expires_at: expiresAt,
      livemode: false,
      metadata: readMetadata(params, 'metadata'),
      mode: 'payment',
      payment_intent: null,
      payment_method_types: ['card'],
      payment_status: 'unpaid',
      status: 'open',
      success_url: successUrl,
      total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
      ui_mode: 'hosted',
      url: `${payPageBase.replace(/\/+$/, '')}/pay/${id}`,
    };
    this.sessions.set(id, session);
    this.sessionLineItems.set(id, lineItems);
    this.sessionPaymentIntentData.set(id, {
      metadata: readMetadata(paymentIntentData, 'metadata', 'payment_intent_data[metadata]'),
      description: optionalString(paymentIntentData, 'description', 'payment_intent_data[description]', 1000),
      receiptEmail: optionalString(paymentIntentData, 'receipt_email', 'payment_intent_data[receipt_email]', 512),
    });
    return clone(session);
  }

  /** GET /v1/checkout/sessions/:id (a session past `expires_at` expires on first sight). */
  getCheckoutSession(id: string, ctx: RequestContext = NO_REQUEST): FakeCheckoutSession {
    return clone(this.sessionRecord(id, ctx));
  }

  /** GET /v1/checkout/sessions/:id/line_items */
  listCheckoutSessionLineItems(id: string): FakeList<FakeLineItem> {
    this.sessionRecord(id);
    return {
      object: 'list',
      data: clone(this.sessionLineItems.get(id) ?? []),
      has_more: false,
      url: `/v1/checkout/sessions/${id}/line_items`,
    };
  }

  /** POST /v1/checkout/sessions/:id/expire */
  expireCheckoutSession(id: string, ctx: RequestContext = NO_REQUEST): FakeCheckoutSession {
    const session = this.sessionRecord(id, ctx);
    if (session.status !== 'open') {
      throw invalidRequest(
        `Only Checkout Sessions with a status in ["open"] can be expired; ${id} is ${session.status}.`,
        { code: 'checkout_session_not_open' },
      );
    }
    this.expire(session, ctx);
    return clone(session);
  }

  /**
   * Pays a session with a test card: on success marks it complete and paid, creates a succeeded
   * payment intent and charge, and emits checkout.session.completed and payment_intent.succeeded;
   * on a decline leaves it open and emits payment_intent.payment_failed.
   */
  payCheckoutSession(id: string, card: unknown, ctx: RequestContext = NO_REQUEST): PayOutcome {
    const session = this.sessionRecord(id, ctx, 'session');
    if (session.status !== 'open') {
      throw invalidRequest(`This Checkout Session is no longer open (status: ${session.status}), so it cannot be paid.`, {
        code: 'checkout_session_not_open',
        param: 'session',
      });
    }
    const testCard = findTestCard(card);
    const paymentIntent = this.paymentIntentForSession(session);
    const now = this.nowSec();
    const charge: FakeCharge = {
      id: newId('ch'),
      object: 'charge',
      amount: paymentIntent.amount,
      amount_captured: 0,
      amount_refunded: 0,
      captured: false,
      created: now,
      currency: paymentIntent.currency,
      customer: paymentIntent.customer,
      failure_code: null,
      failure_message: null,
      livemode: false,
      metadata: { ...paymentIntent.metadata },
      paid: false,
      payment_intent: paymentIntent.id,
      payment_method_details: {
        type: 'card',
        card: { brand: testCard.brand, last4: testCard.number.slice(-4), exp_month: 12, exp_year: new Date().getUTCFullYear() + 3 },
      },
      refunded: false,
      status: 'failed',
    };
    this.charges.set(charge.id, charge);
    paymentIntent.latest_charge = charge.id;
    paymentIntent.payment_method = newId('pm');

    if (testCard.outcome === 'declined') {
      const declineCode = testCard.declineCode ?? 'generic_decline';
      const message = testCard.message ?? 'Your card was declined.';
      charge.failure_code = 'card_declined';
      charge.failure_message = message;
      paymentIntent.status = 'requires_payment_method';
      paymentIntent.last_payment_error = { type: 'card_error', code: 'card_declined', decline_code: declineCode, message, charge: charge.id };
      this.emit('payment_intent.payment_failed', paymentIntent, ctx);
      return { outcome: 'declined', declineCode, message, paymentIntent: clone(paymentIntent) };
    }

    charge.status = 'succeeded';
    charge.paid = true;
    charge.captured = true;
    charge.amount_captured = charge.amount;
    paymentIntent.status = 'succeeded';
    paymentIntent.amount_received = paymentIntent.amount;
    paymentIntent.last_payment_error = null;
    session.status = 'complete';
    session.payment_status = 'paid';
    session.url = null;
    const customerEmail = session.customer_email ?? (session.customer ? this.customers.get(session.customer)?.email ?? null : null);
    session.customer_details = { email: customerEmail };
    this.emit('checkout.session.completed', session, ctx);
    this.emit('payment_intent.succeeded', paymentIntent, ctx);
    return {
      outcome: 'paid',
      session: clone(session),
      paymentIntent: clone(paymentIntent),
      redirectUrl: session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id),
    };
  }

  // ---- payment intents and charges ----------------------------------------------------------

  /** GET /v1/payment_intents/:id */
  getPaymentIntent(id: string): FakePaymentIntent {
    return clone(this.paymentIntentRecord(id));
  }

  /** GET /v1/charges/:id */
  getCharge(id: string): FakeCharge {
    const charge = this.charges.get(id);
    if (!charge) throw resourceMissing('charge', id);
    return clone(charge);
  }

  // ---- refunds ------------------------------------------------------------------------------

  /**
   * POST /v1/refunds: refunds all or part of a payment intent's (or charge's) successful charge;
   * refuses more than the unrefunded remainder. Emits refund.created and charge.refunded.
   */
  createRefund(params: Params, ctx: RequestContext = NO_REQUEST): FakeRefund {
    assertKnownParams(params, REFUND_PARAMS);
    const paymentIntentId = optionalString(params, 'payment_intent');
    const chargeId = optionalString(params, 'charge');
    if (paymentIntentId === null && chargeId === null) {
      throw invalidRequest('One of the following params should be provided for this request: payment_intent or charge.', {
        param: 'payment_intent',
      });
    }
    let charge: FakeCharge | undefined;
    if (paymentIntentId !== null) {
      const paymentIntent = this.paymentIntentRecord(paymentIntentId, 'payment_intent');
      if (paymentIntent.status !== 'succeeded' || !paymentIntent.latest_charge) {
        throw invalidRequest(
          `This PaymentIntent (${paymentIntentId}) does not have a successful charge to refund (status: ${paymentIntent.status}).`,
          { param: 'payment_intent', code: 'charge_not_refundable' },
        );
      }
      charge = this.charges.get(paymentIntent.latest_charge);
      if (chargeId !== null && chargeId !== charge?.id) {
        throw invalidRequest(`Charge ${chargeId} does not belong to PaymentIntent ${paymentIntentId}.`, { param: 'charge' });
      }
    } else if (chargeId !== null) {
      charge = this.charges.get(chargeId);
      if (!charge) throw resourceMissing('charge', chargeId, 'charge');
    }
    if (!charge || charge.status !== 'succeeded') {
      throw invalidRequest('There is no successful charge to refund.', { param: 'charge', code: 'charge_not_refundable' });
    }
    const remaining = charge.amount - charge.amount_refunded;
    if (remaining === 0) {
      throw invalidRequest(`Charge ${charge.id} has already been refunded.`, { code: 'charge_already_refunded' });
    }
    const requested = optionalInteger(params, 'amount');
    if (requested !== null && requested < 1) {
      throw invalidRequest('Invalid positive integer: amount must be at least 1.', { param: 'amount' });
    }
    const amount = requested ?? remaining;
    if (amount > remaining) {
      throw invalidRequest(
        `Refund amount (${formatAmount(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatAmount(remaining, charge.currency)}).`,
        { param: 'amount', code: 'amount_too_large' },
      );
    }
    const reason = optionalString(params, 'reason');
    if (reason !== null && !REFUND_REASONS.includes(reason)) {
      throw invalidRequest(`Invalid reason: ${reason}. Use one of ${REFUND_REASONS.join(', ')}.`, { param: 'reason' });
    }
    const refund: FakeRefund = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: charge.id,
      created: this.nowSec(),
      currency: charge.currency,
      metadata: readMetadata(params, 'metadata'),
      payment_intent: charge.payment_intent,
      reason,
      status: 'succeeded',
    };
    this.refunds.set(refund.id, refund);
    const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    this.emit('refund.created', refund, ctx);
    this.emit('charge.refunded', charge, ctx, previous);
    return clone(refund);
  }

  /** GET /v1/refunds/:id */
  getRefund(id: string): FakeRefund {
    const refund = this.refunds.get(id);
    if (!refund) throw resourceMissing('refund', id);
    return clone(refund);
  }

  /** GET /v1/refunds (filters: payment_intent, charge; newest first). */
  listRefunds(params: Params): FakeList<FakeRefund> {
    const paymentIntentId = optionalString(params, 'payment_intent');
    const chargeId = optionalString(params, 'charge');
    const matching = [...this.refunds.values()]
      .filter((r) => (paymentIntentId === null || r.payment_intent === paymentIntentId) && (chargeId === null || r.charge === chargeId))
      .reverse();
    return paginate(matching, params, '/v1/refunds');
  }

  // ---- events -------------------------------------------------------------------------------

  /** GET /v1/events/:id */
  getEvent(id: string): FakeEvent {
    const event = this.events.find((e) => e.id === id);
    if (!event) throw resourceMissing('event', id);
    return clone(event);
  }

  /** GET /v1/events (filters: type, with `*` as a wildcard segment; newest first). */
  listEvents(params: Params): FakeList<FakeEvent> {
    const type = optionalString(params, 'type');
    const pattern = type === null ? null : new RegExp(`^${type.split('*').map(escapeRegExp).join('[^.]*')}$`);
    const matching = this.events.filter((e) => pattern === null || pattern.test(e.type)).reverse();
    return paginate(matching, params, '/v1/events');
  }

  /** Every event so far, oldest first. */
  allEvents(): FakeEvent[] {
    return clone(this.events);
  }

  // ---- internals ----------------------------------------------------------------------------

  private emit(type: string, object: Json, ctx: RequestContext, previousAttributes?: Json): FakeEvent {
    const event: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: this.options.apiVersion,
      created: this.nowSec(),
      data: previousAttributes ? { object: clone(object), previous_attributes: previousAttributes } : { object: clone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: ctx.requestId, idempotency_key: ctx.idempotencyKey },
      type,
    };
    this.events.push(event);
    this.options.onEvent(clone(event));
    return event;
  }

  private customerRecord(id: string, param = 'id'): FakeCustomer {
    const customer = this.customers.get(id);
    if (!customer) throw resourceMissing('customer', id, param);
    return customer;
  }

  private sessionRecord(id: string, ctx: RequestContext = NO_REQUEST, param = 'session'): FakeCheckoutSession {
    const session = this.sessions.get(id);
    if (!session) throw resourceMissing('checkout.session', id, param);
    if (session.status === 'open' && this.nowSec() >= session.expires_at) this.expire(session, ctx);
    return session;
  }

  private paymentIntentRecord(id: string, param = 'id'): FakePaymentIntent {
    const paymentIntent = this.paymentIntents.get(id);
    if (!paymentIntent) throw resourceMissing('payment_intent', id, param);
    return paymentIntent;
  }

  private expire(session: FakeCheckoutSession, ctx: RequestContext): void {
    session.status = 'expired';
    session.url = null;
    if (session.payment_intent) {
      const paymentIntent = this.paymentIntents.get(session.payment_intent);
      if (paymentIntent && paymentIntent.status === 'requires_payment_method') paymentIntent.status = 'canceled';
    }
    this.emit('checkout.session.expired', session, ctx);
  }

  private paymentIntentForSession(session: FakeCheckoutSession): FakePaymentIntent {
    if (session.payment_intent) return this.paymentIntentRecord(session.payment_intent);
    const data = this.sessionPaymentIntentData.get(session.id);
    const id = newId('pi');
    const paymentIntent: FakePaymentIntent = {
      id,
      object: 'payment_intent',
      amount: session.amount_total,
      amount_capturable: 0,
      amount_received: 0,
      capture_method: 'automatic',
      client_secret: `${id}_secret_${newId('s', 24).slice(2)}`,
      created: this.nowSec(),
      currency: session.currency,
      customer: session.customer,
      description: data?.description ?? null,
      last_payment_error: null,
      latest_charge: null,
      livemode: false,
      metadata: { ...(data?.metadata ?? {}) },
      payment_method: null,
      payment_method_types: ['card'],
      receipt_email: data?.receiptEmail ?? null,
      status: 'requires_payment_method',
    };
    this.paymentIntents.set(id, paymentIntent);
    session.payment_intent = id;
    return paymentIntent;
  }

  private buildLineItems(params: Params): FakeLineItem[] {
    const rawItems = readArray(params, 'line_items');
    if (rawItems.length === 0) throw invalidRequest('Missing required param: line_items.', { param: 'line_items' });
    if (rawItems.length > MAX_LINE_ITEMS) {
      throw invalidRequest(`Too many line_items: at most ${MAX_LINE_ITEMS} in payment mode.`, { param: 'line_items' });
    }
    const items = rawItems.map((raw, index) => buildLineItem(raw, `line_items[${index}]`));
    const currencies = [...new Set(items.map((item) => item.currency))];
    if (currencies.length > 1) {
      throw invalidRequest(`All line_items must use the same currency; found ${currencies.join(' and ')}.`, { param: 'line_items' });
    }
    return items;
  }
}

function buildLineItem(raw: unknown, name: string): FakeLineItem {
  const item = asParams(raw, name);
  assertKnownParams(item, LINE_ITEM_PARAMS, name);
  if (item.price !== undefined) {
    throw invalidRequest(
      `The local payments fake has no Price objects: send ${name}[price_data] (currency, unit_amount, product_data[name]) instead of ${name}[price].`,
      { param: `${name}[price]` },
    );
  }
  const quantity = requiredPositiveInteger(item, 'quantity', `${name}[quantity]`);
  let currency: string;
  let unitAmount: number;
  let description: string;
  if (item.price_data !== undefined) {
    const priceData = asParams(item.price_data, `${name}[price_data]`);
    assertKnownParams(priceData, PRICE_DATA_PARAMS, `${name}[price_data]`);
    currency = requiredCurrency(priceData, 'currency', `${name}[price_data][currency]`);
    unitAmount = readUnitAmount(priceData, `${name}[price_data]`);
    if (priceData.product !== undefined) {
      throw invalidRequest(
        `The local payments fake has no Product objects: send ${name}[price_data][product_data][name] instead of ${name}[price_data][product].`,
        { param: `${name}[price_data][product]` },
      );
    }
    const productData = asParams(priceData.product_data, `${name}[price_data][product_data]`);
    assertKnownParams(productData, PRODUCT_DATA_PARAMS, `${name}[price_data][product_data]`);
    description = requiredString(productData, 'name', `${name}[price_data][product_data][name]`, 250);
  } else if (item.amount !== undefined) {
    // The older inline form: line_items[i][amount], [currency], [name].
    currency = requiredCurrency(item, 'currency', `${name}[currency]`);
    unitAmount = optionalInteger(item, 'amount', `${name}[amount]`) ?? 0;
    description = requiredString(item, 'name', `${name}[name]`, 250);
  } else {
    throw invalidRequest(`Missing required param: ${name}[price_data].`, { param: `${name}[price_data]` });
  }
  const amount = unitAmount * quantity;
  if (!Number.isSafeInteger(amount) || amount > MAX_AMOUNT_MINOR) {
    throw invalidRequest(`${name}: unit amount × quantity is larger than ${MAX_AMOUNT_MINOR}.`, { param: name, code: 'amount_too_large' });
  }
  return {
    id: newId('li'),
    object: 'item',
    amount_subtotal: amount,
    amount_total: amount,
    currency,
    description,
    quantity,
    price: {
      id: newId('price'),
      object: 'price',
      active: false,
      currency,
      livemode: false,
      product: newId('prod', 14),
      type: 'one_time',
      unit_amount: unitAmount,
      unit_amount_decimal: String(unitAmount),
    },
  };
}

function readUnitAmount(priceData: Params, name: string): number {
  const unitAmount = optionalInteger(priceData, 'unit_amount', `${name}[unit_amount]`);
  if (unitAmount !== null) return unitAmount;
  const decimal = optionalString(priceData, 'unit_amount_decimal', `${name}[unit_amount_decimal]`);
  if (decimal === null) throw invalidRequest(`Missing required param: ${name}[unit_amount].`, { param: `${name}[unit_amount]` });
  if (!/^\d{1,12}(\.0+)?$/.test(decimal)) {
    throw invalidRequest(
      `Invalid ${name}[unit_amount_decimal]: ${decimal}. The local payments fake accepts whole amounts in the smallest currency unit only.`,
      { param: `${name}[unit_amount_decimal]` },
    );
  }
  return Number.parseInt(decimal, 10);
}

function paginate<T extends { id: string }>(newestFirst: T[], params: Params, url: string): FakeList<T> {
  const limit = optionalInteger(params, 'limit') ?? 10;
  if (limit < 1 || limit > 100) throw invalidRequest('Invalid limit: must be between 1 and 100.', { param: 'limit' });
  const startingAfter = optionalString(params, 'starting_after');
  let start = 0;
  if (startingAfter !== null) {
    const index = newestFirst.findIndex((item) => item.id === startingAfter);
    if (index < 0) throw invalidRequest(`No such object for starting_after: '${startingAfter}'.`, { param: 'starting_after' });
    start = index + 1;
  }
  const page = newestFirst.slice(start, start + limit);
  return { object: 'list', data: clone(page), has_more: start + limit < newestFirst.length, url };
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

function clone<T>(value: T): T {
  return structuredClone(value);
}

