/**
 * Header search time (npx tsx tests/bench/search.ts): `GET /api/search?q=` through the real server
 * against the demo data plus a firm and its 10× twin (seed-scale.ts), signed in as each twin's
 * consultant, interleaved with `GET /api/health` as the baseline in the same rounds. A mix of exact
 * names, typos, partial numbers and misses. Target: p50 ≤ 50 ms on the 10× firm.
 */
import { execFileSync, spawn } from 'node:child_process';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { median, percentile, waitForHealth } from './support';

const QUERIES = ['Client 017', 'clent 03', 'property 12-2', 'propety 3-1', 'INV-2026-0042', 'inv 2026 01', '0093', 'landowner', 'zzzzqq', 'Consultant'];
const ROUNDS = 25;

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
startTestCluster();
const databaseUrl = await freshDatabase('browseline_bench_search');
const port = await freePort();
const base = `http://127.0.0.1:${port}`;
const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '60000', SESSION_SECRET: 'bench' };
execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env, stdio: 'ignore' });
// The demo seed refuses production; it runs as in development.
execFileSync(tsx, [path.join(root, 'server/scripts/seed-demo.ts')], { env: { ...env, NODE_ENV: 'development' }, stdio: 'ignore' });
execFileSync(tsx, [path.join(root, 'tests/bench/seed-scale.ts')], { env, stdio: 'inherit' });
const server = spawn(tsx, [path.join(root, 'server/index.ts')], { env, stdio: 'ignore' });

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'bench-password-1' }) });
  if (!res.ok) throw new Error(`sign-in ${email}: ${res.status}`);
  return (res.headers.get('set-cookie') ?? '').split(';')[0]!;
}

async function timed(url: string, cookie?: string): Promise<{ ms: number; hits: number }> {
  const t0 = performance.now();
  const res = await fetch(url, { headers: cookie ? { cookie } : {} });
  const body = (await res.json()) as { data?: unknown[] };
  const ms = performance.now() - t0;
  if (!res.ok) throw new Error(`${url}: ${res.status}`);
  return { ms, hits: Array.isArray(body.data) ? body.data.length : 0 };
}

try {
  await waitForHealth(base);
  const one = await signIn('scale1@browseline.test');
  const ten = await signIn('scale10@browseline.test');
  const times = { health: [] as number[], one: [] as number[], ten: [] as number[] };
  let hits = 0;
  for (let round = 0; round < ROUNDS; round++) {
    for (const q of QUERIES) {
      const url = `${base}/api/search?q=${encodeURIComponent(q)}`;
      const h = await timed(`${base}/api/health`);
      const a = await timed(url, one);
      const b = await timed(url, ten);
      if (round < 3) continue; // warm-up
      times.health.push(h.ms);
      times.one.push(a.ms);
      times.ten.push(b.ms);
      hits += b.hits;
    }
  }
  const fmt = (xs: number[]) => `p50 ${median(xs).toFixed(1)} ms, p95 ${percentile(xs, 95).toFixed(1)} ms`;
  console.log('\nHeader search (GET /api/search), sequential, interleaved');
  console.log(`  /api/health (baseline):  ${fmt(times.health)}`);
  console.log(`  search, 1× firm:         ${fmt(times.one)}`);
  console.log(`  search, 10× firm:        ${fmt(times.ten)}   (goal p50 ≤ 50 ms)`);
  console.log(`  ratio 10× ÷ 1× p50:      ${(median(times.ten) / median(times.one)).toFixed(2)}`);
  console.log(`  ratio 10× ÷ health p50:  ${(median(times.ten) / median(times.health)).toFixed(2)}`);
  console.log(`  mean hits per 10× query: ${(hits / times.ten.length).toFixed(1)}`);
} finally {
  server.kill('SIGTERM');
  await dropDatabase(databaseUrl);
}
