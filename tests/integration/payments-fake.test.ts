// The local payments fake, driven by the real `stripe` SDK over loopback HTTP, with a small
// webhook receiver that verifies every delivery with stripe.webhooks.constructEvent.
// No database: the fake keeps its state in memory.

import { createHmac } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  type LogLine,
  type PaymentsFake,
  PaymentsFakeConfigError,
  createPaymentsFake,
} from '../../server/scripts/payments-fake/app';
import { readPaymentsFakeEnv } from '../../server/scripts/payments-fake/main';

const WEBHOOK_SECRET = 'whsec_browseline_test';
// Test card numbers as published in the payments service's testing docs (from memory).
const CARD_PAYS = '4242 4242 4242 4242';
const CARD_DECLINED = '4000 0000 0000 0002';

interface Received {
  event: Stripe.Event;
  rawBody: string;
  signature: string;
}

/** A webhook endpoint that verifies signatures like the app will, and lets tests await deliveries. */
function createWebhookReceiver(stripe: Stripe, secret: string) {
  const received: Received[] = [];
  const rejected: string[] = [];
  const waiters: {
    predicate: (r: Received) => boolean;
    count: number;
    resolve: (r: Received[]) => void;
    reject: (error: Error) => void;
  }[] = [];
  let refuseNext = 0;

  const settle = () => {
    for (const waiter of [...waiters]) {
      const matches = received.filter(waiter.predicate);
      if (matches.length >= waiter.count) {
        waiters.splice(waiters.indexOf(waiter), 1);
        waiter.resolve(matches);
      }
    }
  };

  const app = express();
  app.post('/hooks/payments', express.raw({ type: 'application/json' }), (req, res) => {
    if (refuseNext > 0) {
      refuseNext -= 1;
      res.status(503).send('not now');
      return;
    }
    const rawBody = (req.body as Buffer).toString('utf8');
    const signature = req.get('Stripe-Signature') ?? '';
    let event: Stripe.Event;
    try {
      event = stripe.webhooks.constructEvent(req.body as Buffer, signature, secret);
    } catch (error) {
      rejected.push(String(error));
      res.status(400).send('bad signature');
      // Fail the waiting test at once instead of letting it run into the timeout.
      for (const waiter of waiters.splice(0)) waiter.reject(new Error(`webhook signature rejected: ${String(error)}`));
      return;
    }
    received.push({ event, rawBody, signature });
    res.json({ received: true });
    settle();
  });

  return {
    app,
    received,
    rejected,
    /** Answers 503 to the next `count` deliveries. */
    refuse(count: number) {
      refuseNext = count;
    },
    /** Resolves with the matching deliveries once at least `count` have arrived. */
    waitFor(predicate: (r: Received) => boolean, count = 1): Promise<Received[]> {
      return new Promise((resolve, reject) => {
        waiters.push({ predicate, count, resolve, reject });
        settle();
      });
    },
  };
}

function listen(app: express.Express): Promise<{ server: Server; url: string; port: number }> {
  return new Promise((resolve, reject) => {
    const server = app.listen(0, '127.0.0.1');
    server.once('listening', () => {
      const { port } = server.address() as AddressInfo;
      resolve({ server, port, url: `http://127.0.0.1:${port}` });
    });
    server.once('error', reject);
  });
}

function close(server: Server): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });
}

const isEventFor = (type: string, objectId: string) => (r: Received) =>
  r.event.type === type && (r.event.data.object as { id?: string }).id === objectId;

