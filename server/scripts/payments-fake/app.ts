/*
 * Local payments fake
 * ===================
 *
 * A small stand-in for the hosted payments service, for development and tests on this machine.
 * The app keeps using the official `stripe` SDK and only points it here:
 *
 *   new Stripe('sk_test_…', { host: '127.0.0.1', port: 12111, protocol: 'http',
 *                             maxNetworkRetries: 0, telemetry: false })
 *
 * Start it with `npx tsx server/scripts/payments-fake/main.ts` (see main.ts for the environment
 * variables). It binds 127.0.0.1 only, keeps all state in memory and logs one JSON line per request.
 *
 * Service API (form-encoded bodies with bracket notation, `Authorization: Bearer sk_test_…`,
 * errors as `{ error: { type, message, code?, param? } }`):
 *
 *   POST /v1/customers                            email, name, phone, description, metadata
 *   GET  /v1/customers/:id
 *   POST /v1/checkout/sessions                    mode=payment, line_items[i][price_data][currency|unit_amount|
 *                                                 product_data][name]] + [quantity] (or the older
 *                                                 line_items[i][amount|currency|name]), success_url
 *                                                 ({CHECKOUT_SESSION_ID} is replaced), cancel_url, metadata,
 *                                                 client_reference_id, customer | customer_email,
 *                                                 payment_intent_data[metadata|description|receipt_email], expires_at
 *   GET  /v1/checkout/sessions/:id                expand: line_items, payment_intent, customer
 *   GET  /v1/checkout/sessions/:id/line_items
 *   POST /v1/checkout/sessions/:id/expire         emits checkout.session.expired
 *   GET  /v1/payment_intents/:id                  expand: latest_charge, customer
 *   GET  /v1/charges/:id
 *   POST /v1/refunds                              payment_intent | charge, amount (partial allowed, never more
 *                                                 than the unrefunded rest), reason, metadata;
 *                                                 emits refund.created and charge.refunded
 *   GET  /v1/refunds?payment_intent=…  GET /v1/refunds/:id
 *   GET  /v1/events?type=…&limit=…     GET /v1/events/:id
 *
 * `Idempotency-Key` on a POST: the same key with the same parameters replays the first answer
 * (header `Idempotent-Replayed: true`); the same key with other parameters is refused with 400
 * `idempotency_error`. Successful answers and card declines are remembered; validation errors are not.
 *
 * Hosted test payment page: `GET /pay/:sessionId` (the session's `url`). Test cards:
 *   4242 4242 4242 4242  pays: session complete/paid, payment intent and charge succeeded, events
 *                        checkout.session.completed then payment_intent.succeeded, then a 303
 *                        redirect to success_url
 *   4000 0000 0000 0002  declined (generic_decline): event payment_intent.payment_failed, the page
 *                        shows the decline and stays usable
 *   4000 0000 0000 9995  declined (insufficient_funds), same as above
 * The payment intent carries `payment_intent_data[metadata]`, the session its own `metadata`,
 * as on the hosted service. Customers also emit customer.created.
 *
 * Webhooks: each event is POSTed as JSON to the webhook URL with
 * `Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256 of "<t>.<payload>">` (made by the SDK's
 * generateTestHeaderString, so `stripe.webhooks.constructEvent` verifies it). A delivery without
 * a 2xx answer is retried after 0.5 s, 2 s and 8 s, then given up. Events are delivered
 * independently, so their order is not guaranteed (nor is it on the hosted service).
 *
 * Control API for tests and manual checks (no key needed, JSON or form bodies):
 *   GET  /_fake/health                   { ok: true }
 *   GET  /_fake/events                   { data: every event oldest first, deliveries: every attempt }
 *   POST /_fake/redeliver/:eventId       sends that event again (same id: a duplicate delivery);
 *                                        answers { event, attempt } after the first attempt
 *   POST /_fake/sessions/:id/pay         { card } pays without the browser: 200 { outcome: 'paid',
 *                                        session, payment_intent, redirect_url } or 402 card_error
 *   POST /_fake/reset                    forgets all objects, events, deliveries and idempotency keys
 */

