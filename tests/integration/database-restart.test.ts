/**
 * The database restarts under load and the app stays up: while PostgreSQL is away /api/health and
 * the writes answer 503 (never a crash, never a 500); when it is back, service resumes by itself
 * within seconds, and every write the load acknowledged is stored exactly once.
 * The app runs as its own process (server/index.ts) on a throw-away cluster, so the restart
 * disturbs no other test and a crash of the process is seen as such.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { setTimeout as wait } from 'node:timers/promises';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startScratchCluster, type ScratchCluster } from '../support/scratch-cluster';
import { hashPassword } from '../../server/services/auth/passwords';
import { PASSWORD } from '../support/factories';

const root = path.resolve(import.meta.dirname, '../..');
/** Bounds: the load stops after this many requests per worker or this many milliseconds. */
const WORKERS = 4;
const MAX_REQUESTS_PER_WORKER = 3000;
const MAX_TEST_MS = 60_000;

let cluster: ScratchCluster;
let app: ChildProcess;
let base: string;
let appLog = '';

async function untilHealthy(deadline: number): Promise<boolean> {
  while (Date.now() < deadline) {
    const status = await fetch(`${base}/api/health`).then((r) => r.status, () => 0);
    if (status === 200) return true;
    await wait(50);
  }
  return false;
}

beforeAll(async () => {
  cluster = await startScratchCluster();
  const admin = new pg.Client({ connectionString: cluster.url('postgres') });
  await admin.connect();
  await admin.query('CREATE DATABASE browseline_restart');
  await admin.end();
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  app = spawn(path.join(root, 'node_modules/.bin/tsx'), [path.join(root, 'server/index.ts')], {
    cwd: root,
    env: { ...process.env, NODE_ENV: 'production', DATABASE_URL: cluster.url('browseline_restart'), PORT: String(port), HOST: '127.0.0.1', PUBLIC_URL: base, OUTBOX_POLL_MS: '3600000', REMINDER_POLL_MS: '3600000', LOG_LEVEL: 'warn', SESSION_SECRET: 'database-restart-test-secret' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  app.stdout?.on('data', (b: Buffer) => (appLog = (appLog + b.toString()).slice(-20_000)));
  app.stderr?.on('data', (b: Buffer) => (appLog = (appLog + b.toString()).slice(-20_000)));
  expect(await untilHealthy(Date.now() + 45_000), appLog).toBe(true);
  const db = new pg.Client({ connectionString: cluster.url('browseline_restart') });
  await db.connect();
  const firm = await db.query<{ id: number }>(`INSERT INTO firms (name, slug) VALUES ('Restart Firm', 'restart-firm') RETURNING id`);
  await db.query(`INSERT INTO users (firm_id, email, name, role, password_hash) VALUES ($1, 'owner@restart.test', 'Owner', 'owner', $2)`, [firm.rows[0].id, await hashPassword(PASSWORD)]);
  await db.end();
}, 90_000);

afterAll(async () => {
  if (app && app.exitCode === null) {
    app.kill('SIGTERM');
    await new Promise((resolve) => app.once('exit', resolve));
  }
  await cluster?.destroy();
});

describe('a database restart under load', () => {
  it('answers 503 while the database is away, recovers by itself, and loses or doubles no write', async () => {
    const started = Date.now();
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'owner@restart.test', password: PASSWORD }) });
    expect(login.status).toBe(200);
    const cookie = login.headers.get('set-cookie')!.split(';')[0];
    const csrf = ((await login.json()) as { csrfToken: string }).csrfToken;

    const statuses = new Map<number, number>();
    const acknowledged: string[] = [];
    let stop = false;
    let down = false;
    let refusedWhileDown = 0;
    const count = (s: number) => statuses.set(s, (statuses.get(s) ?? 0) + 1);

    // Each worker writes clients with unique names and retries the same name until it is acknowledged.
    const worker = async (w: number) => {
      let requests = 0;
      for (let i = 0; !stop && requests < MAX_REQUESTS_PER_WORKER; i++) {
        const name = `restart-w${w}-${i}`;
        for (;;) {
          requests++;
          const status = await fetch(`${base}/api/clients`, { method: 'POST', headers: { 'content-type': 'application/json', cookie, 'x-csrf-token': csrf }, body: JSON.stringify({ name }) }).then(
            async (r) => (await r.arrayBuffer(), r.status),
            () => 0, // no answer at all: the process is gone
          );
          count(status);
          if (status === 201) {
            acknowledged.push(name);
            break;
          }
          if (down && status === 503) refusedWhileDown++;
          if (status !== 503 || requests >= MAX_REQUESTS_PER_WORKER || Date.now() - started > MAX_TEST_MS) return;
          await wait(20);
        }
      }
    };
    const load = Promise.all(Array.from({ length: WORKERS }, (_, w) => worker(w)));

    const until = async (pred: () => boolean, ms: number) => {
      const end = Date.now() + ms;
      while (!pred() && Date.now() < end) await wait(20);
      return pred();
    };
    expect(await until(() => acknowledged.length >= 20, 20_000)).toBe(true);

    down = true;
    await cluster.stop();
    let healthWhileDown = 0;
    const downEnd = Date.now() + 10_000;
    while ((healthWhileDown === 0 || refusedWhileDown < 5) && Date.now() < downEnd) {
      const status = await fetch(`${base}/api/health`).then((r) => r.status, () => 0);
      if (status !== 200) healthWhileDown = status;
      await wait(50);
    }
    expect(healthWhileDown).toBe(503);
    expect(app.exitCode, appLog).toBeNull();

    const before = acknowledged.length;
    const backAt = Date.now();
    await cluster.start();
    down = false;
    expect(await untilHealthy(backAt + 15_000)).toBe(true);
    const healthySeconds = (Date.now() - backAt) / 1000;
    expect(await until(() => acknowledged.length >= before + 20, 15_000)).toBe(true);
    const writingSeconds = (Date.now() - backAt) / 1000;
    stop = true;
    await load;

    const crashes = [...statuses].filter(([s]) => s === 0 || (s >= 500 && s !== 503));
    console.log(`database restart: ${acknowledged.length} writes acknowledged, ${statuses.get(503) ?? 0} answered 503 (${refusedWhileDown} while the database was down), other answers ${JSON.stringify(Object.fromEntries(statuses))}; health back ${healthySeconds.toFixed(2)} s and writes ${writingSeconds.toFixed(2)} s after the database started`);
    expect(crashes, appLog).toEqual([]);
    expect(refusedWhileDown).toBeGreaterThan(0);
    expect(healthySeconds).toBeLessThan(10);
    expect(app.exitCode).toBeNull();

    const db = new pg.Client({ connectionString: cluster.url('browseline_restart') });
    await db.connect();
    const rows = await db.query<{ name: string; n: string }>(`SELECT name, count(*) AS n FROM clients WHERE name LIKE 'restart-w%' GROUP BY name`);
    await db.end();
    const stored = new Map(rows.rows.map((r) => [r.name, Number(r.n)]));
    expect(acknowledged.filter((n) => stored.get(n) !== 1)).toEqual([]); // none lost, none doubled
    expect([...stored.keys()].filter((n) => !acknowledged.includes(n))).toEqual([]); // nothing stored unacknowledged
  }, 120_000);
});
