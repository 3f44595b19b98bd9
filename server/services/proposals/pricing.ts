/** Prices a proposal's lines with the one shared rule (shared/domain/proposal-totals.ts). */
import crypto from 'node:crypto';
import { canonicalProposalContent, proposalTotals, type ProposalTotals } from '../../../shared/domain/proposal-totals';
import type { Proposal, ProposalLine } from '../../models';

export interface PricingLine {
  id: string;
  quantity: string;
  unitPriceCents: number;
  taxable: boolean;
  optional: boolean;
  selected: boolean;
  category: string;
  description: string;
  unit: string;
  lineId: number;
}

/** The domain's view of the stored lines. */
export function pricingLines(lines: readonly ProposalLine[]): PricingLine[] {
  return lines.map((l) => ({
    id: `line-${String(l.id).padStart(9, '0')}`,
    lineId: l.id,
    quantity: Number(l.quantity).toFixed(4),
    unitPriceCents: l.unitPriceCents,
    taxable: l.taxable,
    optional: l.optional,
    selected: l.selected,
    category: l.category,
    description: l.description,
    unit: l.unit,
  }));
}

/** The totals of a proposal with its lines. */
export function priceProposal(proposal: Proposal, lines: readonly ProposalLine[]): ProposalTotals<PricingLine> {
  return proposalTotals({ lines: pricingLines(lines), discount: proposal.discount, taxRatePct: proposal.taxRatePct.toFixed(4), depositPct: proposal.depositPct.toFixed(4) });
}

/** The canonical content a client approves, and its SHA-256. */
export function proposalContentHash(proposal: Proposal, lines: readonly ProposalLine[]): { content: string; hash: string } {
  const content = canonicalProposalContent({
    lines: pricingLines(lines),
    discount: proposal.discount,
    taxRatePct: proposal.taxRatePct.toFixed(4),
    depositPct: proposal.depositPct.toFixed(4),
    terms: proposal.terms,
    currency: proposal.currency,
    plan: proposal.planSnapshot ?? null,
  });
  return { content, hash: crypto.createHash('sha256').update(content, 'utf8').digest('hex') };
}

/** The totals columns stored with the proposal. */
export function totalsColumns(totals: ProposalTotals<PricingLine>) {
  return {
    subtotalCents: totals.subtotalCents,
    discountCents: totals.discountCents,
    taxCents: totals.taxCents,
    totalCents: totals.totalCents,
    depositCents: totals.depositCents,
  };
}
