/**
 * The PDF worker thread: definitions cross into it with their named functions and table layouts,
 * the bytes come back from the worker, and a function that cannot cross is
 * refused with a sentence that says what to do.
 */
import { execFileSync } from 'node:child_process';
import { isMainThread } from 'node:worker_threads';
import { beforeAll, describe, expect, it } from 'vitest';
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { DocumentRenderError, keepWithNextRule, pageFrame, renderPdf, ruledTableLayout } from '../../../server/services/documents/pdf';
import { packDefinition, pdfFunction, unpackDefinition } from '../../../templates/documents/kit/pdf-functions';
import { pdfWorkerCount, pdfWorkersReady, pdfWorkerStats } from '../../../server/services/documents/pdf-pool';
import { renderProposalPdf } from '../../../server/services/documents/render-documents';
import { couleeBendProposal } from '../../support/proposal-fixtures';

beforeAll(pdfWorkersReady, 60_000);

const pdfText = (pdf: Buffer) => execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString('utf8');

describe('packing a document definition for the worker', () => {
  it('turns a table layout into tables of values that answer as the functions did', () => {
    const body = [['a', 'b', 'c'], ['1', '2', '3'], ['4', '5', '6']];
    const layout = {
      ...ruledTableLayout,
      fillColor: (row: number, _node: unknown, col: number) => (row === 1 && col === 2 ? '#eeeeee' : null),
    };
    const node = { table: { headerRows: 1, widths: ['*', 'auto', 'auto'], body }, layout };
    const packed = packDefinition({ content: [node] }) as { content: Array<{ layout: Record<string, unknown> }> };
    expect(JSON.stringify(packed)).not.toContain('function');
    const unpacked = unpackDefinition(structuredClone(packed)) as unknown as { content: Array<{ layout: Record<string, (i: number, n: unknown, j?: number) => unknown> }> };
    const fns = unpacked.content[0].layout;
    for (let i = 0; i <= body.length; i++) expect(fns.hLineWidth(i, node)).toBe(ruledTableLayout.hLineWidth!(i, node as never));
    for (let i = 0; i < 3; i++) expect(fns.paddingRight(i, node)).toBe(ruledTableLayout.paddingRight!(i, node as never));
    expect(fns.fillColor(1, node, 2)).toBe('#eeeeee');
    expect(fns.fillColor(1, node, 1)).toBeNull();
    expect(fns.hLineColor(1, node, 0)).toBe((ruledTableLayout.hLineColor as (i: number, n: unknown) => string)(1, node));
  });

  it('sends named functions by name and rebuilds them with their arguments', () => {
    const frame = pageFrame({ title: 'Invoice INV-1', firmName: 'Fernhill', headerFromPage: 2 });
    const packed = structuredClone(packDefinition({ content: ['x'], header: frame.header, pageBreakBefore: keepWithNextRule({ idPrefix: 'row-', keepPt: 50 }) }));
    const def = unpackDefinition(packed) as TDocumentDefinitions & { header: (p: number, n: number, s: { width: number }) => unknown };
    expect(def.header(1, 3, { width: 612 })).toBeNull();
    expect(JSON.stringify(def.header(2, 3, { width: 612 }))).toContain('Invoice INV-1');
    expect(typeof def.pageBreakBefore).toBe('function');
  });

  it('refuses a function that was not made with pdfFunction, saying how to fix it', async () => {
    const bad: TDocumentDefinitions = { content: ['x'], footer: () => 'page' };
    await expect(renderPdf(bad)).rejects.toBeInstanceOf(DocumentRenderError);
    await expect(renderPdf({ content: ['x'], footer: () => 'page' })).rejects.toThrow(/definition\.footer.*pdfFunction/);
    expect(() => pdfFunction('no-such-function')).toThrow(/No document function/);
  });
});

describe('rendering in the worker thread', () => {
  it('runs in a worker by default, at least one', () => {
    expect(isMainThread).toBe(true);
    expect(pdfWorkerCount({})).toBeGreaterThanOrEqual(1);
    expect(pdfWorkerCount({ PDF_WORKERS: '0' })).toBe(0);
    expect(pdfWorkerCount({ PDF_WORKERS: '3' })).toBe(3);
  });

  it('answers the same text as the document asks for, with the running header from page 2', async () => {
    const pdf = await renderPdf({
      ...pageFrame({ title: 'Plan summary', firmName: 'Fernhill Habitat Consulting', headerFromPage: 2 }),
      content: [{ text: 'First page', pageBreak: 'after' }, 'Second page'],
    });
    const pages = pdfText(pdf).split('\f');
    expect(pages[0]).toContain('First page');
    expect(pages[0]).not.toContain('Plan summary');
    expect(pages[1]).toContain('Plan summary');
    expect(pages[1]).toContain('Page 2 of 2');
  });

  it('lays proposals out in the worker threads, not in this one', async () => {
    const before = pdfWorkerStats().completed;
    const pdfs = await Promise.all(Array.from({ length: 3 }, () => renderProposalPdf(couleeBendProposal())));
    expect(pdfs.every((p) => p.subarray(0, 5).toString() === '%PDF-')).toBe(true);
    expect(pdfWorkerStats().completed - before).toBe(3);
  }, 60_000);
});

describe('fonts parsed once per thread', () => {
  it('answers the parsed font again for the same bytes read anew from disk (the plan map labels name a font file)', async () => {
    const { readFileSync } = await import('node:fs');
    const { createRequire } = await import('node:module');
    const { createPdfEngine } = await import('../../../server/services/documents/pdf-engine');
    const { FONT_FILES } = await import('../../../server/services/documents/pdf');
    createPdfEngine(FONT_FILES);
    const requirePdfkit = createRequire(createRequire(createRequire(import.meta.url).resolve('pdfmake')).resolve('pdfkit'));
    const fontkit = requirePdfkit('fontkit') as { create(buffer: Uint8Array): object };
    const file = Object.values(FONT_FILES)[0].normal as string;
    const first = fontkit.create(readFileSync(file));
    const again = fontkit.create(readFileSync(file));
    expect(again).toBe(first);
  });
});
