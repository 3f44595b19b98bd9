/**
 * Two app processes on one test database, each with its own upload folder, files in the S3 fake,
 * and one browser's cookie jar alternating between them: sign-in, CSRF, the sign-in limit, uploads
 * and downloads, plan edits and reads, a payment webhook to the other instance, e-mails exactly
 * once (the PDF made by a separate `npm run worker` process), and SIGTERM with uploads in flight.
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { capturedMailTo } from '../support/test-app';
import { startS3Fake, type S3Fake } from '../support/s3-fake';
import { CookieJar, freePort, startAppProcess, startUpload, startWorkerProcess, stopAppProcess, type AppProcess } from '../support/app-process';
import { createPaymentsFake, type PaymentsFake } from '../../server/scripts/payments-fake/app';
import { config } from '../../server/config';
import { Invoice, OutboxMessage, Practice, SharedFile } from '../../server/models';

const CARD_PAYS = '4242 4242 4242 4242'; // the payments service's documented test card, as the fake takes it
// "%PDF-" is the PDF header (ISO 32000-1:2008, 7.5.2); a minimal body is enough for content sniffing.
const pdf = (n: number) => Buffer.from(`%PDF-1.4\n% upload ${n}\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n`);

let s3: S3Fake;
let payments: PaymentsFake;
let paymentsServer: http.Server;
let a: AppProcess;
let b: AppProcess;
/** `npm run worker`: the only process that takes jobs here (both app instances run with JOB_WORKERS_IN_APP=false). */
let worker: AppProcess;
let ctx: Awaited<ReturnType<typeof makeFirm>>;
let propertyId: number;
const folders: string[] = [];
const staff = new CookieJar();
const family = new CookieJar();

async function signIn(jar: CookieJar, base: string, email: string): Promise<void> {
  const res = await jar.fetch(base, '/api/auth/login', { method: 'POST', body: JSON.stringify({ email, password: PASSWORD }) });
  expect(res.status).toBe(200);
  jar.csrf = ((await res.json()) as { csrfToken: string }).csrfToken;
}
const json = async (res: Response) => ({ status: res.status, body: (await res.json()) as { data: Record<string, unknown> & { id: number }; job?: { status: string } } });

beforeAll(async () => {
  s3 = await startS3Fake();
  // Checkouts are opened through instance A; the fake's webhooks go to instance B.
  const paymentsPort = await freePort();
  const paymentsUrl = `http://127.0.0.1:${paymentsPort}`;
  const shared = {
    ...s3.env,
    MIGRATE_ON_START: 'false',
    BUILD_ID: 'two-instances',
    SESSION_SECRET: 'two-instances-session-secret',
    OUTBOX_POLL_MS: '200',
    JOB_POLL_SECONDS: '0.5',
    LOGIN_RATE_MAX: '3',
    PAYMENTS_API_BASE: paymentsUrl,
    SHUTDOWN_GRACE_MS: '20000',
    LOG_LEVEL: 'warn',
    JOB_WORKERS_IN_APP: 'false',
  };
  for (const name of ['a', 'b']) folders.push(fs.mkdtempSync(path.join(os.tmpdir(), `browseline-uploads-${name}-`)));
  [a, b, worker] = await Promise.all([
    startAppProcess('instance A', { ...shared, UPLOADS_DIR: folders[0] }),
    startAppProcess('instance B', { ...shared, UPLOADS_DIR: folders[1] }),
    startWorkerProcess('job worker', { ...shared, UPLOADS_DIR: folders[1] }),
  ]);
  payments = createPaymentsFake({ webhookUrl: `${b.url}/api/webhooks/payments`, webhookSecret: config.payments.webhookSecret, webhookRetryDelaysMs: [5, 10, 20], log: () => undefined });
  paymentsServer = http.createServer(payments.app);
  await new Promise<void>((resolve) => paymentsServer.listen(paymentsPort, '127.0.0.1', resolve));

  ctx = await makeFirm();
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
}, 120_000);

