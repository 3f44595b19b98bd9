// Invoices and payments end to end over HTTP: a real PostgreSQL, the app listening on loopback for
// webhooks, and the local payments fake driven by the app's real `stripe` SDK calls. A small proxy
// between the app and the fake can drop answers, to show that a retry after an outage charges once.
import crypto from 'node:crypto';
import { InvoiceDtoSchema, InvoiceRowDtoSchema } from '../../shared/schemas/invoice';
import { z } from 'zod';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { execFileSync } from 'node:child_process';
import Stripe from 'stripe';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, testApp, type Agent } from '../support/test-app';
import { makeClient, makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { Invoice, InvoicePayment, OutboxMessage, Practice, Proposal, Task } from '../../server/models';
import { sequelize } from '../../server/db/sequelize';
import { config } from '../../server/config';
import { DeskSummarySchema } from '../../shared/schemas/desk';
import { createPaymentsFake, type LogLine, type PaymentsFake } from '../../server/scripts/payments-fake/app';
import { sendOverdueReminders } from '../../server/commands/reminder-sender';
import { addDays } from '../../shared/domain/planting-windows';
import type { InvoiceDto } from '../../shared/schemas/invoice';

// Test card numbers as published in the payments service's testing docs (from memory).
const CARD_PAYS = '4242 4242 4242 4242';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let owner: Agent;
let client: Agent;
let crew: Agent;
let proposal: Proposal;
let fake: PaymentsFake;
let fakeServer: http.Server;
let fakePort: number;
let appServer: http.Server;
let proxy: http.Server;
let proxyMode: 'pass' | 'drop-answer' = 'pass';
const fakeLog: LogLine[] = [];
const verifier = new Stripe('sk_test_verifier', { telemetry: false });

const send = (agent: Agent, method: 'post' | 'patch' | 'delete', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

function listen(server: http.Server, port = 0): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve((server.address() as AddressInfo).port));
  });
}
function close(server: http.Server): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });
}

/** Forwards to the fake; in 'drop-answer' mode the fake does the work but the app never hears back. */
function makeProxy(): http.Server {
  return http.createServer((req, res) => {
    const upstream = http.request({ host: '127.0.0.1', port: fakePort, path: req.url, method: req.method, headers: req.headers }, (answer) => {
      if (proxyMode === 'drop-answer') {
        answer.resume();
        answer.on('end', () => req.socket.destroy());
        return;
      }
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    upstream.on('error', () => req.socket.destroy());
    req.pipe(upstream);
  });
}

async function getInvoice(agent: Agent, id: number): Promise<InvoiceDto> {
  const res = await agent.get(`/api/invoices/${id}`);
  expect(res.status).toBe(200);
  return InvoiceDtoSchema.parse(res.body.data);
}

/** Opens the payment page as the client and pays it on the fake with the test card; waits for every webhook. */
async function pay(invoiceId: number, amountCents?: number): Promise<{ sessionId: string; url: string }> {
  const res = await send(client, 'post', `/api/invoices/${invoiceId}/checkout`, amountCents ? { amountCents } : {});
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const url: string = res.body.data.url;
  const sessionId = url.split('/pay/')[1];
  const outcome = fake.state.pay(sessionId, CARD_PAYS);
  expect(outcome.outcome).toBe('paid');
  await fake.state.idle();
  return { sessionId, url };
}

const eventsOf = (type: string, pred: (o: Record<string, unknown>) => boolean) => fake.state.events().filter((e) => e.type === type && pred(e.data.object as unknown as Record<string, unknown>));

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);

  appServer = http.createServer(testApp());
  const appPort = await listen(appServer);
  fake = createPaymentsFake({ webhookUrl: `http://127.0.0.1:${appPort}/api/webhooks/payments`, webhookSecret: config.payments.webhookSecret, webhookRetryDelaysMs: [5, 10, 20], log: (l) => fakeLog.push(l) });
  fakeServer = http.createServer(fake.app);
  fakePort = await listen(fakeServer);
  proxy = makeProxy();
  const proxyPort = await listen(proxy);
  (config.payments as { apiBase: string }).apiBase = `http://127.0.0.1:${proxyPort}`;

  const propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  const plot = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'food-plot', name: 'North plot', geometry: rectangle(-90.938, 43.2655, 120, 80) });
  const brassica = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'fall-brassica-plot' } }))!.id;
  expect((await send(consultant, 'post', `/api/units/${plot.body.data.id}/prescriptions`, { practiceId: brassica })).status).toBe(201);
  const drafted = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { taxRatePct: 5.5, depositPct: 30 });
  expect(drafted.status).toBe(201);
  expect((await send(consultant, 'post', `/api/proposals/${drafted.body.data.id}/send`)).status).toBe(200);
  expect((await send(client, 'post', `/api/proposals/${drafted.body.data.id}/approve`, { signedName: 'Dana Landowner' })).status).toBe(200);
  proposal = (await Proposal.findByPk(drafted.body.data.id))!;
});

