/**
 * Benchmarks (not tests): prints medians and ratios for the note. Run with `npm run bench`.
 * Uses the test PostgreSQL cluster (a database of its own) and the real server in a child process.
 */
import { execFileSync, spawn } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { area as turfArea } from '@turf/turf';
import { measureArea } from '../../shared/domain/geometry';
import { readGeoFile } from '../../server/services/geo-files';
import { generateLargeKml } from '../support/geo-fixtures-large';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { load, median, percentile, timeRuns, waitForHealth } from './support';
import { weekLimit, weekPerDay } from '../../shared/schemas/task';

type Loaded = Awaited<ReturnType<typeof load>>;
import type { Polygon } from 'geojson';

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
const results: Record<string, string> = {};

/** A circle-like boundary of n vertices around a point, radius in metres. */
function bigBoundary(n: number, lon = -90.93, lat = 43.27, radiusM = 800): Polygon {
  const ring: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n;
    const wobble = 1 + 0.03 * Math.sin(a * 37);
    ring.push([lon + ((radiusM * wobble * Math.cos(a)) / (111_320 * Math.cos((lat * Math.PI) / 180))), lat + (radiusM * wobble * Math.sin(a)) / 111_132]);
  }
  ring.push(ring[0]);
  return { type: 'Polygon', coordinates: [ring] };
}

/**
 * Area + perimeter on the ellipsoid against turf's spherical `area` alone, on the same 50,000-vertex
 * boundary, interleaved run by run so both see the same machine load. Goal (issue "exact land
 * measure", item 1): ratio ≤ 3.
 */
function measureVersusTurf(boundary: Polygon, runs = 61) {
  const ours: number[] = [];
  const turf: number[] = [];
  for (let i = 0; i < 5; i++) {
    measureArea(boundary);
    turfArea(boundary);
  }
  for (let i = 0; i < runs; i++) {
    let t0 = performance.now();
    measureArea(boundary);
    ours.push(performance.now() - t0);
    t0 = performance.now();
    turfArea(boundary);
    turf.push(performance.now() - t0);
  }
  return { ours: median(ours), turf: median(turf) };
}

async function computations() {
  const boundary = bigBoundary(50_000);
  const t = await timeRuns(() => measureArea(boundary), 15, 3);
  results['acreage of a 50,000-vertex boundary (median)'] = `${median(t).toFixed(1)} ms`;
  const m = measureVersusTurf(boundary);
  results['ellipsoid area + perimeter vs turf spherical area, 50,000 vertices (medians, interleaved)'] = `${m.ours.toFixed(2)} ms vs ${m.turf.toFixed(2)} ms`;
  results['measure ratio ellipsoid ÷ turf area (aim ≤ 3)'] = (m.ours / m.turf).toFixed(2);
  const kml = generateLargeKml({ targetBytes: 10 * 1024 * 1024 });
  const k = await timeRuns(() => readGeoFile({ filename: 'big.kml', buffer: kml.buffer }), 3, 1);
  results[`import of a ${(kml.buffer.length / 1048576).toFixed(1)} MB KML, ${kml.placemarkCount} placemarks (median)`] = `${(median(k) / 1000).toFixed(2)} s`;
}

const withGrowth = !process.argv.includes('--no-growth');

async function signIn(base: string, email: string): Promise<string> {
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'bench-password-1' }) });
  if (!login.ok) throw new Error(`bench sign-in failed for ${email}: ${login.status}`);
  return (login.headers.get('set-cookie') ?? '').split(';')[0];
}

/**
 * Growth with the firm's data: the same reads against a firm and its 10× twin (seed-scale.ts),
 * one request each in turn (interleaved), 40 rounds after 5 warm-up rounds; p50 ratio 10× ÷ 1×.
 */
