/**
 * The document templates the PDF worker builds by name. A document's input is plain data (text,
 * numbers, GeoJSON, images as data URLs), so it crosses into the worker thread by structured clone;
 * the definition — the plan map's SVG, the tables, the layout functions — is made there, and the
 * request thread's event loop never waits on it.
 */
import type { TDocumentDefinitions } from 'pdfmake/interfaces';
import { invoiceDocument } from '../../../templates/documents/invoice';
import { planSummaryDocument } from '../../../templates/documents/plan-summary';
import { proposalDocument } from '../../../templates/documents/proposal';
import { seasonReportDocument } from '../../../templates/documents/season-report';

const TEMPLATES = {
  invoice: invoiceDocument,
  'plan-summary': planSummaryDocument,
  proposal: proposalDocument,
  'season-report': seasonReportDocument,
} as const;

/** The name of a document template. */
export type DocumentTemplateName = keyof typeof TEMPLATES;

/** The input of a named template. */
export type DocumentTemplateInput<N extends DocumentTemplateName> = Parameters<(typeof TEMPLATES)[N]>[0];

/** Whether a value names a document template (a task from another thread is checked before use). */
export function isDocumentTemplateName(name: unknown): name is DocumentTemplateName {
  return typeof name === 'string' && Object.hasOwn(TEMPLATES, name);
}

/**
 * Builds the definition of a named template from its input. Throws DomainValidationError naming
 * the field to fix on bad input (the templates check their input).
 */
export function buildDocument<N extends DocumentTemplateName>(name: N, input: DocumentTemplateInput<N>): TDocumentDefinitions {
  const template = TEMPLATES[name] as (input: DocumentTemplateInput<N>) => TDocumentDefinitions;
  return template(input);
}
