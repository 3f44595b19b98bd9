/**
 * Sign-up answer time, new address against an address already registered (npx tsx
 * tests/bench/signup-timing.ts): the real server, interleaved pairs, medians and their ratio. The
 * answers must not tell the two apart by time either: goal ratio within 0.9–1.1.
 */
import { execFileSync, spawn } from 'node:child_process';
import path from 'node:path';
import crypto from 'node:crypto';
import { performance } from 'node:perf_hooks';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { median, percentile, waitForHealth } from './support';

const PAIRS = 20;
const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
startTestCluster();
const databaseUrl = await freshDatabase('browseline_bench_signup');
const port = await freePort();
const base = `http://127.0.0.1:${port}`;
const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '60000', SESSION_SECRET: 'bench', SIGNUP_RATE_MAX: '100000' };
execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env, stdio: 'ignore' });
const server = spawn(tsx, [path.join(root, 'server/index.ts')], { env, stdio: 'ignore' });

let session = { cookie: '', token: '' };
async function signUp(email: string): Promise<{ ms: number; status: number; body: string }> {
  const t0 = performance.now();
  const res = await fetch(`${base}/api/signup`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: session.cookie, 'x-csrf-token': session.token }, body: JSON.stringify({ firmName: 'Timing Habitat Works', name: 'Tess Timing', email, password: 'a long enough bench password' }) });
  const body = await res.text();
  return { ms: performance.now() - t0, status: res.status, body };
}

try {
  await waitForHealth(base);
  const csrf = await fetch(`${base}/api/auth/csrf`);
  session = { cookie: (csrf.headers.get('set-cookie') ?? '').split(';')[0]!, token: ((await csrf.json()) as { csrfToken: string }).csrfToken };
  const used = `used-${crypto.randomBytes(4).toString('hex')}@example.test`;
  await signUp(used);
  const fresh: number[] = [];
  const again: number[] = [];
  for (let i = 0; i < PAIRS + 2; i++) {
    const a = await signUp(`new-${crypto.randomBytes(6).toString('hex')}@example.test`);
    const b = await signUp(used);
    if (a.status !== b.status || a.body !== b.body) throw new Error(`answers differ: ${a.status} ${a.body} / ${b.status} ${b.body}`);
    if (i < 2) continue;
    fresh.push(a.ms);
    again.push(b.ms);
  }
  const fmt = (xs: number[]) => `p50 ${median(xs).toFixed(0)} ms, p95 ${percentile(xs, 95).toFixed(0)} ms`;
  console.log(`\nPOST /api/signup, interleaved pairs (both answered ${(await signUp(used)).status})`);
  console.log(`  new address:   ${fmt(fresh)}`);
  console.log(`  used address:  ${fmt(again)}`);
  console.log(`  ratio used ÷ new p50: ${(median(again) / median(fresh)).toFixed(2)} (goal 0.9–1.1)`);
} finally {
  server.kill('SIGTERM');
  await dropDatabase(databaseUrl);
}