import express, { type Express, type NextFunction, type Request, type Response } from 'express';
import Stripe from 'stripe';
import {
  type FakeCheckoutSession,
  type FakeEvent,
  type FakePaymentIntent,
  type FakeRefund,
  type PayOutcome,
  type RequestContext,
  PaymentsLedger,
  newId,
} from './ledger';
import { FakeApiError, type Params, invalidRequest, readExpand, stableStringify } from './params';
import { renderMissingSessionPage, renderPayPage } from './pay-page';
import { type DeliveryAttempt, WebhookDispatcher } from './webhooks';

export type LogLine = Record<string, unknown>;

export interface PaymentsFakeOptions {
  /** Where signed events are POSTed (loopback only); null records events without sending them. */
  webhookUrl: string | null;
  /** The endpoint secret the app verifies with, e.g. `whsec_browseline_local`. */
  webhookSecret: string;
  /** Origin of the fake as the browser reaches it, for checkout `url`s; default: the request's own origin. */
  publicUrl?: string | null;
  /** Waits before webhook retries; the length bounds the retries. Default [500, 2000, 8000]. */
  webhookRetryDelaysMs?: readonly number[];
  /** Per-attempt webhook timeout in milliseconds. Default 5000. */
  webhookTimeoutMs?: number;
  /** Receives one object per request and per webhook attempt; default: a JSON line on stdout. */
  log?: (line: LogLine) => void;
  /** `api_version` written into events; default: the installed SDK's version. */
  apiVersion?: string;
}

/** Handle on a running fake's state, for tests and the control API. */
export interface PaymentsFakeState {
  readonly ledger: PaymentsLedger;
  /** Every event so far, oldest first. */
  events(): FakeEvent[];
  /** Every webhook delivery attempt so far, oldest first. */
  deliveries(): DeliveryAttempt[];
  /** Pays a checkout session with a test card, as the payment page does. */
  pay(sessionId: string, card: string): PayOutcome;
  /** Sends an event again; resolves when that delivery succeeds or gives up. */
  redeliver(eventId: string): Promise<DeliveryAttempt[]>;
  /** Resolves once every webhook delivery started so far has succeeded or given up. */
  idle(): Promise<void>;
  /** Forgets all objects, events, deliveries and idempotency keys. */
  reset(): void;
  /** Cancels pending webhook retries (call before closing the server). */
  close(): void;
}

export interface PaymentsFake {
  app: Express;
  state: PaymentsFakeState;
}

/** A configuration mistake in createPaymentsFake's options or main.ts's environment. */
export class PaymentsFakeConfigError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PaymentsFakeConfigError';
  }
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]']);

/** Checks that a URL is http(s) on this machine, since the fake must not reach any other host. */
export function assertLoopbackUrl(value: string, name: string): URL {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw new PaymentsFakeConfigError(`${name} is not a valid URL: "${value}". Example: http://127.0.0.1:3000/api/webhooks/payments`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    throw new PaymentsFakeConfigError(`${name} must use http or https, not ${url.protocol}`);
  }
  if (!LOOPBACK_HOSTS.has(url.hostname)) {
    throw new PaymentsFakeConfigError(`${name} must point at this machine (127.0.0.1, localhost or [::1]), not ${url.hostname}.`);
  }
  return url;
}

/** Writes one JSON line to stdout. */
export function jsonLineLogger(line: LogLine): void {
  process.stdout.write(`${JSON.stringify({ time: new Date().toISOString(), service: 'payments-fake', ...line })}\n`);
}

