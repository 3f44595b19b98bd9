/**
 * The proposal PDF a landowner receives: a letterhead with the firm, the proposal's number,
 * version and dates, client and property, an optional introduction and the plan map; the work unit
 * by unit in plain words; the priced lines grouped by unit (options marked, options not chosen
 * greyed and not counted); the totals with discount, sales tax, deposit and balance; the terms,
 * the cautions boxed in clay, and how to approve (or the approval record with its content hash).
 * Drafts and proposals that can no longer be approved carry a banner and a watermark.
 *
 * Every amount is printed exactly as given in the input, which the server computes with
 * shared/domain/proposal-totals.ts: this file never rounds money. It only checks that the given
 * totals agree with one another (included lines add up to the subtotal, and so on) and refuses
 * input that does not, so a PDF can never show figures that contradict each other.
 */
export type { ProposalDocumentInput, ProposalDocumentLine } from '../proposal-input';
export { proposalDocument, proposalPageBreakBefore } from './document';
export { formatQuantity, quantityWithUnit } from './format';
