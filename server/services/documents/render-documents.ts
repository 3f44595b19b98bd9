/**
 * Each document template (templates/documents) rendered to PDF bytes. Only the plain-data input
 * leaves the request thread: the template is built and laid out in a PDF worker (pdf-pool.ts).
 */
import type { InvoiceDocumentInput } from '../../../templates/documents/invoice';
import type { PlanSummaryInput } from '../../../templates/documents/plan-summary';
import type { ProposalDocumentInput } from '../../../templates/documents/proposal-input';
import type { SeasonReportDocumentInput } from '../../../templates/documents/season-report';
import { renderTemplate } from './pdf-pool';

/** Renders the invoice PDF. Throws DomainValidationError naming the field to fix on bad input. */
export async function renderInvoicePdf(input: InvoiceDocumentInput): Promise<Buffer> {
  return renderTemplate('invoice', input);
}

/** Renders the plan summary PDF. Throws DomainValidationError with the field to fix on bad input. */
export async function renderPlanSummaryPdf(input: PlanSummaryInput): Promise<Buffer> {
  return renderTemplate('plan-summary', input);
}

/** Renders the proposal PDF. Throws DomainValidationError naming the field to fix on bad input. */
export async function renderProposalPdf(input: ProposalDocumentInput): Promise<Buffer> {
  return renderTemplate('proposal', input);
}

/** Renders the season report PDF. */
export async function renderSeasonReportPdf(input: SeasonReportDocumentInput): Promise<Buffer> {
  return renderTemplate('season-report', input);
}