/** Builds the fake: an Express app (not listening) and a handle on its in-memory state. */
export function createPaymentsFake(options: PaymentsFakeOptions): PaymentsFake {
  if (options.webhookUrl !== null) assertLoopbackUrl(options.webhookUrl, 'webhookUrl');
  if (options.publicUrl) assertLoopbackUrl(options.publicUrl, 'publicUrl');
  if (!options.webhookSecret || /\s/.test(options.webhookSecret)) {
    throw new PaymentsFakeConfigError('webhookSecret must be a non-empty string without spaces, e.g. whsec_browseline_local.');
  }
  const log = options.log ?? jsonLineLogger;
  const dispatcher = new WebhookDispatcher({
    url: options.webhookUrl,
    secret: options.webhookSecret,
    retryDelaysMs: options.webhookRetryDelaysMs,
    timeoutMs: options.webhookTimeoutMs,
    log,
  });
  const ledger = new PaymentsLedger({
    apiVersion: options.apiVersion ?? Stripe.API_VERSION,
    onEvent: (event) => void dispatcher.dispatch(event),
  });
  const idempotency = new Map<string, { fingerprint: string; statusCode: number; body: unknown }>();

  const state: PaymentsFakeState = {
    ledger,
    events: () => ledger.allEvents(),
    deliveries: () => dispatcher.attempts.map((attempt) => ({ ...attempt })),
    pay: (sessionId, card) => ledger.payCheckoutSession(sessionId, card),
    redeliver: (eventId) => dispatcher.dispatch(ledger.getEvent(eventId), true).done,
    idle: () => dispatcher.idle(),
    reset: () => {
      ledger.reset();
      dispatcher.reset();
      idempotency.clear();
    },
    close: () => dispatcher.cancelPending(),
  };

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended');
  app.use(requestLogger(log));

  // ---- service API ----------------------------------------------------------------------------
  const api = express.Router();
  api.use(authenticate);
  api.use(express.urlencoded({ extended: true, limit: '1mb', parameterLimit: 10000 }));
  api.use(idempotencyGuard(idempotency));

  api.post('/customers', (req, res) => {
    res.json(ledger.createCustomer(body(req), context(res)));
  });
  api.get('/customers/:id', (req, res) => {
    readExpand(query(req), []);
    res.json(ledger.getCustomer(req.params.id));
  });

  api.post('/checkout/sessions', (req, res) => {
    const params = body(req);
    const expand = readExpand(params, SESSION_EXPANDABLE);
    const session = ledger.createCheckoutSession(params, options.publicUrl || originOf(req));
    res.json(expandSession(ledger, session, expand));
  });
  api.get('/checkout/sessions/:id', (req, res) => {
    const expand = readExpand(query(req), SESSION_EXPANDABLE);
    res.json(expandSession(ledger, ledger.getCheckoutSession(req.params.id, context(res)), expand));
  });
  api.get('/checkout/sessions/:id/line_items', (req, res) => {
    res.json(ledger.listCheckoutSessionLineItems(req.params.id));
  });
  api.post('/checkout/sessions/:id/expire', (req, res) => {
    const expand = readExpand(body(req), SESSION_EXPANDABLE);
    res.json(expandSession(ledger, ledger.expireCheckoutSession(req.params.id, context(res)), expand));
  });

  api.get('/payment_intents/:id', (req, res) => {
    const expand = readExpand(query(req), ['latest_charge', 'customer']);
    res.json(expandPaymentIntent(ledger, ledger.getPaymentIntent(req.params.id), expand));
  });
  api.get('/charges/:id', (req, res) => {
    readExpand(query(req), []);
    res.json(ledger.getCharge(req.params.id));
  });

  api.post('/refunds', (req, res) => {
    const params = body(req);
    const expand = readExpand(params, ['charge', 'payment_intent']);
    res.json(expandRefund(ledger, ledger.createRefund(params, context(res)), expand));
  });
  api.get('/refunds', (req, res) => {
    res.json(ledger.listRefunds(query(req)));
  });
  api.get('/refunds/:id', (req, res) => {
    const expand = readExpand(query(req), ['charge', 'payment_intent']);
    res.json(expandRefund(ledger, ledger.getRefund(req.params.id), expand));
  });

  api.get('/events', (req, res) => {
    res.json(ledger.listEvents(query(req)));
  });
  api.get('/events/:id', (req, res) => {
    res.json(ledger.getEvent(req.params.id));
  });

  api.use((req) => {
    throw new FakeApiError(404, {
      type: 'invalid_request_error',
      message:
        `Unrecognized request URL (${req.method}: ${req.baseUrl}${req.path}). The local payments fake implements ` +
        'customers, checkout sessions, payment intents, charges, refunds and events; see the header of server/scripts/payments-fake/app.ts.',
    });
  });
  app.use('/v1', api);

  // ---- hosted test payment page ---------------------------------------------------------------
  app.get('/pay/:sessionId', (req, res) => {
    sendPage(res, ledger, req.params.sessionId, 200);
  });
  app.post('/pay/:sessionId', express.urlencoded({ extended: false, limit: '10kb' }), (req, res) => {
    const sessionId = req.params.sessionId;
    const card = typeof req.body?.card === 'string' ? req.body.card : '';
    let outcome: PayOutcome;
    try {
      outcome = ledger.payCheckoutSession(sessionId, card, context(res));
    } catch (error) {
      if (!(error instanceof FakeApiError)) throw error;
      if (error.statusCode === 404) return sendPage(res, ledger, sessionId, 404);
      if (error.body.code === 'checkout_session_not_open') return sendPage(res, ledger, sessionId, 409);
      return sendPage(res, ledger, sessionId, 400, { errorMessage: error.body.message, cardValue: card });
    }
    if (outcome.outcome === 'paid') return res.redirect(303, outcome.redirectUrl);
    return sendPage(res, ledger, sessionId, 402, { errorMessage: `${outcome.message} Try another test card.`, cardValue: card });
  });

  // ---- control API --------------------------------------------------------------------------
  const control = express.Router();
  control.use(express.json({ limit: '100kb' }), express.urlencoded({ extended: true, limit: '100kb' }));
  control.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  control.get('/events', (_req, res) => {
    res.json({ object: 'list', data: state.events(), deliveries: state.deliveries() });
  });
  control.post('/redeliver/:eventId', async (req, res) => {
    const event = ledger.getEvent(req.params.eventId);
    if (options.webhookUrl === null) {
      throw new FakeApiError(409, {
        type: 'invalid_request_error',
        message: 'Webhook delivery is disabled (no webhook URL was configured), so there is nothing to redeliver to.',
      });
    }
    const attempt = await dispatcher.dispatch(event, true).first;
    res.json({ event: event.id, type: event.type, attempt });
  });
  control.post('/sessions/:id/pay', (req, res) => {
    const card = (req.body as Params | undefined)?.card;
    const outcome = ledger.payCheckoutSession(req.params.id, card, context(res));
    if (outcome.outcome === 'declined') {
      throw new FakeApiError(402, {
        type: 'card_error',
        code: 'card_declined',
        decline_code: outcome.declineCode,
        message: outcome.message,
        payment_intent: outcome.paymentIntent,
      });
    }
    res.json({ outcome: 'paid', session: outcome.session, payment_intent: outcome.paymentIntent, redirect_url: outcome.redirectUrl });
  });
  control.post('/reset', (_req, res) => {
    state.reset();
    res.json({ reset: true });
  });
  app.use('/_fake', control);

  app.use((req, res) => {
    res.status(404).json({
      error: {
        type: 'invalid_request_error',
        message: `Nothing at ${req.method} ${req.path} on the local payments fake. Service paths start with /v1, the payment page is /pay/:sessionId, controls are under /_fake.`,
      },
    });
  });
  app.use(errorHandler(log));

  return { app, state };
}