afterAll(async () => {
  await Promise.all([stopAppProcess(a), stopAppProcess(b), stopAppProcess(worker)]);
  await payments?.state.idle();
  payments?.state.close();
  await new Promise((resolve) => paymentsServer?.close(resolve));
  await s3?.close();
  for (const folder of folders) fs.rmSync(folder, { recursive: true, force: true });
});

describe('two instances, one cookie jar', () => {
  it('signs in on one and writes on the other with the same session and CSRF token', async () => {
    await signIn(staff, a.url, ctx.users.consultant.email);
    const me = await staff.fetch(b.url, '/api/auth/me');
    expect(me.status).toBe(200);
    const created = await staff.fetch(b.url, `/api/properties/${propertyId}/units`, { method: 'POST', body: JSON.stringify({ kind: 'food-plot', name: 'North plot', geometry: rectangle(-90.938, 43.2655, 120, 80) }) });
    expect(created.status).toBe(201);
    const noToken = await fetch(`${a.url}/api/properties/${propertyId}/units`, { method: 'POST', headers: { Cookie: staff.header(), 'Content-Type': 'application/json' }, body: '{}' });
    expect(noToken.status).toBe(403);
  });

  it('counts failed sign-ins across both instances', async () => {
    const stranger = new CookieJar();
    const statuses: number[] = [];
    for (const base of [a.url, b.url, a.url, b.url]) {
      const res = await stranger.fetch(base, '/api/auth/login', { method: 'POST', body: JSON.stringify({ email: ctx.users.owner.email, password: 'not-the-password' }) });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]); // LOGIN_RATE_MAX=3 for these processes
  });

  it('serves a file uploaded through one instance from the other, and reads plan edits from either', async () => {
    const form = new FormData();
    form.set('clientId', String(ctx.client.id));
    form.set('category', 'soil-test');
    form.set('file', new Blob([pdf(0)], { type: 'application/pdf' }), 'soil.pdf');
    const up = await staff.fetch(a.url, '/api/files', { method: 'POST', body: form });
    expect(up.status).toBe(201);
    const { data } = (await up.json()) as { data: { url: string } };
    const down = await staff.fetch(b.url, data.url);
    expect(down.status).toBe(200);
    expect(Buffer.from(await down.arrayBuffer()).equals(pdf(0))).toBe(true);
    expect(fs.readdirSync(folders[1]).length).toBe(0); // nothing on B's own disk: it came from the bucket

    const read = await staff.fetch(b.url, `/api/properties/${propertyId}/units`);
    const etag = read.headers.get('etag')!;
    expect((await staff.fetch(a.url, `/api/properties/${propertyId}/units`, { headers: { 'If-None-Match': etag } })).status).toBe(304); // same build, same revision
    const added = await staff.fetch(a.url, `/api/properties/${propertyId}/units`, { method: 'POST', body: JSON.stringify({ kind: 'timber', name: 'Oak slope', geometry: rectangle(-90.936, 43.2655, 200, 150) }) });
    expect(added.status).toBe(201);
    const after = await staff.fetch(b.url, `/api/properties/${propertyId}/units`, { headers: { 'If-None-Match': etag } });
    expect(after.status).toBe(200);
    expect(((await after.json()) as { data: { name: string }[] }).data.map((u) => u.name).sort()).toEqual(['North plot', 'Oak slope']);
  });

  it('sends the proposal e-mail exactly once and records a payment whose webhook reaches the other instance', async () => {
    const units = (await (await staff.fetch(a.url, `/api/properties/${propertyId}/units`)).json()) as { data: { id: number; name: string }[] };
    const plot = units.data.find((u) => u.name === 'North plot')!;
    const brassica = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'fall-brassica-plot' } }))!.id;
    expect((await staff.fetch(b.url, `/api/units/${plot.id}/prescriptions`, { method: 'POST', body: JSON.stringify({ practiceId: brassica }) })).status).toBe(201);
    const drafted = await json(await staff.fetch(a.url, `/api/properties/${propertyId}/proposals`, { method: 'POST', body: JSON.stringify({ taxRatePct: 5.5, depositPct: 30 }) }));
    expect(drafted.status).toBe(201);
    const sent = await json(await staff.fetch(b.url, `/api/proposals/${drafted.body.data.id}/send`, { method: 'POST', body: '{}' }));
    expect(sent.status).toBe(200);
    expect(sent.body.job?.status).toBe('done'); // rendered and queued by the separate worker process

    // Both instances poll the outbox; wait until the message is marked sent, then count deliveries.
    for (let round = 0; ; round++) {
      const row = await OutboxMessage.findOne({ where: { kind: 'proposal-sent', toAddress: ctx.users.client.email } });
      if (row?.status === 'sent') break;
      if (round === 200) throw new Error(`the e-mail was not sent (SMTP_PORT ${process.env.SMTP_PORT}, capture ${process.env.MAIL_CAPTURE_URL}, reader answers ${await fetch(`${process.env.MAIL_CAPTURE_URL}/messages`).then((r) => r.status, (e: Error) => e.message)}): job ${JSON.stringify(sent.body.job)}, outbox ${JSON.stringify({ status: row?.status, attempts: row?.attempts, lastError: row?.lastError, next: row?.nextAttemptAt })}\nA: ${a.output.join('')}\nB: ${b.output.join('')}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    const received = (await capturedMailTo(ctx.users.client.email)).filter((m) => m.subject.includes(String(sent.body.data.number)));
    expect(received).toHaveLength(1);

    await signIn(family, b.url, ctx.users.client.email);
    expect((await family.fetch(a.url, `/api/proposals/${drafted.body.data.id}/approve`, { method: 'POST', body: JSON.stringify({ signedName: 'Dana Landowner' }) })).status).toBe(200);
    const deposit = await json(await staff.fetch(b.url, '/api/invoices', { method: 'POST', body: JSON.stringify({ proposalId: drafted.body.data.id, kind: 'deposit' }) }));
    expect((await staff.fetch(a.url, `/api/invoices/${deposit.body.data.id}/send`, { method: 'POST', body: '{}' })).status).toBe(200);
    const checkout = await json(await family.fetch(a.url, `/api/invoices/${deposit.body.data.id}/checkout`, { method: 'POST', body: '{}' }));
    expect(checkout.status).toBe(200);
    const sessionId = String(checkout.body.data.url).split('/pay/')[1];
    expect(payments.state.pay(sessionId, CARD_PAYS).outcome).toBe('paid');
    await payments.state.idle();
    const invoice = await json(await staff.fetch(a.url, `/api/invoices/${deposit.body.data.id}`));
    expect(invoice.body.data.status).toBe('paid');
    expect((await Invoice.findByPk(deposit.body.data.id))!.amountPaidCents).toBe(invoice.body.data.totalCents);
  });

  it('lets uploads in flight finish after SIGTERM, then stops; the other instance serves their files', async () => {
    const started = await Promise.all([0, 1, 2, 3, 4, 5].map((n) => startUpload(a.url, '/api/files', staff, { clientId: String(ctx.client.id), category: 'soil-test', title: `In flight ${n}` }, { name: `in-flight-${n}.pdf`, bytes: pdf(n + 1), type: 'application/pdf' })));
    // Every request's headers are read by A (it answered 100 Continue); now it is told to stop.
    a.child.kill('SIGTERM');
    const answers = await Promise.all(started.map((s) => s.finish())).catch(async (err) => {
      await a.exited;
      throw new Error(`${(err as Error).message}; instance A said:\n${a.output.join('')}`);
    });
    expect(answers.map((r) => r.status)).toEqual([201, 201, 201, 201, 201, 201]);
    expect(await a.exited).toBe(0);
    await expect(fetch(`${a.url}/api/health`)).rejects.toThrow();

    for (const [n, answer] of answers.entries()) {
      const down = await staff.fetch(b.url, answer.body.data!.url);
      expect(down.status).toBe(200);
      expect(Buffer.from(await down.arrayBuffer()).equals(pdf(n + 1))).toBe(true);
    }
    expect(await SharedFile.count({ where: { firmId: ctx.firm.id, title: answers.map((_, n) => `In flight ${n}`) } })).toBe(6);
  });
});
