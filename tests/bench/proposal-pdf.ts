/**
 * Speed of the proposal PDF against its baseline, interleaved in one run: a 40-line proposal with
 * its plan map (Coulee Bend, 8 units) rendered by our renderer, and a bare pdfmake document with the
 * same fonts and the same page count (plain paragraphs, a stock pdfmake instance, no worker) made
 * alternately, 5 warm-up rounds then 9 measured rounds. Prints medians and the ratio (aim ≤ 2).
 * Run: `npx tsx tests/bench/proposal-pdf.ts`. Writes the proposal to the temp folder for a look;
 * asserts nothing.
 */
import { writeFileSync } from 'node:fs';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pdfmake from 'pdfmake';
import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces';
import { renderProposalPdf } from '../../server/services/documents/render-documents';
import { FONT_BODY, FONT_FILES, FONT_HEADING } from '../../server/services/documents/pdf';
import { couleeBendProposal, FIXTURE_LINES, type FixtureLine } from '../support/proposal-fixtures';
import { median } from './support';

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

type Engine = typeof pdfmake & { setLocalAccessPolicy(cb: (path: string) => boolean): void };
const Stock = (pdfmake as unknown as { constructor: new () => Engine }).constructor;
const bareEngine = new Stock();
bareEngine.setFonts(structuredClone(FONT_FILES));
bareEngine.setUrlAccessPolicy(() => false);
bareEngine.setLocalAccessPolicy(() => true);

const SENTENCE = 'Disk, lime and seed the plot in late summer, then cultipack so the seed meets the soil; ';
/** A bare document: a heading and `paragraphs` plain paragraphs in the same two fonts. */
function bareDocument(paragraphs: number): TDocumentDefinitions {
  const content: Content[] = [{ text: 'Proposal', font: FONT_HEADING, fontSize: 20, bold: true }];
  for (let i = 0; i < paragraphs; i++) content.push({ text: `${i + 1}. ${SENTENCE.repeat(3)}`, margin: [0, 0, 0, 6] });
  return { pageSize: 'LETTER', pageMargins: [54, 70, 54, 60], defaultStyle: { font: FONT_BODY, fontSize: 10, lineHeight: 1.25 }, content };
}
const renderBare = (paragraphs: number) => bareEngine.createPdf(bareDocument(paragraphs)).getBuffer() as Promise<Buffer>;

// The bare document gets as many paragraphs as it takes to fill the proposal's page count.
const sample = await renderProposalPdf(couleeBendProposal({ lines: fortyLines(), introduction: null }));
const targetPages = pageCount(sample);
let paragraphs = 10;
while (pageCount(await renderBare(paragraphs)) < targetPages) paragraphs += 4;

const WARM_UP = 5;
const RUNS = 9;
const proposalMs: number[] = [];
const bareMs: number[] = [];
let last: Buffer = sample;
let bare: Buffer = Buffer.alloc(0);
const loopDelay = monitorEventLoopDelay({ resolution: 5 });
for (let i = 0; i < WARM_UP + RUNS; i++) {
  const input = couleeBendProposal({ lines: fortyLines(), introduction: null });
  // The longest the event loop waited while proposals rendered (goal: never more than 100 ms).
  if (i >= WARM_UP) loopDelay.enable();
  let t0 = performance.now();
  last = await renderProposalPdf(input);
  const p = performance.now() - t0;
  loopDelay.disable();
  t0 = performance.now();
  bare = await renderBare(paragraphs);
  const b = performance.now() - t0;
  if (i >= WARM_UP) {
    proposalMs.push(p);
    bareMs.push(b);
  }
}
const file = join(tmpdir(), 'browseline-proposal-bench.pdf');
writeFileSync(file, last);
console.log(`proposal: ${pageCount(last)} pages, 40 lines, plan map, ${(last.length / 1024).toFixed(0)} KiB (${file})`);
console.log(`bare pdfmake baseline: ${pageCount(bare)} pages, ${paragraphs} paragraphs, same fonts`);
console.log(`proposal warm runs (ms): ${proposalMs.map((r) => r.toFixed(0)).join(', ')}`);
console.log(`bare warm runs (ms): ${bareMs.map((r) => r.toFixed(0)).join(', ')}`);
console.log(`longest event-loop wait while proposals rendered: ${(loopDelay.max / 1e6).toFixed(0)} ms (goal ≤ 100; the layout runs in a worker thread)`);
console.log(`median proposal ${median(proposalMs).toFixed(0)} ms, bare ${median(bareMs).toFixed(0)} ms, ratio proposal ÷ bare ${(median(proposalMs) / median(bareMs)).toFixed(2)} (aim ≤ 2)`);
process.exit(0);
