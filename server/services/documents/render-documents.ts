/** Each document template (templates/documents) rendered to PDF bytes: templates build, the server renders. */
import { invoiceDocument, type InvoiceDocumentInput } from '../../../templates/documents/invoice';
import { planSummaryDocument, type PlanSummaryInput } from '../../../templates/documents/plan-summary';
import { proposalDocument, type ProposalDocumentInput } from '../../../templates/documents/proposal';
import { seasonReportDocument, type SeasonReportDocumentInput } from '../../../templates/documents/season-report';
import { renderPdf } from './pdf';

/** Renders the invoice PDF. Throws DomainValidationError naming the field to fix on bad input. */
export async function renderInvoicePdf(input: InvoiceDocumentInput): Promise<Buffer> {
  return renderPdf(invoiceDocument(input));
}

/** Renders the plan summary PDF. Throws DomainValidationError with the field to fix on bad input. */
export async function renderPlanSummaryPdf(input: PlanSummaryInput): Promise<Buffer> {
  return renderPdf(planSummaryDocument(input));
}

/** Renders the proposal PDF. Throws DomainValidationError naming the field to fix on bad input. */
export async function renderProposalPdf(input: ProposalDocumentInput): Promise<Buffer> {
  return renderPdf(proposalDocument(input));
}

/** Renders the season report PDF. */
export async function renderSeasonReportPdf(input: SeasonReportDocumentInput): Promise<Buffer> {
  return renderPdf(seasonReportDocument(input));
}
