/**
 * Speed of the document engine: median render time of a 3-page plan summary (map, 40 table rows,
 * cautions) over 5 warm runs, after 5 warm-up runs (the JIT needs a few). Run: `npx tsx tests/bench/pdf-render.ts`.
 * Prints timings; asserts nothing about them.
 */
import { renderPlanSummaryPdf } from '../../server/services/documents/render-documents';
import { couleeBendSummary, offset, UNITS, type FixtureUnit } from '../support/document-fixtures';

const POINT_KINDS = ['stand-site', 'camera-site', 'mock-scrape', 'water-source'] as const;

/** 40 units in all: the fixture's 8 and 32 points spread over the middle of the property. */
function fortyUnits(): FixtureUnit[] {
  const extra: FixtureUnit[] = [];
  for (let i = 0; extra.length + UNITS.length < 40; i++) {
    const kind = POINT_KINDS[i % POINT_KINDS.length];
    extra.push({ name: `Site ${i + 1}`, kind, geometry: { type: 'Point', coordinates: offset(-300 + (i % 8) * 80, -250 + Math.floor(i / 8) * 110) } });
  }
  return extra;
}

function pageCount(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
}

const runs: number[] = [];
let pages = 0;
let bytes = 0;
const WARM_UP = 5;
for (let i = 0; i < WARM_UP + 5; i++) {
  const input = couleeBendSummary(fortyUnits());
  const start = performance.now();
  const pdf = await renderPlanSummaryPdf(input);
  const ms = performance.now() - start;
  if (i >= WARM_UP) runs.push(ms);
  pages = pageCount(pdf);
  bytes = pdf.length;
}
runs.sort((a, b) => a - b);
const median = runs[Math.floor(runs.length / 2)];
console.log(`plan summary: ${pages} pages, 40 unit rows, ${(bytes / 1024).toFixed(0)} KiB`);
console.log(`warm runs (ms): ${runs.map((r) => r.toFixed(0)).join(', ')}`);
console.log(`median of ${runs.length} warm runs: ${median.toFixed(0)} ms`);
