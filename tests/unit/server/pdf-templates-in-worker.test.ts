/**
 * Documents are built in the PDF worker, not on the request thread: only the template's plain-data
 * input crosses over, so the plan map's SVG and the tables are made off the event loop. A template
 * that refuses its input still answers the same DomainValidationError (field and sentence).
 */
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import { DocumentRenderError } from '../../../server/services/documents/pdf';
import { pdfWorkersReady, pdfWorkerStats, runPdfTask } from '../../../server/services/documents/pdf-pool';
import { renderPlanSummaryPdf, renderProposalPdf } from '../../../server/services/documents/render-documents';
import { couleeBendProposal } from '../../support/proposal-fixtures';
import { couleeBendSummary } from '../../support/document-fixtures';

// Counts calls of the templates in this (the request) thread; the worker loads its own, unmocked copies.
const calls = vi.hoisted(() => ({ proposal: 0, planSummary: 0 }));
vi.mock('../../../templates/documents/proposal/document', async (importOriginal) => {
  const original = await importOriginal<typeof import('../../../templates/documents/proposal/document')>();
  return { ...original, proposalDocument: (...args: Parameters<typeof original.proposalDocument>) => (calls.proposal++, original.proposalDocument(...args)) };
});
vi.mock('../../../templates/documents/plan-summary', async (importOriginal) => {
  const original = await importOriginal<typeof import('../../../templates/documents/plan-summary')>();
  return { ...original, planSummaryDocument: (...args: Parameters<typeof original.planSummaryDocument>) => (calls.planSummary++, original.planSummaryDocument(...args)) };
});

beforeAll(pdfWorkersReady, 60_000);

describe('documents are built in the PDF worker', () => {
  it('renders a proposal and a plan summary without building their definitions on this thread', async () => {
    const before = pdfWorkerStats().completed;
    const [proposal, plan] = await Promise.all([renderProposalPdf(couleeBendProposal()), renderPlanSummaryPdf(couleeBendSummary())]);
    expect(proposal.subarray(0, 5).toString()).toBe('%PDF-');
    expect(plan.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfWorkerStats().completed - before).toBe(2);
    expect(calls).toEqual({ proposal: 0, planSummary: 0 });
  }, 60_000);

  it('answers a refused input as the same DomainValidationError, naming the field', async () => {
    const bad = couleeBendProposal();
    bad.proposal.preparedOn = '31/12/2026';
    const error = await renderProposalPdf(bad).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(DomainValidationError);
    expect((error as DomainValidationError).field).toBe('proposal.preparedOn');
  }, 60_000);

  it('refuses a template name it does not know with a render error', async () => {
    await expect(runPdfTask({ template: 'no-such-document' as never, input: {} })).rejects.toBeInstanceOf(DocumentRenderError);
    await expect(runPdfTask({ template: 'no-such-document' as never, input: {} })).rejects.toThrow(/no document template named "no-such-document"/);
  }, 60_000);
});
