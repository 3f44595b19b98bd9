/**
 * Speed of the proposal PDF: median render time of a 40-line, three-page proposal with its plan
 * map (Coulee Bend, 8 units) over 7 warm runs, after 5 warm-up runs (the JIT needs a few).
 * Run: `npx tsx tests/bench/proposal-pdf.ts`. Prints timings and writes the PDF to the temp
 * folder for a look; asserts nothing about them.
 */
import { writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { renderProposalPdf } from '../../templates/documents/proposal';
import { couleeBendProposal, FIXTURE_LINES, type FixtureLine } from '../support/proposal-fixtures';

/** 40 lines: the fixture's 12, then 28 more spread over the same three units. */
function fortyLines(): FixtureLine[] {
  const lines = [...FIXTURE_LINES];
  for (let i = 0; lines.length < 40; i++) {
    const base = FIXTURE_LINES[i % FIXTURE_LINES.length];
    lines.push({
      ...base,
      id: 1000 + i,
      description: `${base.description} (phase ${Math.floor(i / FIXTURE_LINES.length) + 2})`,
      quantity: `${(i % 7) + 1}.${String((i * 37) % 100).padStart(2, '0')}00`,
      optional: base.optional,
      selected: base.selected,
    });
  }
  return lines;
}

function pageCount(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
}

const WARM_UP = 5;
const RUNS = 7;
const runs: number[] = [];
let last: Buffer = Buffer.alloc(0);
for (let i = 0; i < WARM_UP + RUNS; i++) {
  const input = couleeBendProposal({ lines: fortyLines(), introduction: null });
  const start = performance.now();
  last = await renderProposalPdf(input);
  const ms = performance.now() - start;
  if (i >= WARM_UP) runs.push(ms);
}
runs.sort((a, b) => a - b);
const median = runs[Math.floor(runs.length / 2)];
const file = join(tmpdir(), 'browseline-proposal-bench.pdf');
writeFileSync(file, last);
console.log(`proposal: ${pageCount(last)} pages, 40 lines, plan map, ${(last.length / 1024).toFixed(0)} KiB (${file})`);
console.log(`warm runs (ms): ${runs.map((r) => r.toFixed(0)).join(', ')}`);
console.log(`median of ${runs.length} warm runs: ${median.toFixed(0)} ms`);
