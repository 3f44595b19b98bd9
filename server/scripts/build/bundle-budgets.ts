/**
 * Bundle budgets over Vite's build manifest: what each audience downloads on its first load
 * (JS + CSS, gzip), and where the map code may appear. `npm run build` runs `main()` after
 * `vite build`; it prints a table and exits non-zero when a budget is exceeded.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';

/** One chunk of `dist/.vite/manifest.json`. */
export interface ManifestChunk {
  file: string;
  name?: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
}
export type Manifest = Record<string, ManifestChunk>;

export interface RouteBudget {
  /** What a person opens, as the note calls it. */
  label: string;
  /** The HTML page it opens (a manifest entry): index.html is the sign-in page, src/app.html the app. */
  entry: 'index.html' | 'src/app.html';
  /** The route's modules (manifest keys) that load on its first visit, besides the entry. */
  modules: string[];
  /** The most JS + CSS (gzip, bytes) its first load may download. */
  maxGzipBytes: number;
  /** Whether map code (maplibre, terra-draw) may load with it. */
  mapAllowed: boolean;
}

const KB = 1000;

/** The budgets of the issue: sign-in ≤ 100 KB, field sheet and portal home ≤ 150 KB, Desk ≤ 250 KB, map code only on map pages. */
export const ROUTE_BUDGETS: RouteBudget[] = [
  { label: 'sign-in', entry: 'index.html', modules: [], maxGzipBytes: 100 * KB, mapAllowed: false },
  {
    label: 'field sheet',
    entry: 'src/app.html',
    modules: ['src/app/layouts/field-layout.tsx', 'src/app/routes/field/field-shell.tsx', 'src/app/routes/field/field-home.tsx'],
    maxGzipBytes: 150 * KB,
    mapAllowed: false,
  },
  {
    label: 'field task',
    entry: 'src/app.html',
    modules: ['src/app/layouts/field-layout.tsx', 'src/app/routes/field/field-shell.tsx', 'src/app/routes/field/field-task.tsx'],
    maxGzipBytes: 150 * KB,
    mapAllowed: false,
  },
  { label: 'portal home', entry: 'src/app.html', modules: ['src/app/layouts/portal-layout.tsx', 'src/app/routes/portal/portal-home.tsx'], maxGzipBytes: 150 * KB, mapAllowed: false },
  { label: 'Desk', entry: 'src/app.html', modules: ['src/app/layouts/consultant-layout.tsx', 'src/app/routes/desk/desk.tsx'], maxGzipBytes: 250 * KB, mapAllowed: false },
];

/** Map libraries: their code belongs to the map pages only. */
export const MAP_CODE = /maplibre|terra-draw/i;

/** Every file (JS and CSS) a first load of these modules downloads: the modules and their static imports, transitively. */
export function firstLoadFiles(manifest: Manifest, keys: string[]): { files: string[]; chunks: string[] } {
  const seen = new Set<string>();
  const files = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    const chunk = manifest[key];
    if (!chunk) throw new Error(`The build manifest has no chunk ${key}: update ROUTE_BUDGETS in server/scripts/build/bundle-budgets.ts.`);
    seen.add(key);
    files.add(chunk.file);
    for (const css of chunk.css ?? []) files.add(css);
    for (const dep of chunk.imports ?? []) visit(dep);
  };
  for (const key of keys) visit(key);
  return { files: [...files], chunks: [...seen] };
}

/** Whether a chunk carries map code, by its source, name or file. */
export function isMapChunk(manifest: Manifest, key: string): boolean {
  const c = manifest[key];
  return MAP_CODE.test(key) || MAP_CODE.test(c.name ?? '') || MAP_CODE.test(c.file);
}

/** The JS and CSS files named by the built index.html (script, modulepreload, stylesheet). */
export function indexHtmlFiles(html: string): string[] {
  const out: string[] = [];
  for (const m of html.matchAll(/<(?:script|link)\b[^>]*?(?:src|href)="\/?([^"]+\.(?:js|mjs|css))"/g)) out.push(m[1]);
  return out;
}

