/**
 * Benchmark (not a test): how long the request thread's event loop waits while heavy work runs
 * (issue "fast on a phone…", item 7: never block it for more than 100 ms). The real app runs in
 * this process on the test PostgreSQL cluster, so `monitorEventLoopDelay` sees the very loop that
 * answers requests. For each piece of heavy work, round by round (interleaved):
 *
 * 1. a baseline window: GET /api/health from two loops alone, as long as the work took last time;
 * 2. a work window: the same probes while the work runs once.
 *
 * It prints the work's median time, the longest and p99 event-loop delay in each window, and
 * /api/health's p99 in each window. The work: a proposal PDF (40 lines, plan map, an aerial photo),
 * four sign-ins at once (bcrypt in the request thread as before, and in its worker as now),
 * the plan PDF of a 500-unit property (GET …/plan.pdf), a season report PDF (charts, four photos),
 * a 10 MB KML import (POST …/imports) and a 4000 × 3000 orthophoto overlay upload (POST …/overlays).
 *
 * Run: `npx tsx tests/bench/event-loop.ts [rounds] [--only=<label text>]` (also part of `npm run bench`).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { monitorEventLoopDelay, performance } from 'node:perf_hooks';
import sharp from 'sharp';
import { generateLargeKml } from '../support/geo-fixtures-large';
import { dropDatabase, freshDatabase, startTestCluster } from '../support/test-db';
import { couleeBendProposal, FIXTURE_LINES, type FixtureLine } from '../support/proposal-fixtures';
import { median, percentile } from './support';

const root = path.resolve(import.meta.dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');
const rounds = Number(process.argv.find((a) => /^\d+$/.test(a)) ?? 5);

/** A photo-like JPEG (noise compresses like a real aerial photo does not: the worst case for size). */
async function aerialJpeg(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 96, g: 118, b: 70 }, noise: { type: 'gaussian', mean: 110, sigma: 40 } } })
    .jpeg({ quality: 85 })
    .toBuffer();
}

/** 40 proposal lines: the fixture's 12, then 28 more over the same units. */
function fortyLines(): FixtureLine[] {
  const lines = [...FIXTURE_LINES];
  for (let i = 0; lines.length < 40; i++) {
    const base = FIXTURE_LINES[i % FIXTURE_LINES.length];
    lines.push({ ...base, id: 1000 + i, description: `${base.description} (phase ${Math.floor(i / FIXTURE_LINES.length) + 2})` });
  }
  return lines;
}

let probeErrors = 0;

/** GET /api/health from `connections` loops until `until()` says stop; answers each latency in ms. */
async function probe(url: string, connections: number, until: () => boolean): Promise<number[]> {
  const latencies: number[] = [];
  const loop = async () => {
    while (!until()) {
      const t0 = performance.now();
      try {
        const res = await fetch(url);
        await res.arrayBuffer();
      } catch {
        // A kept-alive connection the server closed as it was reused: counted at its time, tried again.
        probeErrors++;
      }
      latencies.push(performance.now() - t0);
    }
  };
  await Promise.all(Array.from({ length: connections }, loop));
  return latencies;
}

interface Window {
  loopMax: number[];
  loopP99: number[];
  health: number[];
}
const emptyWindow = (): Window => ({ loopMax: [], loopP99: [], health: [] });

