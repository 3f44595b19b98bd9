/**
 * The consultant's week list as the firm's data grows 10× (not a test): the request the week page
 * makes (a few tasks of each day with every day's total, `perDay`) beside the request it made before
 * (a page of 50 in date order), against the 1× and 10× firms of seed-scale.ts, one request each in
 * turn (interleaved), several rounds. Prints each round's p50 ratio 10× ÷ 1× and their medians, with
 * the machine's load average. Goal (issue 15, item 8): ≤ 1.3.
 *
 *   bash server/scripts/db.sh start test && npx tsx tests/bench/week-growth.ts   # BENCH_ROUNDS (default 5)
 */
import { execFileSync, spawn } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { median, waitForHealth } from './support';
import { weekLimit, weekPerDay } from '../../shared/schemas/task';

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 5);
const REQUESTS = 40;
const WARM_UP = 5;
const load = () => os.loadavg().map((l) => l.toFixed(2)).join(' ');

async function signIn(base: string, email: string): Promise<string> {
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'bench-password-1' }) });
  if (!login.ok) throw new Error(`bench sign-in failed for ${email}: ${login.status}`);
  return (login.headers.get('set-cookie') ?? '').split(';')[0];
}

async function main() {
  startTestCluster();
  const databaseUrl = await freshDatabase('browseline_bench_week');
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '600000', REMINDER_POLL_MS: '86400000', SESSION_SECRET: 'bench-week', SMTP_PORT: '9', PAYMENTS_FAKE_PORT: '9' };
  execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env, stdio: 'ignore' });
  execFileSync(tsx, [path.join(root, 'tests/bench/seed-scale.ts')], { env, stdio: 'inherit' });
  const server = spawn(tsx, [path.join(root, 'server/index.ts')], { env, stdio: 'ignore' });
  try {
    await waitForHealth(base);
    const iso = (d: Date) => d.toISOString().slice(0, 10);
    const now = new Date();
    const monday = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - ((now.getUTCDay() + 6) % 7)));
    const day = (n: number) => iso(new Date(monday.getTime() + n * 86_400_000));
    const cookies = [await signIn(base, 'scale1@browseline.test'), await signIn(base, 'scale10@browseline.test')];
    const perDay = weekPerDay(1);
    const reads = [
      { label: `week page now (perDay=${perDay}, limit=${weekLimit(perDay)})`, url: `/api/tasks?from=${day(0)}&to=${day(6)}&perDay=${perDay}&limit=${weekLimit(perDay)}` },
      { label: 'week page before (limit=50, date order)', url: `/api/tasks?from=${day(0)}&to=${day(6)}&limit=50` },
    ];
    const loadAtStart = load();
    const ratios = reads.map(() => [] as number[]);
    const p50s = reads.map(() => [[], []] as [number[], number[]]);
    const shape = reads.map(() => ['', ''] as [string, string]);
    for (let round = 0; round < ROUNDS; round++) {
      const times = reads.map(() => [[], []] as [number[], number[]]);
      for (let n = 0; n < WARM_UP + REQUESTS; n++) {
        for (const [i, read] of reads.entries()) {
          for (const s of [0, 1]) {
            const t0 = performance.now();
            const res = await fetch(`${base}${read.url}`, { headers: { cookie: cookies[s], 'accept-encoding': 'gzip, deflate, br' } });
            const body = (await res.json()) as { data: { tasks: unknown[]; page: { total: number } } };
            if (!res.ok) throw new Error(`${read.label}: ${res.status}`);
            if (n >= WARM_UP) times[i][s].push(performance.now() - t0);
            shape[i][s] = `${body.data.tasks.length} of ${body.data.page.total} tasks, ${(JSON.stringify(body).length / 1024).toFixed(0)} KB`;
          }
        }
      }
      for (const i of reads.keys()) {
        const [one, ten] = [median(times[i][0]), median(times[i][1])];
        ratios[i].push(ten / one);
        p50s[i][0].push(one);
        p50s[i][1].push(ten);
      }
      console.error(`round ${round + 1}/${ROUNDS}: ${reads.map((r, i) => `${r.label} ${ratios[i][round].toFixed(2)}`).join('; ')}; load ${load()}`);
    }
    console.log(`\nConsultant's week list, growth 10× ÷ 1× (p50 of ${REQUESTS} interleaved requests a round, ${ROUNDS} rounds; goal ≤ 1.3)`);
    console.log(`load average (1, 5, 15 min): ${loadAtStart} at the start, ${load()} at the end; ${os.cpus().length} CPUs`);
    for (const [i, read] of reads.entries()) {
      console.log(`  ${read.label}: median ratio ${median(ratios[i]).toFixed(2)} (rounds ${ratios[i].map((r) => r.toFixed(2)).join(', ')}); p50 ${median(p50s[i][0]).toFixed(1)} → ${median(p50s[i][1]).toFixed(1)} ms; 1×: ${shape[i][0]}; 10×: ${shape[i][1]}`);
    }
  } finally {
    server.kill('SIGTERM');
    await dropDatabase(databaseUrl);
  }
}

await main();
