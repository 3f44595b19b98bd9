/**
 * Plan map frame times while panning, with 500 units against an empty plan. Not a test: prints the
 * median and 95th percentile of requestAnimationFrame intervals and their ratio.
 *
 *   npx vite build && PORT=3102 DATABASE_URL=… npx tsx server/index.ts   (a server with demo data)
 *   npx tsx tests/bench/plan-map-frames.ts http://127.0.0.1:3102 [units=500] [panMs=5000]
 *
 * It signs in as the demo consultant and creates its own client and two properties (nothing of the
 * demo data is changed), then pans each plan map in headless Chromium through window.__planMapStats.
 */
import type { Page } from 'playwright-core';
import type { Polygon } from 'geojson';
import { launchBrowser, signIn } from '../support/browser';
import { UNIT_KINDS, KIND_STYLES } from '../../shared/domain/unit-kinds';
import type { UnitCreateInput } from '../../shared/schemas/unit';

const base = process.argv[2] ?? 'http://127.0.0.1:3102';
const unitCount = Number(process.argv[3] ?? 500);
const panMs = Number(process.argv[4] ?? 5000);

const W = -90.76;
const S = 43.44;
const SIDE_DEG = 0.03; // about 2.4 km × 3.3 km, some 2,000 acres

const boundary: Polygon = { type: 'Polygon', coordinates: [[[W, S], [W + SIDE_DEG * 1.4, S], [W + SIDE_DEG * 1.4, S + SIDE_DEG], [W, S + SIDE_DEG], [W, S]]] };

/** Units on a grid inside the boundary, cycling through every kind (areas, lines and points). */
function gridUnits(n: number): UnitCreateInput[] {
  const cols = Math.ceil(Math.sqrt(n * 1.4));
  const rows = Math.ceil(n / cols);
  const dx = (SIDE_DEG * 1.4) / cols;
  const dy = SIDE_DEG / rows;
  const units: UnitCreateInput[] = [];
  for (let i = 0; i < n; i += 1) {
    const kind = UNIT_KINDS[i % UNIT_KINDS.length];
    const x = W + (i % cols) * dx + dx * 0.15;
    const y = S + Math.floor(i / cols) * dy + dy * 0.15;
    const w = dx * 0.7;
    const h = dy * 0.7;
    const family = KIND_STYLES[kind].family;
    const geometry =
      family === 'area'
        ? { type: 'Polygon' as const, coordinates: [[[x, y], [x + w, y], [x + w * 0.9, y + h], [x + w * 0.1, y + h * 0.8], [x, y]]] }
        : family === 'line'
          ? { type: 'LineString' as const, coordinates: [[x, y], [x + w * 0.5, y + h], [x + w, y + h * 0.2]] }
          : { type: 'Point' as const, coordinates: [x + w / 2, y + h / 2] };
    units.push({ kind, name: `${KIND_STYLES[kind].label} ${i + 1}`, geometry });
  }
  return units;
}

async function post<T>(page: Page, url: string, body: unknown): Promise<T> {
  const { csrfToken } = (await (await page.request.get(`${base}/api/auth/csrf`)).json()) as { csrfToken: string };
  const res = await page.request.post(`${base}${url}`, { data: body, headers: { 'X-CSRF-Token': csrfToken } });
  if (!res.ok()) throw new Error(`${url} answered ${res.status()}: ${await res.text()}`);
  return ((await res.json()) as { data: T }).data;
}

async function measure(page: Page, propertyId: number): Promise<{ frames: number; medianMs: number; p95Ms: number; maxMs: number }> {
  await page.goto(`${base}/properties/${propertyId}/map`);
  await page.getByRole('heading', { name: /^Units/ }).waitFor({ timeout: 30_000 });
  await page.waitForFunction(() => window.__planMapStats !== undefined);
  await page.waitForTimeout(1500);
  return page.evaluate((ms) => window.__planMapStats!.pan(ms), panMs);
}

const browser = await launchBrowser();
try {
  const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
  await signIn(page, base, 'consultant@browseline.test');
  await page.waitForURL(/\/desk$/);
  const stamp = new Date().toISOString().slice(0, 16);
  const client = await post<{ id: number }>(page, '/api/clients', { name: `Frame-time bench ${stamp}` });
  const empty = await post<{ id: number }>(page, '/api/properties', { clientId: client.id, name: 'Bench, no units', boundary });
  const full = await post<{ id: number }>(page, '/api/properties', { clientId: client.id, name: `Bench, ${unitCount} units`, boundary });
  await post(page, `/api/properties/${full.id}/units/bulk`, { units: gridUnits(unitCount) });

  console.log(`bench properties: ${empty.id} (no units), ${full.id} (${unitCount} units)`);
  const none = await measure(page, empty.id);
  const many = await measure(page, full.id);
  const f = (v: number) => v.toFixed(1).padStart(6);
  console.log(`plan map pan, ${panMs} ms each, headless Chromium (SwiftShader), 1440×900`);
  console.log(`  units  frames  median ms  p95 ms  max ms`);
  console.log(`      0  ${String(none.frames).padStart(6)}  ${f(none.medianMs)}    ${f(none.p95Ms)}  ${f(none.maxMs)}`);
  console.log(`  ${String(unitCount).padStart(5)}  ${String(many.frames).padStart(6)}  ${f(many.medianMs)}    ${f(many.p95Ms)}  ${f(many.maxMs)}`);
  console.log(`  ratio ${unitCount}/0: median ${(many.medianMs / none.medianMs).toFixed(2)}, p95 ${(many.p95Ms / none.p95Ms).toFixed(2)}`);
} finally {
  await browser.close();
}
