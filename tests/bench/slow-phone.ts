/**
 * Slow-phone benchmark (not a test): headless Chromium on a slow mobile profile — 400 ms round trip,
 * 400 kbit/s each way (CDP Network.emulateNetworkConditions) and a 4× slower CPU
 * (Emulation.setCPUThrottlingRate) — against the current build and a baseline build of an earlier
 * commit, interleaved in one run, on one demo database. Prints medians side by side with ratios.
 *
 *   npx tsx tests/bench/slow-phone.ts               # baseline: the merge base with main
 *   BENCH_BASELINE_REF=<commit> BENCH_ROUNDS=5 npx tsx tests/bench/slow-phone.ts
 *
 * Figures: the sign-in form shown and usable (cold: empty cache; warm: loaded again), the field
 * sheet usable after pressing "Sign in" (a task card on screen; the e-mail and password are typed
 * at about 8 keys a second first, as a person would) and on reload, the portal home
 * usable when opened signed in (cold and warm), and the JS + CSS bytes over the wire for sign-in.
 * The baseline is checked out with `git archive` into bench-baseline/ (git-ignored) and built there;
 * it runs its own server.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { chromium, type Browser, type Page } from 'playwright-core';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { median } from './support';

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
const vite = path.join(root, 'node_modules/.bin/vite');
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const PASSWORD = 'demo-browseline';
/** The slow mobile profile of the issue: 400 ms round trip, 400 kbit/s down and up, CPU 4× slower. */
const PROFILE = { latency: 400, downloadThroughput: 400_000 / 8, uploadThroughput: 400_000 / 8, cpu: 4 };

interface Target {
  name: 'baseline' | 'current';
  dir: string;
  base: string;
  server?: ChildProcess;
}

const git = (...args: string[]) => execFileSync('git', args, { cwd: root, encoding: 'utf8' }).trim();

/** Checks out and builds the baseline commit under bench-baseline/ (kept between runs). */
function prepareBaseline(ref: string): string {
  const commit = git('rev-parse', ref);
  // Not under a dot folder: Express's sendFile refuses paths with a dot segment.
  const dir = path.join(root, 'bench-baseline', commit.slice(0, 10));
  if (!fs.existsSync(path.join(dir, 'dist/index.html'))) {
    fs.mkdirSync(dir, { recursive: true });
    execFileSync('bash', ['-c', `git archive ${commit} | tar -x -C "${dir}"`], { cwd: root });
    execFileSync(vite, ['build', '--logLevel', 'warn'], { cwd: dir, stdio: 'inherit' });
  }
  return dir;
}

async function waitHealthy(base: string, child: ChildProcess): Promise<void> {
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) throw new Error(`a bench server exited early (${base})`);
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      /* starting */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`a bench server did not start (${base})`);
}

/** A fresh phone: new context (empty cache, no service worker), slow network and CPU. */
async function phone(browser: Browser) {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: PROFILE.latency, downloadThroughput: PROFILE.downloadThroughput, uploadThroughput: PROFILE.uploadThroughput });
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: PROFILE.cpu });
  let scriptBytes = 0;
  const types = new Map<string, string>();
  cdp.on('Network.responseReceived', (e) => types.set(e.requestId, e.type));
  cdp.on('Network.loadingFinished', (e) => {
    const type = types.get(e.requestId);
    if (process.env.BENCH_VERBOSE) console.error(`  ${(performance.now() / 1000).toFixed(1)} s: ${type} ${e.encodedDataLength} bytes`);
    if (type === 'Script' || type === 'Stylesheet') scriptBytes += e.encodedDataLength;
  });
  return { context, page, bytes: () => scriptBytes, resetBytes: () => (scriptBytes = 0) };
}

/** ms from `start` until `ready` resolves. */
async function timed(start: () => Promise<unknown>, ready: () => Promise<unknown>): Promise<number> {
  const t0 = performance.now();
  await start();
  await ready();
  return performance.now() - t0;
}

const signInFormReady = (page: Page) => page.getByRole('button', { name: 'Sign in' }).waitFor({ state: 'visible', timeout: 300_000 });
const fieldReady = (page: Page) => page.locator('a[href^="/field/tasks/"]').first().waitFor({ state: 'visible', timeout: 300_000 });
const portalReady = (page: Page) => page.getByRole('link', { name: /See the plan/ }).first().waitFor({ state: 'visible', timeout: 300_000 });

type Figures = Record<string, number>;

