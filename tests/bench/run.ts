/**
 * Benchmarks (not tests): prints medians and ratios for the note. Run with `npm run bench`.
 * Uses the test PostgreSQL cluster (a database of its own) and the real server in a child process.
 */
import { execFileSync, spawn } from 'node:child_process';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { area as turfArea } from '@turf/turf';
import { measureArea } from '../../shared/domain/geometry';
import { readGeoFile } from '../../server/services/geo-files';
import { generateLargeKml } from '../support/geo-fixtures-large';
import { freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { load, median, timeRuns } from './support';
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

async function http() {
  startTestCluster();
  const databaseUrl = await freshDatabase('browseline_bench');
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '60000', SESSION_SECRET: 'bench' };
  execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env, stdio: 'ignore' });
  execFileSync(tsx, [path.join(root, 'tests/bench/seed-plan.ts')], { env, stdio: 'inherit' });
  const server = spawn(tsx, [path.join(root, 'server/index.ts')], { env, stdio: 'ignore' });
  try {
    for (let i = 0; i < 150; i++) {
      try {
        if ((await fetch(`${base}/api/health`)).ok) break;
      } catch {
        /* starting */
      }
      await new Promise((r) => setTimeout(r, 200));
    }
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@browseline.test', password: 'bench-password-1' }) });
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0];
    const props = (await (await fetch(`${base}/api/properties`, { headers: { cookie } })).json()) as { data: { id: number }[] };
    const unitsUrl = `${base}/api/properties/${props.data[0].id}/units`;
    const first = await fetch(unitsUrl, { headers: { cookie } });
    const body = (await first.json()) as { data: unknown[] };
    const etag = first.headers.get('etag')!;
    const opts = { connections: 32, durationMs: 8000, maxRequests: 200_000 };
    await load(`${base}/api/health`, { ...opts, durationMs: 1500 }); // warm-up
    const health = await load(`${base}/api/health`, opts);
    const units = await load(unitsUrl, { ...opts, headers: { cookie } });
    const notModified = await load(unitsUrl, { ...opts, headers: { cookie, 'if-none-match': etag }, expectStatus: 304 });
    results['GET /api/health, 32 connections'] = `${health.rps.toFixed(0)} req/s (p50 ${health.p50.toFixed(1)} ms)`;
    results[`GET units (${body.data.length} units, ${(JSON.stringify(body).length / 1024).toFixed(0)} KB), 32 connections`] = `${units.rps.toFixed(0)} req/s (p50 ${units.p50.toFixed(1)} ms, p95 ${units.p95.toFixed(1)} ms), failed ${units.failed}`;
    results['throughput ratio units ÷ health (aim ≥ 0.25)'] = (units.rps / health.rps).toFixed(2);
    results['GET units with If-None-Match (304) ÷ health'] = (notModified.rps / health.rps).toFixed(2);
  } finally {
    server.kill('SIGTERM');
  }
}

await computations();
if (!process.argv.includes('--no-http')) await http();
console.log('\nBrowseline benchmarks');
for (const [k, v] of Object.entries(results)) console.log(`  ${k}: ${v}`);
process.exit(0);