describe('payments fake', () => {
  let fake: PaymentsFake;
  let fakeServer: Server;
  let fakeUrl: string;
  let receiverServer: Server;
  let stripe: Stripe;
  let receiver: ReturnType<typeof createWebhookReceiver>;
  const logLines: LogLine[] = [];

  beforeAll(async () => {
    // The SDK instance that only verifies signatures needs no server.
    receiver = createWebhookReceiver(new Stripe('sk_test_verifier', { telemetry: false }), WEBHOOK_SECRET);
    const receiverListening = await listen(receiver.app);
    receiverServer = receiverListening.server;
    fake = createPaymentsFake({
      webhookUrl: `${receiverListening.url}/hooks/payments`,
      webhookSecret: WEBHOOK_SECRET,
      webhookRetryDelaysMs: [5, 10, 20],
      log: (line) => logLines.push(line),
    });
    const fakeListening = await listen(fake.app);
    fakeServer = fakeListening.server;
    fakeUrl = fakeListening.url;
    stripe = new Stripe('sk_test_local', {
      host: '127.0.0.1',
      port: fakeListening.port,
      protocol: 'http',
      maxNetworkRetries: 0,
      telemetry: false,
    });
  });

  afterAll(async () => {
    await fake.state.idle();
    fake.state.close();
    await close(fakeServer);
    await close(receiverServer);
  });

  /** Two plots at $15.00 and a $480.00 deposit: 2 × 1500 + 48000 = 51000 cents (arithmetic, no source). */
  function createInvoiceSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}, options?: Stripe.RequestOptions) {
    return stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          { price_data: { currency: 'usd', unit_amount: 1500, product_data: { name: 'Clover food plot' } }, quantity: 2 },
          { price_data: { currency: 'usd', unit_amount: 48000, product_data: { name: 'Spring work deposit' } }, quantity: 1 },
        ],
        metadata: { invoiceId: 'inv_demo_7', orgId: 'org_demo_2' },
        payment_intent_data: { metadata: { invoiceId: 'inv_demo_7' } },
        client_reference_id: 'inv_demo_7',
        customer_email: 'landowner@example.test',
        success_url: 'http://127.0.0.1:3000/invoices/paid?session={CHECKOUT_SESSION_ID}',
        cancel_url: 'http://127.0.0.1:3000/invoices/inv_demo_7',
        ...extra,
      },
      options,
    );
  }

  async function payOnPage(sessionId: string, card: string): Promise<Response> {
    return fetch(`${fakeUrl}/pay/${sessionId}`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ card }).toString(),
      redirect: 'manual',
    });
  }

  async function payByControl(sessionId: string, card: string): Promise<Response> {
    return fetch(`${fakeUrl}/_fake/sessions/${sessionId}/pay`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ card }),
    });
  }

  it('creates a checkout session whose url is the fake test payment page showing the total', async () => {
    const session = await createInvoiceSession();

    expect(session.id).toMatch(/^cs_test_/);
    expect(session.status).toBe('open');
    expect(session.payment_status).toBe('unpaid');
    expect(session.amount_total).toBe(51000); // 2 × 1500 + 48000, arithmetic (no source)
    expect(session.url).toBe(`${fakeUrl}/pay/${session.id}`);

    const page = await fetch(session.url as string);
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(page.headers.get('content-type')).toMatch(/text\/html/);
    expect(html).toContain('TEST payment page of the local payments fake');
    expect(html).toContain('$510.00'); // 51000 cents (arithmetic, no source)
    expect(html).toMatch(/<input[^>]+name="card"/);
    expect(html).not.toMatch(/<(script|link|img)\b/); // no external assets
  });

  it('paying with 4242… redirects to success_url and sends a verifiable checkout.session.completed', async () => {
    const session = await createInvoiceSession();
    const completed = receiver.waitFor(isEventFor('checkout.session.completed', session.id));

    const response = await payOnPage(session.id, CARD_PAYS);
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe(`http://127.0.0.1:3000/invoices/paid?session=${session.id}`);

    const [delivery] = await completed;
    const object = delivery.event.data.object as Stripe.Checkout.Session;
    expect(delivery.event.object).toBe('event');
    expect(delivery.event.livemode).toBe(false);
    expect(delivery.event.id).toMatch(/^evt_/);
    expect(object.metadata).toEqual({ invoiceId: 'inv_demo_7', orgId: 'org_demo_2' });
    expect(object.client_reference_id).toBe('inv_demo_7');
    expect(object.amount_total).toBe(51000); // sum of the line items, arithmetic (no source)
    expect(object.payment_status).toBe('paid');
    expect(object.status).toBe('complete');

    // Independent check of the signature scheme (the service's webhook docs, from memory):
    // header "t=<unix>,v1=<hex HMAC-SHA256 of `${t}.${raw body}` keyed with the endpoint secret>".
    const match = /^t=(\d+),v1=([0-9a-f]{64})$/.exec(delivery.signature);
    expect(match).not.toBeNull();
    const expected = createHmac('sha256', WEBHOOK_SECRET).update(`${match![1]}.${delivery.rawBody}`).digest('hex');
    expect(match![2]).toBe(expected);
    expect(() => stripe.webhooks.constructEvent(delivery.rawBody, delivery.signature, 'whsec_some_other_secret')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );

    const paymentIntentId = object.payment_intent as string;
    const [succeeded] = await receiver.waitFor(isEventFor('payment_intent.succeeded', paymentIntentId));
    expect((succeeded.event.data.object as Stripe.PaymentIntent).metadata).toEqual({ invoiceId: 'inv_demo_7' });

    const paymentIntent = await stripe.paymentIntents.retrieve(paymentIntentId);
    expect(paymentIntent.status).toBe('succeeded');
    expect(paymentIntent.amount_received).toBe(51000);
    const again = await stripe.checkout.sessions.retrieve(session.id, { expand: ['line_items'] });
    expect(again.status).toBe('complete');
    expect(again.url).toBeNull();
    expect(again.line_items?.data.map((item) => item.amount_total)).toEqual([3000, 48000]); // 2 × 1500; 1 × 48000
    expect(receiver.rejected).toEqual([]);
  });

  it('a declined card (4000…0002) sends payment_intent.payment_failed, no completed event, and the page stays usable', async () => {
    const session = await createInvoiceSession();

    const declined = await payByControl(session.id, CARD_DECLINED);
    expect(declined.status).toBe(402);
    const declinedBody = (await declined.json()) as { error: { type: string; decline_code: string; payment_intent: { id: string } } };
    expect(declinedBody.error.type).toBe('card_error');
    expect(declinedBody.error.decline_code).toBe('generic_decline');
    const paymentIntentId = declinedBody.error.payment_intent.id;

    const [failed] = await receiver.waitFor(isEventFor('payment_intent.payment_failed', paymentIntentId));
    expect((failed.event.data.object as Stripe.PaymentIntent).last_payment_error?.decline_code).toBe('generic_decline');
    expect(fake.state.events().filter((e) => e.type === 'checkout.session.completed' && e.data.object.id === session.id)).toEqual([]);
    const stillOpen = await stripe.checkout.sessions.retrieve(session.id);
    expect(stillOpen.status).toBe('open');
    expect(stillOpen.payment_status).toBe('unpaid');

    const pageDecline = await payOnPage(session.id, CARD_DECLINED);
    const html = await pageDecline.text();
    expect(pageDecline.status).toBe(402);
    expect(html).toContain('Your card was declined.');
    expect(html).toMatch(/<form method="post" action="\/pay\//);

    const unknownCard = await payOnPage(session.id, '1234 5678 9012 3456');
    expect(unknownCard.status).toBe(400);
    expect(await unknownCard.text()).toContain('is not a test card');

    const completed = receiver.waitFor(isEventFor('checkout.session.completed', session.id));
    expect((await payOnPage(session.id, CARD_PAYS)).status).toBe(303);
    const [delivery] = await completed;
    expect((delivery.event.data.object as Stripe.Checkout.Session).payment_intent).toBe(paymentIntentId);
  });

  it('replays the first answer for a repeated idempotency key and refuses the key with other parameters', async () => {
    const key = `invoice-inv_demo_7-${Date.now()}`;
    const first = await createInvoiceSession({}, { idempotencyKey: key });
    const replay = await createInvoiceSession({}, { idempotencyKey: key });
    expect(replay.id).toBe(first.id);
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');

    const other = createInvoiceSession({ client_reference_id: 'inv_demo_8' }, { idempotencyKey: key });
    await expect(other).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);

    const fresh = await createInvoiceSession({}, { idempotencyKey: `${key}-b` });
    expect(fresh.id).not.toBe(first.id);
  });

  it('answers 401 without a secret test key, which the SDK maps to StripeAuthenticationError', async () => {
    const { port } = fakeServer.address() as AddressInfo;
    const config = { host: '127.0.0.1', port, protocol: 'http' as const, maxNetworkRetries: 0, telemetry: false };
    // An empty key with a no-op authenticator makes the SDK send no Authorization header at all.
    const keyless = new Stripe('', { ...config, authenticator: async () => undefined });
    const liveKey = new Stripe('sk_live_not_for_the_fake', config);

    const missing = keyless.customers.create({ email: 'a@example.test' });
    await expect(missing).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    await expect(missing).rejects.toMatchObject({ statusCode: 401, type: 'StripeAuthenticationError' });
    await expect(liveKey.customers.create({ email: 'a@example.test' })).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);

    const raw = await fetch(`${fakeUrl}/v1/customers`, { method: 'POST' });
    expect(raw.status).toBe(401);
    const body = (await raw.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toMatch(/did not provide an API key/);
  });

  it('refunds part, then the rest, sending charge.refunded each time, and refuses to refund more', async () => {
    const session = await createInvoiceSession();
    const paid = (await (await payByControl(session.id, CARD_PAYS)).json()) as { payment_intent: { id: string } };
    const paymentIntentId = paid.payment_intent.id;

    const partial = await stripe.refunds.create({ payment_intent: paymentIntentId, amount: 2000 });
    expect(partial.amount).toBe(2000);
    expect(partial.status).toBe('succeeded');
    expect(partial.payment_intent).toBe(paymentIntentId);
    const [firstRefunded] = await receiver.waitFor(
      (r) => r.event.type === 'charge.refunded' && (r.event.data.object as Stripe.Charge).payment_intent === paymentIntentId,
    );
    expect((firstRefunded.event.data.object as Stripe.Charge).amount_refunded).toBe(2000);
    expect((firstRefunded.event.data.object as Stripe.Charge).refunded).toBe(false);

    const tooMuch = stripe.refunds.create({ payment_intent: paymentIntentId, amount: 49001 }); // 51000 − 2000 = 49000 left
    await expect(tooMuch).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(tooMuch).rejects.toMatchObject({ code: 'amount_too_large', param: 'amount' });

    const rest = await stripe.refunds.create({ payment_intent: paymentIntentId });
    expect(rest.amount).toBe(49000); // 51000 − 2000, arithmetic (no source)
    const refundedEvents = await receiver.waitFor(
      (r) => r.event.type === 'charge.refunded' && (r.event.data.object as Stripe.Charge).payment_intent === paymentIntentId,
      2,
    );
    const fully = refundedEvents.find((r) => (r.event.data.object as Stripe.Charge).amount_refunded === 51000);
    expect((fully?.event.data.object as Stripe.Charge | undefined)?.refunded).toBe(true);
    expect((await stripe.refunds.retrieve(partial.id)).amount).toBe(2000);

    const again = stripe.refunds.create({ payment_intent: paymentIntentId, amount: 1 });
    await expect(again).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(again).rejects.toMatchObject({ code: 'charge_already_refunded' });
  });

  it('refuses to refund an unpaid session and names the missing object', async () => {
    const missing = stripe.refunds.create({ payment_intent: 'pi_does_not_exist' });
    await expect(missing).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing', param: 'payment_intent' });

    const session = await createInvoiceSession();
    const declined = (await (await payByControl(session.id, CARD_DECLINED)).json()) as { error: { payment_intent: { id: string } } };
    const unpaid = stripe.refunds.create({ payment_intent: declined.error.payment_intent.id });
    await expect(unpaid).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(unpaid).rejects.toMatchObject({ code: 'charge_not_refundable' });
  });

  it('redelivers an event with the same id, for duplicate-delivery handling', async () => {
    const session = await createInvoiceSession();
    const completed = receiver.waitFor(isEventFor('checkout.session.completed', session.id));
    await payByControl(session.id, CARD_PAYS);
    const [original] = await completed;

    const response = await fetch(`${fakeUrl}/_fake/redeliver/${original.event.id}`, { method: 'POST' });
    expect(response.status).toBe(200);
    const answer = (await response.json()) as { event: string; attempt: { ok: boolean; redelivery: boolean } };
    expect(answer.event).toBe(original.event.id);
    expect(answer.attempt).toMatchObject({ ok: true, redelivery: true });

    const both = await receiver.waitFor((r) => r.event.id === original.event.id, 2);
    expect(both.map((r) => r.event.id)).toEqual([original.event.id, original.event.id]);
    expect(both[1].event).toEqual(original.event);

    const unknown = await fetch(`${fakeUrl}/_fake/redeliver/evt_missing`, { method: 'POST' });
    expect(unknown.status).toBe(404);
  });

  it('retries a delivery the receiver refused, with the same event id', async () => {
    await fake.state.idle(); // earlier tests' deliveries must not take the refusal
    receiver.refuse(1);
    const customer = await stripe.customers.create({ email: 'retry@example.test', metadata: { orgId: 'org_demo_2' } });
    const [delivery] = await receiver.waitFor(isEventFor('customer.created', customer.id));
    await fake.state.idle();

    const attempts = fake.state.deliveries().filter((a) => a.eventId === delivery.event.id);
    expect(attempts.map((a) => [a.attempt, a.status, a.ok])).toEqual([
      [1, 503, false],
      [2, 200, true],
    ]);
    expect((await stripe.customers.retrieve(customer.id)) as Stripe.Customer).toMatchObject({ email: 'retry@example.test' });
  });

  it('expires an open session, sends checkout.session.expired, and refuses to pay it', async () => {
    const session = await createInvoiceSession();
    const expiredEvent = receiver.waitFor(isEventFor('checkout.session.expired', session.id));
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired.status).toBe('expired');
    expect(expired.url).toBeNull();
    await expiredEvent;

    const pay = await payByControl(session.id, CARD_PAYS);
    expect(pay.status).toBe(400);
    expect(((await pay.json()) as { error: { code: string } }).error.code).toBe('checkout_session_not_open');
    const page = await fetch(`${fakeUrl}/pay/${session.id}`);
    expect(await page.text()).toContain('This checkout has expired');
    await expect(stripe.checkout.sessions.expire(session.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });

  it('refuses bad checkout parameters with a message naming the parameter', async () => {
    const noItems = stripe.checkout.sessions.create({ mode: 'payment', success_url: 'http://127.0.0.1:3000/ok' });
    await expect(noItems).rejects.toMatchObject({ type: 'StripeInvalidRequestError', param: 'line_items' });

    const noName = stripe.checkout.sessions.create({
      mode: 'payment',
      success_url: 'http://127.0.0.1:3000/ok',
      line_items: [{ price_data: { currency: 'usd', unit_amount: 5000 } as Stripe.Checkout.SessionCreateParams.LineItem.PriceData, quantity: 1 }],
    });
    await expect(noName).rejects.toMatchObject({ param: 'line_items[0][price_data][product_data][name]' });

    const mixed = createInvoiceSession({
      line_items: [
        { price_data: { currency: 'usd', unit_amount: 5000, product_data: { name: 'A' } }, quantity: 1 },
        { price_data: { currency: 'eur', unit_amount: 5000, product_data: { name: 'B' } }, quantity: 1 },
      ],
    });
    await expect(mixed).rejects.toThrow(/same currency/);

    // The service's minimum charge for usd is $0.50 (its docs on minimum amounts, from memory).
    const tooSmall = createInvoiceSession({
      line_items: [{ price_data: { currency: 'usd', unit_amount: 49, product_data: { name: 'Tiny' } }, quantity: 1 }],
    });
    await expect(tooSmall).rejects.toMatchObject({ code: 'amount_too_small' });

    await expect(stripe.checkout.sessions.retrieve('cs_test_missing')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('lists and retrieves events through the SDK', async () => {
    const session = await createInvoiceSession();
    await payByControl(session.id, CARD_PAYS);
    const event = fake.state.events().find((e) => e.type === 'checkout.session.completed' && e.data.object.id === session.id);
    expect(event).toBeDefined();

    const retrieved = await stripe.events.retrieve(event!.id);
    expect(retrieved.type).toBe('checkout.session.completed');
    expect((retrieved.data.object as Stripe.Checkout.Session).id).toBe(session.id);
    const listed = await stripe.events.list({ type: 'checkout.session.completed', limit: 100 });
    expect(listed.data.map((e) => e.id)).toContain(event!.id);
    expect(listed.data.every((e) => e.type === 'checkout.session.completed')).toBe(true);
  });

  it('logs one JSON line per request without the API key', async () => {
    const before = logLines.length;
    await stripe.customers.create({ email: 'log@example.test' });
    const requestLines = logLines.slice(before).filter((line) => line.msg === 'request');
    expect(requestLines).toHaveLength(1);
    expect(requestLines[0]).toMatchObject({ method: 'POST', path: '/v1/customers', status: 200 });
    expect(JSON.stringify(requestLines[0])).not.toContain('sk_test_local');
  });

  it('refuses a webhook URL off this machine and a bad port, with an actionable message', () => {
    expect(() => createPaymentsFake({ webhookUrl: 'https://example.com/hook', webhookSecret: 'whsec_x', log: () => undefined })).toThrow(
      PaymentsFakeConfigError,
    );
    expect(() => readPaymentsFakeEnv({ PAYMENTS_FAKE_PORT: 'abc' })).toThrow(/PAYMENTS_FAKE_PORT must be a whole number/);
    // Defaults agreed for the project's local setup (task brief), no outside source.
    expect(readPaymentsFakeEnv({})).toMatchObject({
      port: 12111,
      webhookUrl: 'http://127.0.0.1:3000/api/webhooks/payments',
      webhookSecret: 'whsec_browseline_local',
    });
  });

  it('reset forgets sessions and events', async () => {
    await fake.state.idle();
    const session = await createInvoiceSession();
    const reset = await fetch(`${fakeUrl}/_fake/reset`, { method: 'POST' });
    expect(reset.status).toBe(200);
    expect(fake.state.events()).toEqual([]);
    await expect(stripe.checkout.sessions.retrieve(session.id)).rejects.toMatchObject({ statusCode: 404 });
  });
});