// ---- middleware ---------------------------------------------------------------------------------

function requestLogger(log: (line: LogLine) => void) {
  return (req: Request, res: Response, next: NextFunction): void => {
    const startedNs = process.hrtime.bigint();
    res.locals.requestId = newId('req', 14);
    res.set('Request-Id', res.locals.requestId as string);
    res.on('finish', () => {
      log({
        msg: 'request',
        method: req.method,
        path: req.originalUrl.split('?')[0],
        status: res.statusCode,
        durationMs: Number((process.hrtime.bigint() - startedNs) / 1000n) / 1000,
        requestId: res.locals.requestId,
        idempotencyKey: req.get('Idempotency-Key') ?? null,
        idempotentReplayed: res.locals.idempotentReplayed === true,
      });
    });
    next();
  };
}

function authenticate(req: Request, res: Response, next: NextFunction): void {
  const header = req.get('Authorization');
  if (!header) {
    throw authenticationError(
      "You did not provide an API key. Send it in the Authorization header using Bearer auth (e.g. 'Authorization: Bearer sk_test_…').",
    );
  }
  let key: string | null = null;
  const bearer = /^Bearer\s+(\S+)$/i.exec(header);
  const basic = /^Basic\s+(\S+)$/i.exec(header);
  if (bearer) key = bearer[1];
  else if (basic) key = Buffer.from(basic[1], 'base64').toString('utf8').split(':')[0] || null;
  if (!key) {
    throw authenticationError("Invalid Authorization header. Use 'Authorization: Bearer sk_test_…'.");
  }
  if (!/^sk_test_\w+$/.test(key)) {
    throw authenticationError(
      `Invalid API Key provided: ${maskKey(key)}. The local payments fake accepts secret test-mode keys only (sk_test_…).`,
    );
  }
  res.locals.apiKey = key;
  next();
}