async function growth(base: string) {
  const iso = (d: Date) => d.toISOString().slice(0, 10);
  const now = new Date();
  const monday = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - ((now.getUTCDay() + 6) % 7)));
  const day = (n: number) => iso(new Date(monday.getTime() + n * 86_400_000));
  const sides = await Promise.all(
    [1, 10].map(async (factor) => {
      const staff = await signIn(base, `scale${factor}@browseline.test`);
      const client = await signIn(base, `scale${factor}-client@browseline.test`);
      const portal = (await (await fetch(`${base}/api/portal/properties`, { headers: { cookie: client } })).json()) as { data: { properties: { id: number }[] } };
      return { staff, client, portalPropertyId: portal.data.properties[0].id };
    }),
  );
  const reads: { label: string; url: (side: (typeof sides)[number]) => string; who: 'staff' | 'client' }[] = [
    // Exactly what the week page asks first (src/app/routes/schedule/schedule.tsx): a few tasks of each day, every day's total.
    { label: `consultant's week list (as the week page asks: from, to, perDay=${weekPerDay(1)}, limit=${weekLimit(weekPerDay(1))})`, url: () => `/api/tasks?from=${day(0)}&to=${day(6)}&perDay=${weekPerDay(1)}&limit=${weekLimit(weekPerDay(1))}`, who: 'staff' },
    { label: 'schedule timeline (12 weeks, its page of 100)', url: () => `/api/tasks?from=${day(-28)}&to=${day(55)}&limit=100`, who: 'staff' },
    { label: 'Desk', url: () => '/api/desk', who: 'staff' },
    { label: 'invoices (default page: 50 newest, firm-wide totals)', url: () => '/api/invoices', who: 'staff' },
    { label: "portal's property read", url: (side) => `/api/portal/properties/${side.portalPropertyId}`, who: 'client' },
  ];
  const times = reads.map(() => [[], []] as [number[], number[]]);
  const sizes = reads.map(() => [0, 0]);
  for (let round = 0; round < 45; round++) {
    for (const [i, read] of reads.entries()) {
      for (const [s, side] of sides.entries()) {
        const t0 = performance.now();
        const res = await fetch(`${base}${read.url(side)}`, { headers: { cookie: read.who === 'staff' ? side.staff : side.client } });
        const bytes = (await res.arrayBuffer()).byteLength;
        if (!res.ok) throw new Error(`${read.label}: ${res.status}`);
        if (round >= 5) times[i][s].push(performance.now() - t0);
        sizes[i][s] = bytes;
      }
    }
  }
  results['growth bench: load average (1, 5, 15 min) when it ended'] = os.loadavg().map((l) => l.toFixed(2)).join(', ');
  for (const [i, read] of reads.entries()) {
    const [one, ten] = [median(times[i][0]), median(times[i][1])];
    results[`growth 10× ÷ 1× p50, ${read.label} (goal ≤ 1.3)`] = `${(ten / one).toFixed(2)} (p50 ${one.toFixed(1)} → ${ten.toFixed(1)} ms; ${(sizes[i][0] / 1024).toFixed(0)} → ${(sizes[i][1] / 1024).toFixed(0)} KB)`;
  }
}

/** GET /api/places over HTTP, one request at a time, interleaved with /api/health as its baseline (goal p50 ≤ 50 ms). */
async function places(base: string, cookie: string) {
  const queries = ['Crawford County, WI', 'viroqua', 'Prairie du Ch', 'CAÑON CITY', 'Madison, Wisconsin', 'spring', `43°15'55.8"N 90°56'16.8"W`, 'zzzz', 'Jefferson County', 'san'];
  const found: number[] = [];
  const health: number[] = [];
  for (let round = 0; round < 25; round++) {
    for (const q of queries) {
      let t0 = performance.now();
      const res = await fetch(`${base}/api/places?q=${encodeURIComponent(q)}`, { headers: { cookie } });
      await res.arrayBuffer();
      if (!res.ok) throw new Error(`places ${q}: ${res.status}`);
      if (round >= 3) found.push(performance.now() - t0);
      t0 = performance.now();
      await (await fetch(`${base}/api/health`)).arrayBuffer();
      if (round >= 3) health.push(performance.now() - t0);
    }
  }
  results['GET /api/places p50, signed in, one at a time (goal ≤ 50 ms)'] = `${median(found).toFixed(1)} ms (p95 ${percentile(found, 95).toFixed(1)} ms; /api/health interleaved ${median(health).toFixed(1)} ms; ratio ${(median(found) / median(health)).toFixed(2)})`;
}