async function main() {
  startTestCluster();
  const uploads = mkdtempSync(path.join(tmpdir(), 'browseline-bench-uploads-'));
  const databaseUrl = await freshDatabase('browseline_bench_loop');
  Object.assign(process.env, { DATABASE_URL: databaseUrl, LOG_LEVEL: 'warn', NODE_ENV: 'production', OUTBOX_POLL_MS: '60000', SESSION_SECRET: 'bench', UPLOADS_DIR: uploads });
  execFileSync(tsx, [path.join(root, 'server/scripts/migrate.ts')], { env: process.env, stdio: 'ignore' });
  execFileSync(tsx, [path.join(root, 'tests/bench/seed-plan.ts')], { env: process.env, stdio: 'inherit' });
  const { createApp } = await import('../../server/app');
  const { warmGeoWorkers, closeGeoWorkers } = await import('../../server/services/geo-work/geo-pool');
  const { warmPdfWorkers, closePdfWorkers, pdfWorkersReady } = await import('../../server/services/documents/pdf-pool');
  const { renderProposalPdf, renderSeasonReportPdf } = await import('../../server/services/documents/render-documents');
  const { printSizeImage } = await import('../../server/services/documents/overlay-print');
  const { harvestSummary } = await import('../../shared/domain/survey-estimates');
  const { sequelize } = await import('../../server/db/sequelize');
  warmGeoWorkers();
  warmPdfWorkers();
  await pdfWorkersReady();
  const server = createApp().listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const health = `${base}/api/health`;
  const results: string[] = [];
  try {
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@browseline.test', password: 'bench-password-1' }) });
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0];
    const csrf = ((await login.json()) as { csrfToken: string }).csrfToken;
    const props = (await (await fetch(`${base}/api/properties`, { headers: { cookie } })).json()) as { data: { id: number }[] };
    const propertyId = props.data[0].id;

    // Inputs made once, before any window.
    const aerial = await printSizeImage(await aerialJpeg(2400, 1800));
    const aerialUrl = `data:image/${aerial.kind};base64,${aerial.bytes.toString('base64')}`;
    const photo = `data:image/jpeg;base64,${(await aerialJpeg(1200, 900)).toString('base64')}`;
    const orthophoto = await aerialJpeg(4000, 3000);
    const kml = generateLargeKml({ targetBytes: 10 * 1024 * 1024 });
    const proposalInput = () => ({
      ...couleeBendProposal({ lines: fortyLines(), introduction: null }),
      overlays: [{ image: aerialUrl, corners: [[-90.94, 43.276], [-90.92, 43.276], [-90.92, 43.264], [-90.94, 43.264]] as [number, number][], opacity: 0.8, credit: 'Bench orthophoto' }],
    });
    const seasonInput = () => ({
      firm: { name: 'Driftless Habitat Works', phone: null, email: null },
      client: { name: 'Marta and Jon Lindqvist' },
      property: { name: 'Coulee Bend', acres: 212.4, locality: 'Crawford County, Wisconsin' },
      season: { label: '2025–26', startsOn: '2025-07-01', endsOn: '2026-06-30' },
      preparedOn: '2026-07-02',
      work: Array.from({ length: 30 }, (_, i) => ({ name: `Task ${i + 1}`, unitName: `Unit ${(i % 8) + 1}`, practiceName: 'Frost seeding', doneOn: '2025-09-12' })),
      acresEstablished: 6.4,
      unitsEstablished: [{ name: 'Ridge plot', acres: 2.1 }, { name: 'Hollow plot', acres: 4.3 }],
      photos: Array.from({ length: 4 }, (_, i) => ({ dataUrl: photo, caption: `Plot ${i + 1} in September` })),
      surveys: [],
      surveyTrend: [],
      harvest: harvestSummary([{ date: '2025-11-22', sex: 'buck', ageClass: '3.5', dressedWeightLb: 162 }, { date: '2025-12-13', sex: 'doe', ageClass: '1.5', dressedWeightLb: 81 }]),
      harvestTrend: [],
      recommendations: 'Keep the clover mowed before seed heads form; frost-seed the thin spots in March.',
      cautions: [],
      observations: { total: 5, byKind: [{ label: 'Scrape', count: 3 }, { label: 'Rub', count: 2 }], byUnit: [{ label: 'Ridge plot', count: 5 }], byMonth: [{ label: 'Oct 2025', count: 2 }, { label: 'Nov 2025', count: 3 }] },
    });
    const upload = async (url: string, bytes: Buffer, name: string, fields: Record<string, string> = {}) => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)]), name);
      for (const [k, v] of Object.entries(fields)) form.append(k, v);
      const res = await fetch(url, { method: 'POST', headers: { cookie, 'x-csrf-token': csrf }, body: form });
      const text = await res.text();
      if (!res.ok) throw new Error(`${url}: ${res.status} ${text.slice(0, 200)}`);
    };
    const corners = JSON.stringify([[-90.96, 43.29], [-90.9, 43.29], [-90.9, 43.25], [-90.96, 43.25]]);
    /** Four sign-ins at once (bcrypt cost 11), with the hashing in a worker thread or, as before, in this one. */
    const signIns = async (passwordWorkers: string) => {
      process.env.PASSWORD_WORKERS = passwordWorkers;
      try {
        const answers = await Promise.all(
          Array.from({ length: 4 }, () =>
            fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'bench@browseline.test', password: 'bench-password-1' }) }),
          ),
        );
        for (const a of answers) if (!a.ok) throw new Error(`sign-in: ${a.status}`);
      } finally {
        delete process.env.PASSWORD_WORKERS;
      }
    };
    const works: { label: string; run: () => Promise<unknown> }[] = [
      { label: 'sign-in ×4, bcrypt in the request thread (before)', run: () => signIns('0') },
      { label: 'sign-in ×4, bcrypt in a worker thread (now)', run: () => signIns('1') },
      { label: 'proposal PDF (40 lines, plan map, aerial photo)', run: () => renderProposalPdf(proposalInput() as never) },
      {
        label: 'plan PDF, 500 units (GET …/plan.pdf)',
        run: async () => {
          const res = await fetch(`${base}/api/properties/${propertyId}/plan.pdf`, { headers: { cookie } });
          await res.arrayBuffer();
          if (!res.ok) throw new Error(`plan.pdf: ${res.status}`);
        },
      },
      { label: 'season report PDF (4 photos, charts)', run: () => renderSeasonReportPdf(seasonInput() as never) },
      { label: `KML import, ${(kml.buffer.length / 1048576).toFixed(1)} MB (POST …/imports)`, run: () => upload(`${base}/api/properties/${propertyId}/imports`, kml.buffer, 'large.kml') },
      { label: 'orthophoto overlay, 4000 × 3000 JPEG (POST …/overlays)', run: () => upload(`${base}/api/properties/${propertyId}/overlays`, orthophoto, 'ortho.jpg', { corners, name: 'Bench ortho' }) },
    ];

    const loop = monitorEventLoopDelay({ resolution: 5 });
    loop.enable();
    /** One window: probes running beside `work` (or alone for `ms`); the loop's delay and health's latencies in it. */
    const windowOf = async (into: Window, work: (() => Promise<unknown>) | number): Promise<number> => {
      let done = false;
      loop.reset();
      const t0 = performance.now();
      const probing = probe(health, 2, () => done);
      if (typeof work === 'number') await new Promise((r) => setTimeout(r, work));
      else await work();
      const ms = performance.now() - t0;
      done = true;
      into.health.push(...(await probing));
      into.loopMax.push(loop.max / 1e6);
      into.loopP99.push(loop.percentile(99) / 1e6);
      return ms;
    };
    // `--only=plan` runs the pieces of work whose label contains that text.
    const only = process.argv.find((a) => a.startsWith('--only='))?.slice('--only='.length);
    for (const work of works.filter((w) => !only || w.label.includes(only))) {
      process.stderr.write(`event-loop bench: ${work.label}\n`);
      for (let i = 0; i < 2; i++) await work.run(); // warm-up: modules, JIT, worker caches
      const baseline = emptyWindow();
      const during = emptyWindow();
      const times: number[] = [];
      let last = 500;
      for (let r = 0; r < rounds; r++) {
        await windowOf(baseline, Math.max(300, last));
        last = await windowOf(during, work.run);
        times.push(last);
      }
      const f = (n: number) => n.toFixed(0);
      results.push(
        `${work.label}: ${f(median(times))} ms median; event-loop delay max ${f(Math.max(...during.loopMax))} ms (worst round), p99 ${f(median(during.loopP99))} ms` +
          ` [alone: max ${f(Math.max(...baseline.loopMax))}, p99 ${f(median(baseline.loopP99))}]; /api/health p99 ${f(percentile(during.health, 99))} ms [alone ${f(percentile(baseline.health, 99))} ms]` +
          `; max per round: ${during.loopMax.map(f).join(', ')}`,
      );
    }
    loop.disable();
  } finally {
    server.close();
    server.closeAllConnections?.();
    await closePdfWorkers();
    await closeGeoWorkers();
    await sequelize.close();
    await dropDatabase(databaseUrl);
    rmSync(uploads, { recursive: true, force: true });
  }
  console.log(`\nEvent loop of the request thread during heavy work (goal: max ≤ 100 ms; ${rounds} rounds each)`);
  for (const line of results) console.log(`  ${line}`);
  if (probeErrors) console.log(`  (${probeErrors} health probes met a closed connection and were retried)`);
}

await main();
process.exit(0);