/**
 * A returning person's phone has the app installed: waits (untimed) until the service worker is
 * activated — Workbox precaches the app shell in its install step, so an active worker means the
 * precache is complete — and the next load of this page will be served through it. Answers whether
 * it did within two minutes (the breakdown then shows whether the reload was really controlled).
 */
async function installed(page: Page): Promise<boolean> {
  // A string, not a function: the TypeScript loader would wrap inner functions in a helper the page lacks.
  return (await page.evaluate(`(async () => {
    if (!('serviceWorker' in navigator)) return false;
    const timeout = new Promise((resolve) => setTimeout(() => resolve(null), 120000));
    const reg = await Promise.race([navigator.serviceWorker.ready, timeout]);
    if (!reg || !reg.active) return false;
    if (reg.active.state !== 'activated') {
      await Promise.race([new Promise((resolve) => reg.active.addEventListener('statechange', () => reg.active.state === 'activated' && resolve(null))), timeout]);
    }
    return reg.active.state === 'activated';
  })()`)) as boolean;
}

/**
 * Where a warm open's time went (BENCH_VERBOSE=1): the page's own clock from navigation start — the
 * HTML's first byte and end, whether a service worker served the page, scripts fetched from the
 * network rather than a cache, the persisted cache restored, and the moment it was measured usable.
 */
async function warmBreakdown(page: Page, label: string): Promise<void> {
  if (!process.env.BENCH_VERBOSE) return;
  // A string, not a function: the TypeScript loader would wrap inner functions in a helper the page lacks.
  const b = await page.evaluate(`(() => {
    const nav = performance.getEntriesByType('navigation')[0];
    const restoreStart = performance.getEntriesByName('browseline:restore-start')[0];
    const restored = performance.getEntriesByName('browseline:restored')[0];
    return {
      sw: Boolean(navigator.serviceWorker && navigator.serviceWorker.controller),
      htmlFirstByte: Math.round(nav.responseStart),
      htmlEnd: Math.round(nav.responseEnd),
      domContentLoaded: Math.round(nav.domContentLoadedEventEnd),
      restoreStart: restoreStart ? Math.round(restoreStart.startTime) : -1,
      restored: restored ? Math.round(restored.startTime) : -1,
      now: Math.round(performance.now()),
      network: performance.getEntriesByType('resource').filter((r) => r.transferSize > 0).map((r) => new URL(r.name).pathname.replace(/^\\/assets\\//, '') + ' ' + Math.round(r.startTime) + '-' + Math.round(r.responseEnd)),
    };
  })()`);
  console.error(`  ${label}: ${JSON.stringify(b)}`);
}

/** Whether the service worker controls (served) the page now shown. */
const controlled = async (page: Page) => (await page.evaluate(`Boolean(navigator.serviceWorker && navigator.serviceWorker.controller)`)) as boolean;

async function round(browser: Browser, t: Target): Promise<Figures> {
  const f: Figures = {};
  // Sign-in form, cold then warm; then the crew member signs in: the field sheet, then reloaded.
  {
    const { context, page, bytes } = await phone(browser);
    f['sign-in form, cold (s)'] = await timed(() => page.goto(`${t.base}/login`, { waitUntil: 'commit' }), () => signInFormReady(page));
    await page.waitForLoadState('load');
    f['sign-in JS + CSS over the wire (KB)'] = bytes() / 1000;
    f['sign-in form, warm (s)'] = await timed(() => page.goto(`${t.base}/login`, { waitUntil: 'commit' }), () => signInFormReady(page));
    // A person types (about 8 keys a second): the sign-in page's idle time, as on a real phone.
    await page.getByLabel('E-mail').pressSequentially('crew@browseline.test', { delay: 120 });
    await page.getByLabel('Password').pressSequentially(PASSWORD, { delay: 120 });
    f['field sheet usable after sign-in, cold (s)'] = await timed(() => page.getByRole('button', { name: 'Sign in' }).click(), () => fieldReady(page));
    await page.waitForLoadState('load');
    f['service worker activated before warm reload (1 = yes)'] = (await installed(page)) ? 1 : 0;
    f['field sheet usable, warm reload (s)'] = await timed(() => page.reload({ waitUntil: 'commit' }), () => fieldReady(page));
    f['field sheet warm reload served by the worker (1 = yes)'] = (await controlled(page)) ? 1 : 0;
    await warmBreakdown(page, `${t.name} field sheet warm`);
    await context.close();
  }
  // The landowner, signed in (through the API, not timed), opens the portal home cold, then again.
  {
    const { context, page } = await phone(browser);
    const login = await context.request.post(`${t.base}/api/auth/login`, { data: { email: 'client@browseline.test', password: PASSWORD } });
    if (login.status() !== 200) throw new Error(`sign-in of the demo client answered ${login.status()}`);
    f['portal home usable, cold (s)'] = await timed(() => page.goto(`${t.base}/portal`, { waitUntil: 'commit' }), () => portalReady(page));
    await page.waitForLoadState('load');
    f['portal: worker activated before warm reload (1 = yes)'] = (await installed(page)) ? 1 : 0;
    f['portal home usable, warm reload (s)'] = await timed(() => page.reload({ waitUntil: 'commit' }), () => portalReady(page));
    f['portal warm reload served by the worker (1 = yes)'] = (await controlled(page)) ? 1 : 0;
    await warmBreakdown(page, `${t.name} portal home warm`);
    await context.close();
  }
  for (const k of Object.keys(f)) if (k.endsWith('(s)')) f[k] /= 1000;
  return f;
}