async function http() {
  startTestCluster();
  const databaseUrl = await freshDatabase('browseline_bench');
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '60000', SESSION_SECRET: 'bench' };
  execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env, stdio: 'ignore' });
  execFileSync(tsx, [path.join(root, 'tests/bench/seed-plan.ts')], { env, stdio: 'inherit' });
  if (withGrowth) execFileSync(tsx, [path.join(root, 'tests/bench/seed-scale.ts')], { env, stdio: 'inherit' });
  const server = spawn(tsx, [path.join(root, 'server/index.ts')], { env, stdio: 'ignore' });
  try {
    await waitForHealth(base);
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@browseline.test', password: 'bench-password-1' }) });
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0];
    const props = (await (await fetch(`${base}/api/properties`, { headers: { cookie } })).json()) as { data: { id: number }[] };
    const unitsUrl = `${base}/api/properties/${props.data[0].id}/units`;
    const first = await fetch(unitsUrl, { headers: { cookie } });
    const body = (await first.json()) as { data: unknown[] };
    const etag = first.headers.get('etag')!;
    const opts = { connections: 32, durationMs: 2500, maxRequests: 200_000 };
    await load(`${base}/api/health`, { ...opts, durationMs: 1500 }); // warm-up
    await load(unitsUrl, { ...opts, durationMs: 1500, headers: { cookie } }); // warm-up
    // Interleaved rounds: health, the plan read (200) and its 304, one after another, three times.
    const summaryUrl = `${base}/api/properties/${props.data[0].id}/plan`;
    await load(summaryUrl, { ...opts, durationMs: 1000, headers: { cookie } }); // warm-up
    const rounds = { health: [] as Loaded[], units: [] as Loaded[], notModified: [] as Loaded[], summary: [] as Loaded[] };
    for (let round = 0; round < 3; round++) {
      rounds.health.push(await load(`${base}/api/health`, opts));
      rounds.units.push(await load(unitsUrl, { ...opts, headers: { cookie, 'accept-encoding': 'gzip, deflate, br' } }));
      rounds.notModified.push(await load(unitsUrl, { ...opts, headers: { cookie, 'if-none-match': etag }, expectStatus: 304 }));
      rounds.summary.push(await load(summaryUrl, { ...opts, headers: { cookie, 'accept-encoding': 'gzip, deflate, br' } }));
    }
    const rps = (xs: Loaded[]) => median(xs.map((x) => x.rps));
    const p50 = (xs: Loaded[]) => median(xs.map((x) => x.p50));
    const failed = (xs: Loaded[]) => xs.reduce((n, x) => n + x.failed, 0);
    const health = rps(rounds.health);
    results['GET /api/health, 32 connections (median of 3 rounds)'] = `${health.toFixed(0)} req/s (p50 ${p50(rounds.health).toFixed(1)} ms)`;
    results[`GET units (${body.data.length} units, ${(JSON.stringify(body).length / 1024).toFixed(0)} KB), signed in, 32 connections`] = `${rps(rounds.units).toFixed(0)} req/s (p50 ${p50(rounds.units).toFixed(1)} ms), failed ${failed(rounds.units)}`;
    results['GET units with If-None-Match (304), signed in'] = `${rps(rounds.notModified).toFixed(0)} req/s (p50 ${p50(rounds.notModified).toFixed(1)} ms), failed ${failed(rounds.notModified)}`;
    results['GET plan summary (warm: cached by revision), signed in, 32 connections'] = `${rps(rounds.summary).toFixed(0)} req/s (p50 ${p50(rounds.summary).toFixed(1)} ms), failed ${failed(rounds.summary)}; ratio to health ${(rps(rounds.summary) / health).toFixed(2)}`;
    results['throughput ratio units ÷ health (goal ≥ 0.5; 0.26–0.35 before)'] = (rps(rounds.units) / health).toFixed(2);
    results['throughput ratio units 304 ÷ health (goal ≥ 0.8)'] = (rps(rounds.notModified) / health).toFixed(2);
    await places(base, cookie);
    if (withGrowth) await growth(base);
  } finally {
    server.kill('SIGTERM');
    await dropDatabase(databaseUrl);
  }
}

if (!process.argv.includes('--no-computations')) await computations();
if (!process.argv.includes('--no-http')) await http();
console.log('\nBrowseline benchmarks');
for (const [k, v] of Object.entries(results)) console.log(`  ${k}: ${v}`);
// The request thread's event loop during PDFs, imports and overlays (item 7), in a process of its own.
if (!process.argv.includes('--no-event-loop')) execFileSync(tsx, [path.join(root, 'tests/bench/event-loop.ts')], { env: process.env, stdio: 'inherit' });
process.exit(0);