afterAll(async () => {
  await fake.state.idle();
  fake.state.close();
  await Promise.all([close(proxy), close(appServer), fakeServer.listening ? close(fakeServer) : Promise.resolve()]);
});

describe('deposit invoice', () => {
  let depositId: number;

  it('is on the Desk after the approval: the draft deposit invoice, waiting to be sent', async () => {
    const desk = DeskSummarySchema.parse((await consultant.get('/api/desk').expect(200)).body.data);
    const draft = desk.depositDrafts.find((d) => d.proposalId === proposal.id);
    expect(draft).toMatchObject({ proposalNumber: proposal.number, totalCents: proposal.depositCents });
    expect(draft!.approvedAt).not.toBeNull();
  });

  it('is drafted in the approval’s transaction, numbered per firm, for the proposal’s deposit to the cent', async () => {
    const res = await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'deposit' });
    expect(res.status).toBe(200); // the draft made at approval, not a new one
    const inv: InvoiceDto = InvoiceDtoSchema.parse(res.body.data);
    depositId = inv.id;
    expect(inv.status).toBe('draft');
    expect(inv.number).toMatch(/^INV-\d{4}-0001$/); // the firm's first invoice
    expect(inv.totalCents).toBe(proposal.depositCents);
    expect(inv.balanceCents).toBe(proposal.depositCents);
    expect(await Invoice.count({ where: { proposalId: proposal.id } })).toBe(1);
  });

  it('hides drafts from the client and every invoice from the crew', async () => {
    expect((await client.get(`/api/invoices/${depositId}`)).status).toBe(404);
    expect((await client.get('/api/invoices')).body.data).toEqual([]);
    expect((await crew.get('/api/invoices')).status).toBe(403);
    expect((await crew.get(`/api/invoices/${depositId}`)).status).toBe(403);
    expect((await send(client, 'post', `/api/invoices/${depositId}/checkout`)).status).toBe(404);
  });

  it('is issued by sending: open, due by its terms, e-mailed with its PDF through the outbox', async () => {
    const res = await send(consultant, 'post', `/api/invoices/${depositId}/send`);
    expect(res.status).toBe(200);
    expect(res.body.data.status).toBe('open');
    expect(res.body.data.dueOn).toBe(addDays(res.body.data.issuedOn, 30)); // net 30, the proposal's standard terms
    const mail = await OutboxMessage.findOne({ where: { kind: 'invoice-sent', toAddress: ctx.users.client.email } });
    expect(mail?.attachments[0]?.filename).toBe(`${res.body.data.number}.pdf`);
    expect((await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'deposit' })).status).toBe(409);
    const pdf = await consultant.get(`/api/invoices/${depositId}/pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf.body as Buffer }).toString();
    expect(text).toContain(res.body.data.number);
    expect(text).toContain('Deposit invoice');
  });

  it('asks the payments service for exactly the balance, and records one payment per webhook event however often it comes', async () => {
    const before = await getInvoice(client, depositId);
    const { sessionId } = await pay(depositId);
    const session = await new Stripe(config.payments.secretKey, { host: '127.0.0.1', port: fakePort, protocol: 'http', telemetry: false }).checkout.sessions.retrieve(sessionId);
    expect(session.amount_total).toBe(before.balanceCents); // to the cent

    const after = await getInvoice(client, depositId);
    expect(after.status).toBe('paid');
    expect(after.payments).toHaveLength(1);
    expect(after.amountPaidCents).toBe(after.totalCents);
    expect(after.balanceCents).toBe(0);

    // The same events delivered ten times each, the later event first: still one payment.
    const events = [...eventsOf('payment_intent.succeeded', (o) => (o.metadata as Record<string, string>).invoiceId === String(depositId)), ...eventsOf('checkout.session.completed', (o) => o.id === sessionId)];
    expect(events).toHaveLength(2);
    for (const event of events.reverse()) for (let i = 0; i < 10; i++) await fake.state.redeliver(event.id);
    expect(await InvoicePayment.count({ where: { invoiceId: depositId } })).toBe(1);
    expect((await getInvoice(consultant, depositId)).amountPaidCents).toBe(after.totalCents);
    expect(await OutboxMessage.count({ where: { kind: 'payment-receipt', toAddress: ctx.users.client.email } })).toBe(1);
    // The consultant who made the invoice and the owner hear of it once, through the outbox; the Desk shows it.
    // This firm's mail only: another file's firm may number its invoices the same way.
    const staffMail = await OutboxMessage.findAll({ where: { kind: 'payment-received', toAddress: [ctx.users.consultant.email, ctx.users.owner.email] } });
    const invoiceMail = staffMail.filter((m) => m.subject.includes(after.number));
    expect(invoiceMail.map((m) => m.toAddress).sort()).toEqual([ctx.users.consultant.email, ctx.users.owner.email].sort());
    expect(invoiceMail[0].subject).toMatch(/paid \$[\d,]+\.\d{2} on invoice INV-/);
    const desk = DeskSummarySchema.parse((await consultant.get('/api/desk').expect(200)).body.data);
    expect(desk.moneyIn.find((m) => m.invoiceId === depositId)).toMatchObject({ amountCents: after.totalCents, paidInFull: true });
    expect(desk.depositDrafts.find((d) => d.id === depositId)).toBeUndefined();
  });

  it('refuses to pay or void a paid invoice', async () => {
    const pay2 = await send(client, 'post', `/api/invoices/${depositId}/checkout`);
    expect(pay2.status).toBe(409);
    expect(pay2.body.error).toMatch(/paid already/);
    expect((await send(consultant, 'post', `/api/invoices/${depositId}/void`, { reason: 'Billed twice' })).status).toBe(409);
  });

  it('lets only the owner refund, and records the refund once though its webhook also arrives', async () => {
    const inv = await getInvoice(owner, depositId);
    const paymentId = inv.payments[0].id;
    expect((await send(consultant, 'post', `/api/invoices/${depositId}/refunds`, { paymentId, amountCents: 500, requestKey: 'refund-consultant-1' })).status).toBe(403);
    const tooMuch = await send(owner, 'post', `/api/invoices/${depositId}/refunds`, { paymentId, amountCents: inv.totalCents + 1, requestKey: 'refund-too-much-1' });
    expect(tooMuch.status).toBe(422);
    const noKey = await send(owner, 'post', `/api/invoices/${depositId}/refunds`, { paymentId, amountCents: 500 });
    expect(noKey.status).toBe(422);
    expect(noKey.body.error).toMatch(/requestKey/);
    const res = await send(owner, 'post', `/api/invoices/${depositId}/refunds`, { paymentId, amountCents: 500, reason: 'Seed came in under the estimate', requestKey: 'refund-seed-under-1' });
    expect(res.status).toBe(200);
    await fake.state.idle();
    const after = await getInvoice(owner, depositId);
    expect(after.amountRefundedCents).toBe(500);
    expect(after.payments[0].refunds).toHaveLength(1);
    expect(after.status).toBe('paid'); // a refund is the firm's choice; it does not reopen the invoice
    expect(await OutboxMessage.count({ where: { kind: 'invoice-refund', toAddress: ctx.users.client.email } })).toBe(1);
  });

  it('refunds once when the answer is lost and the owner sends the same refund again, and does not say nothing happened', async () => {
    const inv = await getInvoice(owner, depositId);
    const payment = inv.payments[0];
    const refundsBefore = fake.state.events().filter((e) => e.type === 'refund.created').length;
    const body = { paymentId: payment.id, amountCents: 300, reason: 'Lime came in under the estimate', requestKey: `refund-${crypto.randomUUID()}` };
    proxyMode = 'drop-answer';
    const lost = await send(owner, 'post', `/api/invoices/${depositId}/refunds`, body);
    proxyMode = 'pass';
    expect(lost.status).toBe(503);
    expect(lost.body.error).toMatch(/cannot tell yet/);
    expect(lost.body.error).not.toMatch(/Nothing was charged/);
    await fake.state.idle(); // the service did refund, and its webhook recorded it (refunded so far changed)
    expect((await getInvoice(owner, depositId)).amountRefundedCents).toBe(payment.refundedCents + 300);
    const again = await send(owner, 'post', `/api/invoices/${depositId}/refunds`, body);
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    await fake.state.idle();
    const after = await getInvoice(owner, depositId);
    expect(after.amountRefundedCents).toBe(payment.refundedCents + 300); // not 600
    expect(after.payments[0].refunds).toHaveLength(payment.refunds.length + 1);
    expect(fake.state.events().filter((e) => e.type === 'refund.created').length).toBe(refundsBefore + 1);
    expect(await OutboxMessage.count({ where: { kind: 'invoice-refund', toAddress: ctx.users.client.email } })).toBe(2); // one e-mail per refund
    // The same request key with another amount is refused, not turned into a second refund.
    const reused = await send(owner, 'post', `/api/invoices/${depositId}/refunds`, { ...body, amountCents: 200 });
    expect(reused.status).toBe(409);
  });
});

describe('webhook signatures', () => {
  const payload = JSON.stringify({ id: 'evt_forged_1', object: 'event', type: 'payment_intent.succeeded', created: 1, data: { object: { id: 'pi_forged', object: 'payment_intent', amount: 100, amount_received: 100, currency: 'usd', created: 1, metadata: { invoiceId: '1', firmId: '1' } } } });
  const post = (signature: string) => requestFor().post('/api/webhooks/payments').set('Content-Type', 'application/json').set('Stripe-Signature', signature).send(payload);

  it('answers 400 to a forged or stale signature and changes nothing', async () => {
    const forged = verifier.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_ours' });
    const stale = verifier.webhooks.generateTestHeaderString({ payload, secret: config.payments.webhookSecret, timestamp: Math.floor(Date.now() / 1000) - 3600 });
    for (const sig of [forged, stale, 'nonsense']) {
      const res = await post(sig);
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(/signature/);
    }
    expect((await requestFor().post('/api/webhooks/payments').set('Content-Type', 'application/json').send(payload)).status).toBe(400);
    const [{ n }] = await sequelize.query<{ n: string }>("SELECT count(*) AS n FROM processed_events WHERE event_id = 'evt_forged_1'", { type: 'SELECT' as never });
    expect(Number(n)).toBe(0);
    expect(await InvoicePayment.count({ where: { processorPaymentId: 'pi_forged' } })).toBe(0);
  });

  it('answers 400 to a signed event of the wrong shape (so the service stops retrying) and changes nothing', async () => {
    const now = Math.floor(Date.now() / 1000);
    const bad = [
      { id: 'evt_bad_1', object: 'event', type: 'payment_intent.succeeded', created: now, data: { object: { id: 'pi_bad', object: 'payment_intent', amount: 'a lot', currency: 'usd', created: now, metadata: { invoiceId: '1', firmId: '1' } } } },
      { id: 'evt_bad_2', object: 'event', type: 'checkout.session.completed', created: now, data: null },
      { id: 'evt_bad_3', object: 'event', type: 'refund.created', created: now, data: { object: { id: 're_bad', amount: -5, payment_intent: 42 } } },
      { object: 'event', type: 'payment_intent.succeeded', created: now, data: { object: {} } },
    ];
    for (const event of bad) {
      const body = JSON.stringify(event);
      const res = await requestFor().post('/api/webhooks/payments').set('Content-Type', 'application/json').set('Stripe-Signature', verifier.webhooks.generateTestHeaderString({ payload: body, secret: config.payments.webhookSecret })).send(body);
      expect(res.status, body).toBe(400);
      expect(res.body.error).toMatch(/signed but malformed/);
    }
    const [{ n }] = await sequelize.query<{ n: string }>("SELECT count(*) AS n FROM processed_events WHERE event_id LIKE 'evt_bad_%'", { type: 'SELECT' as never });
    expect(Number(n)).toBe(0);
  });
});

/** A request without cookies, as the payments service makes it. */
const requestFor = () => request(testApp());

describe('progress and final invoices', () => {
  let finalId: number;

  it('bills done, unbilled tasks at their cost less the deposit share, once', async () => {
    const base = { firmId: ctx.firm.id, propertyId: proposal.propertyId, unitId: null, prescriptionId: null, proposalId: proposal.id, kind: 'food-plot', practiceName: 'Fall brassica plot', unitName: 'North plot', earliest: '2026-08-01', latest: '2026-09-15', startDate: null, endDate: null, assigneeId: null };
    const done = await Task.create({ ...base, stepKey: 'disk', name: 'Disk the seedbed', status: 'done', costCents: 12_000 });
    await Task.create({ ...base, stepKey: 'seed', name: 'Broadcast seed', status: 'planned', costCents: 9_000 });
    const res = await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'progress' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const inv: InvoiceDto = InvoiceDtoSchema.parse(res.body.data);
    expect(inv.lines.filter((l) => l.source === 'task').map((l) => l.taskId)).toEqual([done.id]);
    // 30 % deposit credited pro rata: 12000 × 30 % = 3600 (arithmetic, no source)
    expect(inv.lines.find((l) => l.source === 'deposit-credit')?.amountCents).toBe(-3_600);
    expect(inv.totalCents).toBe(8_400);
    expect((await Task.findByPk(done.id))!.invoiceId).toBe(inv.id);
    const again = await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'progress' });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatch(/No done tasks/);
    const wrong = await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'progress', taskIds: [done.id] });
    expect(wrong.status).toBe(422);
  });

  it('takes manual lines on drafts only, taxed by the proposal rule', async () => {
    const progress = (await consultant.get(`/api/invoices?proposalId=${proposal.id}&status=draft`)).body.data[0];
    const res = await send(consultant, 'post', `/api/invoices/${progress.id}/lines`, { description: 'Extra soil test', quantity: '2', unitPriceCents: 2_500, taxable: true });
    expect(res.status).toBe(201);
    // 2 × $25.00 = $50.00; tax 5.5 % → 275 cents (arithmetic, no source)
    expect(res.body.data.taxCents).toBe(275);
    expect(res.body.data.totalCents).toBe(8_400 + 5_000 + 275);
    const bad = await send(consultant, 'post', `/api/invoices/${progress.id}/lines`, { description: '', quantity: '-1', unitPriceCents: 1.5 });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/describe the line/);
    const manual = res.body.data.lines.find((l: { source: string }) => l.source === 'manual');
    expect((await send(consultant, 'delete', `/api/invoices/${progress.id}/lines/${manual.id}`)).body.data.totalCents).toBe(8_400);
    expect((await send(consultant, 'post', `/api/invoices/${progress.id}/send`)).status).toBe(200);
    expect((await send(consultant, 'post', `/api/invoices/${progress.id}/lines`, { description: 'Late line', quantity: 1, unitPriceCents: 100 })).status).toBe(409);
  });

  it('bills the rest in the final invoice, so the invoices add up to the proposal total exactly', async () => {
    const res = await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'final' });
    expect(res.status).toBe(201);
    finalId = res.body.data.id;
    const live = await Invoice.findAll({ where: { proposalId: proposal.id } });
    expect(live.reduce((s, i) => s + i.totalCents, 0)).toBe(proposal.totalCents);
    expect(new Set(live.map((i) => i.number)).size).toBe(3);
    expect(live.map((i) => Number(i.number.slice(-4))).sort()).toEqual([1, 2, 3]); // no gaps, no duplicates
    expect((await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'final' })).status).toBe(409);
    expect((await send(consultant, 'post', `/api/invoices/${finalId}/send`)).status).toBe(200);
  });

  it('answers 503 while the payments service is down, leaves the invoice open, and charges once after it is back', async () => {
    await close(fakeServer);
    const down = await send(client, 'post', `/api/invoices/${finalId}/checkout`, { amountCents: 1_000 });
    expect(down.status).toBe(503);
    expect(down.body.error).toMatch(/not reachable.*Nothing was charged/);
    expect((await getInvoice(client, finalId)).status).toBe('open');

    fakeServer = http.createServer(fake.app);
    await listen(fakeServer, fakePort);
    // The service makes the page but its answer is lost on the way back: still a 503 for the client…
    proxyMode = 'drop-answer';
    const lost = await send(client, 'post', `/api/invoices/${finalId}/checkout`, { amountCents: 1_000 });
    expect(lost.status).toBe(503);
    proxyMode = 'pass';
    // …and the retry carries the same idempotency key, so the service replays the same page.
    const { sessionId } = await pay(finalId, 1_000);
    const creates = fakeLog.filter((l) => l.msg === 'request' && l.method === 'POST' && l.path === '/v1/checkout/sessions' && l.status === 200 && String(l.idempotencyKey).includes(`-i${finalId}-u${ctx.users.client.id}-paid0-amt1000`));
    expect(creates.length).toBeGreaterThanOrEqual(2); // the lost call and the retry
    expect(new Set(creates.map((l) => l.idempotencyKey)).size).toBe(1);
    expect(creates.filter((l) => l.idempotentReplayed !== true)).toHaveLength(1); // the service made one page only
    expect(sessionId).toMatch(/^cs_test_/);

    const partial = await getInvoice(client, finalId);
    expect(partial.status).toBe('open');
    expect(partial.amountPaidCents).toBe(1_000);
    expect(eventsOf('payment_intent.succeeded', (o) => (o.metadata as Record<string, string>).invoiceId === String(finalId))).toHaveLength(1);

    // A second contact of the same client can pay an amount the first one started: the key names the payer.
    const contact2 = await signedInAgent((await makeUser(ctx.firm.id, 'client', ctx.client.id)).email, PASSWORD);
    const started = await send(client, 'post', `/api/invoices/${finalId}/checkout`, { amountCents: 700 });
    expect(started.status).toBe(200);
    const other = await send(contact2, 'post', `/api/invoices/${finalId}/checkout`, { amountCents: 700 });
    expect(other.status, JSON.stringify(other.body)).toBe(200);
    expect(other.body.data.url).not.toBe(started.body.data.url);

    const tooMuch = await send(client, 'post', `/api/invoices/${finalId}/checkout`, { amountCents: partial.balanceCents + 1 });
    expect(tooMuch.status).toBe(422);
    await pay(finalId);
    const paid = await getInvoice(client, finalId);
    expect(paid.status).toBe('paid');
    expect(paid.payments.map((p) => p.amountCents).reduce((a, b) => a + b, 0)).toBe(paid.totalCents);
  });
});

describe('receivables and reminders', () => {
  it('ages open balances, counts this month’s payments, and reminds overdue clients once a week through the outbox', async () => {
    // A fresh open invoice that fell due 40 days ago.
    const res = await send(consultant, 'post', '/api/invoices', { proposalId: proposal.id, kind: 'progress' });
    expect(res.status).toBe(409); // the final invoice billed everything
    const other = await Invoice.create({ firmId: ctx.firm.id, clientId: ctx.client.id, propertyId: proposal.propertyId, proposalId: null, kind: 'final', number: 'INV-TEST-0099', status: 'open', totalCents: 12_345, billedCents: 12_345, subtotalCents: 12_345, issuedOn: addDays(new Date().toISOString().slice(0, 10), -70), dueOn: addDays(new Date().toISOString().slice(0, 10), -40), createdById: null });
    const rec = await consultant.get('/api/invoices/receivables');
    expect(rec.status).toBe(200);
    const bucket = rec.body.data.buckets.find((b: { key: string }) => b.key === 'days31to60');
    expect(bucket.amountCents).toBe(12_345);
    expect(rec.body.data.outstandingCents).toBe(rec.body.data.buckets.reduce((s: number, b: { amountCents: number }) => s + b.amountCents, 0));
    const paidInvoices = await Invoice.findAll({ where: { proposalId: proposal.id, status: 'paid' } });
    expect(paidInvoices).toHaveLength(2); // deposit and final; the progress invoice is still open
    expect(rec.body.data.paidThisMonthCents).toBe(paidInvoices.reduce((s, i) => s + i.totalCents, 0) - 500 - 300); // less the two refunds
    expect((await client.get('/api/invoices/receivables')).status).toBe(403);

    const today = new Date().toISOString().slice(0, 10);
    expect(await sendOverdueReminders(today)).toBeGreaterThanOrEqual(1);
    expect(await OutboxMessage.count({ where: { kind: 'invoice-overdue', toAddress: ctx.users.client.email } })).toBe(1);
    expect(await sendOverdueReminders(today)).toBe(0); // not twice in a week
    expect(await sendOverdueReminders(addDays(today, 7))).toBeGreaterThanOrEqual(1);
    expect((await other.reload()).reminderCount).toBe(2);
  });
});

describe('void invoices and other clients', () => {
  it('voids an open invoice without payments, frees its tasks, and refuses to take payment for it', async () => {
    const progress = (await consultant.get(`/api/invoices?proposalId=${proposal.id}&status=open`)).body.data.find((i: { kind: string }) => i.kind === 'progress');
    expect(progress).toBeTruthy();
    expect((await send(consultant, 'post', `/api/invoices/${progress.id}/void`, { reason: 'x' })).status).toBe(422); // a reason is required
    const res = await send(consultant, 'post', `/api/invoices/${progress.id}/void`, { reason: 'Billed on the wrong proposal' });
    expect(res.status).toBe(200);
    expect(res.body.data.status).toBe('void');
    expect(await Task.count({ where: { invoiceId: progress.id } })).toBe(0);
    const pay = await send(client, 'post', `/api/invoices/${progress.id}/checkout`);
    expect(pay.status).toBe(409);
    expect(pay.body.error).toMatch(/void/);
  });

  it('shows a client only their own invoices', async () => {
    const neighbour = await makeClient(ctx.firm.id);
    const other = await signedInAgent((await makeUser(ctx.firm.id, 'client', neighbour.id)).email, PASSWORD);
    expect((await other.get('/api/invoices')).body.data).toEqual([]);
    const mine = z.array(InvoiceRowDtoSchema).parse((await client.get('/api/invoices')).body.data);
    expect(mine.length).toBeGreaterThan(0);
    expect((await other.get(`/api/invoices/${mine[0].id}`)).status).toBe(404);
    expect((await send(other, 'post', `/api/invoices/${mine[0].id}/checkout`)).status).toBe(404);
    expect((await other.get(`/api/invoices/${mine[0].id}/pdf`)).status).toBe(404);
  });
});