async function main() {
  const ref = process.env.BENCH_BASELINE_REF ?? git('merge-base', 'HEAD', 'main');
  if (!fs.existsSync(path.join(root, 'dist/src/app.html'))) execFileSync(vite, ['build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  const baselineDir = prepareBaseline(ref);

  startTestCluster();
  const databaseUrl = await freshDatabase('browseline_bench_phone');
  const common = { ...process.env, DATABASE_URL: databaseUrl, LOG_LEVEL: 'warn', OUTBOX_POLL_MS: '600000', REMINDER_POLL_MS: '86400000', LOGIN_RATE_MAX: '10000', SESSION_SECRET: 'bench-slow-phone' };
  execFileSync(tsx, [path.join(root, 'server/scripts/seed-demo.ts')], { cwd: root, env: { ...common, NODE_ENV: 'test' }, stdio: ['ignore', 'ignore', 'inherit'] });

  const targets: Target[] = [
    { name: 'baseline', dir: baselineDir, base: '' },
    { name: 'current', dir: root, base: '' },
  ];
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    for (const t of targets) {
      const port = await freePort();
      t.base = `http://127.0.0.1:${port}`;
      t.server = spawn(tsx, [path.join(t.dir, 'server/index.ts')], { cwd: t.dir, env: { ...common, NODE_ENV: 'production', PORT: String(port), PUBLIC_URL: t.base, SMTP_PORT: '9', PAYMENTS_FAKE_PORT: '9' }, stdio: 'ignore' });
      await waitHealthy(t.base, t.server);
    }
    const results: Record<Target['name'], Figures[]> = { baseline: [], current: [] };
    for (let r = 0; r < ROUNDS; r++) {
      // Interleaved, the order alternating each round, so drift on a shared machine hits both alike.
      const order = r % 2 === 0 ? targets : [...targets].reverse();
      for (const t of order) {
        results[t.name].push(await round(browser, t));
        console.error(`round ${r + 1}/${ROUNDS}: ${t.name} done`);
      }
    }
    const keys = Object.keys(results.current[0]);
    console.log(`\nSlow phone (${PROFILE.latency} ms RTT, ${(PROFILE.downloadThroughput * 8) / 1000} kbit/s, CPU ${PROFILE.cpu}×), medians of ${ROUNDS} interleaved rounds; baseline ${ref.slice(0, 10)}; load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')}`);
    console.log('Warm reloads are of an installed app: before each, the bench waits (untimed) until the service worker is activated, its precache complete.');
    console.log(`${'figure'.padEnd(46)} ${'baseline'.padStart(10)} ${'current'.padStart(10)} ${'current/baseline'.padStart(17)}`);
    for (const k of keys) {
      if (k.includes('(1 = yes)')) {
        // How many rounds it held, not a median.
        const count = (xs: Figures[]) => `${xs.filter((x) => x[k] === 1).length}/${xs.length}`;
        console.log(`${k.replace(' (1 = yes)', ', rounds').padEnd(46)} ${count(results.baseline).padStart(10)} ${count(results.current).padStart(10)}`);
        continue;
      }
      const b = median(results.baseline.map((x) => x[k]));
      const c = median(results.current.map((x) => x[k]));
      console.log(`${k.padEnd(46)} ${b.toFixed(k.endsWith('(KB)') ? 0 : 2).padStart(10)} ${c.toFixed(k.endsWith('(KB)') ? 0 : 2).padStart(10)} ${(c / b).toFixed(2).padStart(17)}`);
    }
  } finally {
    await browser.close();
    for (const t of targets) t.server?.kill('SIGTERM');
    await dropDatabase(databaseUrl);
  }
}

await main();