/** Every page module of the field sheet and the portal: with the app entry, the app shell the service worker keeps for no signal. */
export const OFFLINE_PAGES = [
  'src/app/layouts/field-layout.tsx',
  'src/app/routes/field/field-shell.tsx',
  'src/app/routes/field/field-home.tsx',
  'src/app/routes/field/field-task.tsx',
  'src/features/field/components/unit-map.tsx',
  'src/features/field/components/directions.tsx',
  'src/features/field/components/complete-form.tsx',
  'src/features/field/components/skip-form.tsx',
  'src/features/field/components/check-form.tsx',
  'src/features/field/components/calendar-feeds-card.tsx',
  'src/app/layouts/portal-layout.tsx',
  'src/app/routes/portal/portal-home.tsx',
  'src/app/routes/portal/portal-property.tsx',
  'src/app/routes/portal/portal-progress.tsx',
  'src/app/routes/portal/portal-files.tsx',
  'src/app/routes/portal/portal-proposals.tsx',
  'src/app/routes/portal/portal-proposal.tsx',
  'src/app/routes/portal/portal-invoices.tsx',
  'src/app/routes/portal/portal-invoice.tsx',
  'src/app/routes/portal/portal-results.tsx',
];

/** The files (relative to dist, e.g. `assets/x.js`) of the app shell: src/app.html's code and the offline pages' first loads. */
export function shellFiles(dist: string): Set<string> {
  const manifest = JSON.parse(fs.readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8')) as Manifest;
  const keys = ['src/app.html', ...OFFLINE_PAGES.filter((k) => manifest[k])];
  return new Set(firstLoadFiles(manifest, keys).files);
}

export interface BudgetResult {
  label: string;
  gzipBytes: number;
  maxGzipBytes: number;
  files: number;
  problems: string[];
}

/** Checks every budget against a built `dist` folder. */
export function checkBudgets(dist: string, budgets = ROUTE_BUDGETS): BudgetResult[] {
  const manifest = JSON.parse(fs.readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8')) as Manifest;
  const gzipCache = new Map<string, number>();
  const gzipSize = (file: string) => {
    if (!gzipCache.has(file)) gzipCache.set(file, zlib.gzipSync(fs.readFileSync(path.join(dist, file))).length);
    return gzipCache.get(file)!;
  };
  const results: BudgetResult[] = [];

  const html = indexHtmlFiles(fs.readFileSync(path.join(dist, 'index.html'), 'utf8'));
  const htmlBytes = html.reduce((sum, f) => sum + gzipSize(f), 0);
  results.push({ label: 'index.html (what every page downloads first)', gzipBytes: htmlBytes, maxGzipBytes: 100 * KB, files: html.length, problems: htmlBytes > 100 * KB ? [`index.html names ${(htmlBytes / KB).toFixed(1)} KB gzip of JS and CSS; at most 100 KB`] : [] });

  for (const b of budgets) {
    const { files, chunks } = firstLoadFiles(manifest, [b.entry, ...b.modules]);
    const gzipBytes = files.reduce((sum, f) => sum + gzipSize(f), 0);
    const problems: string[] = [];
    if (gzipBytes > b.maxGzipBytes) problems.push(`${b.label} first load is ${(gzipBytes / KB).toFixed(1)} KB gzip; the budget is ${b.maxGzipBytes / KB} KB`);
    if (!b.mapAllowed) for (const c of chunks.filter((k) => isMapChunk(manifest, k))) problems.push(`${b.label} loads map code (${manifest[c].file}); map code belongs to the map pages only`);
    results.push({ label: b.label, gzipBytes, maxGzipBytes: b.maxGzipBytes, files: files.length, problems });
  }
  return results;
}

/** Prints the table; answers the process exit code. */
export function main(dist = path.resolve(import.meta.dirname, '../../../dist')): number {
  const results = checkBudgets(dist);
  console.log('Bundle budgets (first load, JS + CSS, gzip):');
  for (const r of results) console.log(`  ${r.problems.length ? '✗' : '✓'} ${r.label.padEnd(46)} ${(r.gzipBytes / KB).toFixed(1).padStart(7)} KB of ${r.maxGzipBytes / KB} KB (${r.files} files)`);
  const problems = results.flatMap((r) => r.problems);
  for (const p of problems) console.error(`Budget exceeded: ${p}`);
  return problems.length ? 1 : 0;
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) process.exit(main(process.argv[2] ? path.resolve(process.argv[2]) : undefined));
