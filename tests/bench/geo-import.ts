/**
 * Benchmark (not a test): geo-file imports against the real server in a child process.
 *
 * 1. A 10 MB KML imported through POST /api/properties/:id/imports, interleaved with a baseline:
 *    each round first measures GET /api/health alone, then again while one import runs; prints
 *    the import time (median) and /api/health p50/p99 in both windows.
 * 2. Uploads built to exhaust the server (a shapefile zip of four 200 MB entries, a GeoTIFF
 *    declaring 8192 × 8192 pixels, a 1,000,000-vertex GeoJSON): time to the answer, its status,
 *    and the server's resident memory before and at its peak during each one (/proc/PID/status).
 *
 * Run: `npx tsx tests/bench/geo-import.ts [rounds] [--no-attacks]` (uses the test PostgreSQL cluster on TEST_DB_PORT).
 */
import { execFileSync, spawn } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { generateLargeKml } from '../support/geo-fixtures-large';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { freePort } from '../support/e2e-setup';
import { shapefileBomb } from '../support/zip-bytes';
import { tiffHeaderOnly } from '../support/tiff-bytes';
import { median, percentile, waitForHealth } from './support';

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
const rounds = Number(process.argv.find((a) => /^\d+$/.test(a)) ?? 5);
/** `--no-attacks` skips the upload attacks (e.g. against older code, which they would exhaust). */
const attacksToo = !process.argv.includes('--no-attacks');

/** Resident memory of a process now and its peak since the last reset, MB (Linux /proc). */
function memoryMb(pid: number): { rss: number; peak: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (key: string) => Number(new RegExp(`${key}:\\s+(\\d+)`).exec(status)?.[1] ?? 0);
  return { rss: kb('VmRSS') / 1024, peak: kb('VmHWM') / 1024 };
}

/** Resets the kernel's peak-RSS mark of a process (writing 5 to clear_refs; needs the same user or root). */
function resetPeak(pid: number): void {
  try {
    writeFileSync(`/proc/${pid}/clear_refs`, '5');
  } catch {
    /* the peak then counts from the start */
  }
}