function authenticationError(message: string): FakeApiError {
  return new FakeApiError(401, { type: 'invalid_request_error', message });
}

function maskKey(key: string): string {
  return key.length <= 12 ? `${key.slice(0, 3)}****` : `${key.slice(0, 8)}****${key.slice(-4)}`;
}

// The hosted service keeps keys for 24 hours; a local fake only needs a bound.
const MAX_IDEMPOTENCY_KEYS = 10_000;

type IdempotencyStore = Map<string, { fingerprint: string; statusCode: number; body: unknown }>;

function idempotencyGuard(store: IdempotencyStore) {
  return (req: Request, res: Response, next: NextFunction): void => {
    const key = req.method === 'POST' ? req.get('Idempotency-Key') : undefined;
    if (!key) return next();
    if (key.length > 255) {
      throw invalidRequest('Invalid Idempotency-Key: it must be at most 255 characters long.', { param: 'Idempotency-Key' });
    }
    const scopedKey = `${res.locals.apiKey as string}\u0000${key}`;
    const fingerprint = `${req.method} ${req.baseUrl}${req.path} ${stableStringify(req.body ?? {})}`;
    const saved = store.get(scopedKey);
    if (saved) {
      if (saved.fingerprint !== fingerprint) {
        throw new FakeApiError(400, {
          type: 'idempotency_error',
          message:
            'Keys for idempotent requests can only be used with the same parameters they were first used with. ' +
            `Try using a key other than '${key}' if you meant to execute a different request.`,
        });
      }
      res.locals.idempotentReplayed = true;
      res.set('Idempotent-Replayed', 'true');
      res.status(saved.statusCode).json(saved.body);
      return;
    }
    const sendJson = res.json.bind(res);
    res.json = (payload: unknown) => {
      if (res.statusCode < 400 || res.statusCode === 402) {
        store.set(scopedKey, { fingerprint, statusCode: res.statusCode, body: payload });
        // The SDK keys every POST, so bound the memory: forget the oldest keys first.
        if (store.size > MAX_IDEMPOTENCY_KEYS) store.delete(store.keys().next().value as string);
      }
      return sendJson(payload);
    };
    next();
  };
}

