import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkBudgets, firstLoadFiles, indexHtmlFiles, isMapChunk, type Manifest, type RouteBudget } from '../../../server/scripts/build/bundle-budgets';

const manifest: Manifest = {
  'index.html': { file: 'assets/index-a.js', isEntry: true, imports: ['_react-b.js'], css: ['assets/styles-c.css'], dynamicImports: ['shared/schemas/auth.ts'] },
  'src/app.html': { file: 'assets/app-d.js', isEntry: true, imports: ['_react-b.js', '_libs-e.js'], css: ['assets/styles-c.css'] },
  '_react-b.js': { file: 'assets/react-b.js' },
  '_libs-e.js': { file: 'assets/libs-e.js' },
  'shared/schemas/auth.ts': { file: 'assets/auth-f.js', isDynamicEntry: true },
  'src/app/routes/field/field-home.tsx': { file: 'assets/field-home-g.js', isDynamicEntry: true, imports: ['_libs-e.js'] },
  'src/app/routes/properties/plan-map.tsx': { file: 'assets/plan-map-h.js', isDynamicEntry: true, imports: ['_maplibre-worker-i.js'] },
  '_maplibre-worker-i.js': { file: 'assets/maplibre-worker-i.js', name: 'maplibre-worker' },
};

describe('first-load closure over the build manifest', () => {
  it('follows static imports and CSS, never dynamic imports', () => {
    expect(firstLoadFiles(manifest, ['index.html']).files.sort()).toEqual(['assets/index-a.js', 'assets/react-b.js', 'assets/styles-c.css']);
    expect(firstLoadFiles(manifest, ['src/app.html', 'src/app/routes/field/field-home.tsx']).files).toHaveLength(5);
  });

  it('recognises map code by chunk name or file', () => {
    expect(isMapChunk(manifest, '_maplibre-worker-i.js')).toBe(true);
    expect(isMapChunk(manifest, '_libs-e.js')).toBe(false);
  });

  it('reads the scripts, preloads and stylesheets named by index.html', () => {
    const html = '<script type="module" crossorigin src="/assets/index-a.js"></script><link rel="modulepreload" crossorigin href="/assets/react-b.js"><link rel="stylesheet" crossorigin href="/assets/styles-c.css"><link rel="icon" href="/favicon.svg">';
    expect(indexHtmlFiles(html)).toEqual(['assets/index-a.js', 'assets/react-b.js', 'assets/styles-c.css']);
  });
});

describe('budgets against a built folder', () => {
  let dist: string;
  /** Random bytes do not compress: their gzip is about their size. */
  const noise = (n: number) => crypto.randomBytes(n);
  beforeAll(() => {
    dist = fs.mkdtempSync(path.join(os.tmpdir(), 'browseline-budget-'));
    fs.mkdirSync(path.join(dist, '.vite'), { recursive: true });
    fs.mkdirSync(path.join(dist, 'assets'));
    fs.writeFileSync(path.join(dist, '.vite/manifest.json'), JSON.stringify(manifest));
    fs.writeFileSync(path.join(dist, 'index.html'), '<script type="module" src="/assets/index-a.js"></script><link rel="modulepreload" href="/assets/react-b.js"><link rel="stylesheet" href="/assets/styles-c.css">');
    for (const c of Object.values(manifest)) fs.writeFileSync(path.join(dist, c.file), c.file.includes('react') ? noise(60_000) : c.file.includes('plan-map') || c.file.includes('maplibre') ? noise(120_000) : 'x');
    fs.writeFileSync(path.join(dist, 'assets/styles-c.css'), 'body{}');
  });
  afterAll(() => fs.rmSync(dist, { recursive: true, force: true }));

  it('passes a page under its budget and fails one over it, or one that loads map code', () => {
    const budgets: RouteBudget[] = [
      { label: 'small', entry: 'index.html', modules: [], maxGzipBytes: 100_000, mapAllowed: false },
      { label: 'tight', entry: 'src/app.html', modules: ['src/app/routes/field/field-home.tsx'], maxGzipBytes: 30_000, mapAllowed: false },
      { label: 'map on a field page', entry: 'src/app.html', modules: ['src/app/routes/properties/plan-map.tsx'], maxGzipBytes: 1_000_000, mapAllowed: false },
    ];
    const [html, small, tight, map] = checkBudgets(dist, budgets);
    expect(html.problems).toEqual([]);
    expect(small.problems).toEqual([]);
    expect(small.gzipBytes).toBeGreaterThan(50_000);
    expect(tight.problems[0]).toMatch(/tight first load is .* KB gzip; the budget is 30 KB/);
    expect(map.problems.some((p) => /loads map code/.test(p))).toBe(true);
  });
});