/** GET /api/health from `connections` loops until `until()` says stop; answers each latency in ms. */
async function probe(url: string, connections: number, until: () => boolean): Promise<number[]> {
  const latencies: number[] = [];
  const loop = async () => {
    while (!until()) {
      const t0 = performance.now();
      const res = await fetch(url);
      await res.arrayBuffer();
      latencies.push(performance.now() - t0);
    }
  };
  await Promise.all(Array.from({ length: connections }, loop));
  return latencies;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main() {
  startTestCluster();
  const databaseUrl = await freshDatabase('browseline_bench_geo');
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env = { ...process.env, DATABASE_URL: databaseUrl, PORT: String(port), LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '60000', SESSION_SECRET: 'bench' };
  execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env, stdio: 'ignore' });
  execFileSync(tsx, [path.join(root, 'tests/bench/seed-plan.ts')], { env, stdio: 'inherit' });
  // node itself (not the tsx wrapper), so that /proc/PID is the server's own memory.
  const server = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/index.ts')], { env, stdio: process.env.BENCH_SERVER_LOG ? 'inherit' : 'ignore', cwd: root });
  const results: Record<string, string> = {};
  try {
    await waitForHealth(base);
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@browseline.test', password: 'bench-password-1' }) });
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0];
    const csrf = ((await login.json()) as { csrfToken: string }).csrfToken;
    const props = (await (await fetch(`${base}/api/properties`, { headers: { cookie } })).json()) as { data: { id: number }[] };
    const importUrl = `${base}/api/properties/${props.data[0].id}/imports`;
    const send = async (bytes: Buffer, name: string) => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)]), name);
      const t0 = performance.now();
      const res = await fetch(importUrl, { method: 'POST', headers: { cookie, 'x-csrf-token': csrf }, body: form });
      const text = await res.text();
      return { ms: performance.now() - t0, status: res.status, bytes: text.length, text };
    };

    const kml = generateLargeKml({ targetBytes: 10 * 1024 * 1024 });
    const health = `${base}/api/health`;
    results['server RSS after start'] = `${memoryMb(server.pid!).rss.toFixed(0)} MB`;
    await send(kml.buffer, 'warm-up.kml'); // starts the worker's modules
    await probe(health, 4, ((t) => () => performance.now() > t)(performance.now() + 1000));

    const importMs: number[] = [];
    const baseline: number[] = [];
    const during: number[] = [];
    let answerBytes = 0;
    let status = 0;
    for (let r = 0; r < rounds; r++) {
      // Baseline window: health alone, 1.5 s.
      const stopAt = performance.now() + 1500;
      baseline.push(...(await probe(health, 4, () => performance.now() > stopAt)));
      // Import window: health while one 10 MB KML import runs.
      let done = false;
      const probing = probe(health, 4, () => done);
      const answer = await send(kml.buffer, 'large.kml');
      done = true;
      during.push(...(await probing));
      importMs.push(answer.ms);
      answerBytes = answer.bytes;
      status = answer.status;
    }
    results[`KML import, ${(kml.buffer.length / 1048576).toFixed(1)} MB, ${kml.placemarkCount} placemarks (median of ${rounds}, answer ${status})`] = `${(median(importMs) / 1000).toFixed(2)} s (runs: ${importMs.map((m) => (m / 1000).toFixed(2)).join(', ')})`;
    results['import answer size'] = `${(answerBytes / 1048576).toFixed(2)} MB`;
    results['GET /api/health alone (baseline), 4 connections'] = `p50 ${percentile(baseline, 50).toFixed(1)} ms, p99 ${percentile(baseline, 99).toFixed(1)} ms, max ${Math.max(...baseline).toFixed(0)} ms (${baseline.length} requests)`;
    results['GET /api/health during the imports'] = `p50 ${percentile(during, 50).toFixed(1)} ms, p99 ${percentile(during, 99).toFixed(1)} ms, max ${Math.max(...during).toFixed(0)} ms (${during.length} requests)`;
    results['health p99 ratio during ÷ baseline'] = (percentile(during, 99) / percentile(baseline, 99)).toFixed(2);
    await sleep(2000);
    results['server RSS 2 s after the KML imports'] = `${memoryMb(server.pid!).rss.toFixed(0)} MB`;

    // Attacks: time to the answer, and the server's memory before and at its peak during each.
    const ring: string[] = [];
    for (let i = 0; i < 1_000_000; i += 1) ring.push(`[${(-93 + i * 1e-7).toFixed(7)},41.5]`);
    const attacks: [string, () => Promise<{ ms: number; status: number; text: string }>][] = [
      ['shapefile zip, four 200 MB entries', async () => send(await shapefileBomb(), 'parcels.zip')],
      [
        'GeoTIFF declaring 8192 × 8192 pixels',
        async () => {
          const form = new FormData();
          form.append('file', new Blob([new Uint8Array(tiffHeaderOnly(8192, 8192))]), 'ortho.tif');
          const t0 = performance.now();
          const res = await fetch(`${base}/api/properties/${props.data[0].id}/overlays`, { method: 'POST', headers: { cookie, 'x-csrf-token': csrf }, body: form });
          const text = await res.text();
          return { ms: performance.now() - t0, status: res.status, text };
        },
      ],
      ['GeoJSON of 1,000,000 vertices', async () => send(Buffer.from(`{"type":"FeatureCollection","features":[{"type":"Feature","properties":{},"geometry":{"type":"LineString","coordinates":[${ring.join(',')}]}}]}`), 'huge.geojson')],
    ];
    for (const [name, attack] of attacksToo ? attacks : []) {
      await sleep(500);
      const before = memoryMb(server.pid!);
      resetPeak(server.pid!);
      let sampledPeak = before.rss;
      let sampling = true;
      const sampler = (async () => {
        while (sampling) {
          sampledPeak = Math.max(sampledPeak, memoryMb(server.pid!).rss);
          await sleep(20);
        }
      })();
      const answer = await attack();
      sampling = false;
      await sampler;
      const after = memoryMb(server.pid!);
      const message = (() => {
        try {
          return (JSON.parse(answer.text) as { error?: string }).error ?? '';
        } catch {
          return answer.text.slice(0, 80);
        }
      })();
      results[`attack: ${name}`] = `${answer.status} in ${answer.ms.toFixed(0)} ms; server RSS ${before.rss.toFixed(0)} MB before, peak ${Math.max(after.peak, sampledPeak).toFixed(0)} MB, ${after.rss.toFixed(0)} MB after — "${message.slice(0, 90)}…"`;
    }
  } finally {
    server.kill('SIGTERM');
    await dropDatabase(databaseUrl);
  }
  console.log('\nGeo import benchmark');
  for (const [k, v] of Object.entries(results)) console.log(`  ${k}: ${v}`);
}

await main();
process.exit(0);