function errorHandler(log: (line: LogLine) => void) {
  return (error: unknown, _req: Request, res: Response, next: NextFunction): void => {
    if (res.headersSent) return next(error);
    if (error instanceof FakeApiError) {
      if (error.statusCode === 401) res.set('WWW-Authenticate', 'Bearer realm="payments-fake"');
      res.status(error.statusCode).json({ error: error.body });
      return;
    }
    const status = (error as { status?: unknown }).status;
    if (typeof status === 'number' && status >= 400 && status < 500) {
      // body-parser: malformed body, too large, too many parameters.
      const message = error instanceof Error ? error.message : 'Malformed request.';
      res.status(status).json({ error: { type: 'invalid_request_error', message: `Could not read the request body: ${message}` } });
      return;
    }
    log({ msg: 'internal error', error: error instanceof Error ? (error.stack ?? error.message) : String(error) });
    res.status(500).json({
      error: { type: 'api_error', message: 'The local payments fake hit an internal error; its log has the details.' },
    });
  };
}

// ---- helpers ------------------------------------------------------------------------------------

const SESSION_EXPANDABLE = ['line_items', 'payment_intent', 'customer'] as const;

function body(req: Request): Params {
  return (req.body as Params | undefined) ?? {};
}

function query(req: Request): Params {
  return req.query as Params;
}

function context(res: Response): RequestContext {
  return { requestId: (res.locals.requestId as string | undefined) ?? null, idempotencyKey: res.req.get('Idempotency-Key') ?? null };
}

function originOf(req: Request): string {
  return `${req.protocol}://${req.get('host') ?? '127.0.0.1'}`;
}

function expandSession(ledger: PaymentsLedger, session: FakeCheckoutSession, expand: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = { ...session };
  if (expand.includes('line_items')) out.line_items = ledger.listCheckoutSessionLineItems(session.id);
  if (expand.includes('payment_intent') && session.payment_intent) out.payment_intent = ledger.getPaymentIntent(session.payment_intent);
  if (expand.includes('customer') && session.customer) out.customer = ledger.getCustomer(session.customer);
  return out;
}

function expandPaymentIntent(ledger: PaymentsLedger, paymentIntent: FakePaymentIntent, expand: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = { ...paymentIntent };
  if (expand.includes('latest_charge') && paymentIntent.latest_charge) out.latest_charge = ledger.getCharge(paymentIntent.latest_charge);
  if (expand.includes('customer') && paymentIntent.customer) out.customer = ledger.getCustomer(paymentIntent.customer);
  return out;
}

function expandRefund(ledger: PaymentsLedger, refund: FakeRefund, expand: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = { ...refund };
  if (expand.includes('charge')) out.charge = ledger.getCharge(refund.charge);
  if (expand.includes('payment_intent')) out.payment_intent = ledger.getPaymentIntent(refund.payment_intent);
  return out;
}

function sendPage(
  res: Response,
  ledger: PaymentsLedger,
  sessionId: string,
  status: number,
  extra: { errorMessage?: string; cardValue?: string } = {},
): void {
  res.set('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; frame-ancestors 'none'");
  res.set('Cache-Control', 'no-store');
  res.set('X-Content-Type-Options', 'nosniff');
  res.type('html');
  let session: FakeCheckoutSession;
  try {
    session = ledger.getCheckoutSession(sessionId);
  } catch (error) {
    if (error instanceof FakeApiError && error.statusCode === 404) {
      res.status(404).send(renderMissingSessionPage(sessionId));
      return;
    }
    throw error;
  }
  const lineItems = ledger.listCheckoutSessionLineItems(sessionId).data;
  res.status(status).send(renderPayPage({ session, lineItems, ...extra }));
}
