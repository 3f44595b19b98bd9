/** The landowner's live totals: the sent proposal priced with the options they tick, by the shared rule. */
import { DomainValidationError } from '../../../../shared/domain/errors';
import { proposalTotals, type ProposalLineInput, type ProposalTotals } from '../../../../shared/domain/proposal-totals';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';

/** The id the server prices a stored line under (server/services/proposals/pricing.ts). */
export const pricingLineId = (lineId: number): string => `line-${String(lineId).padStart(9, '0')}`;

export type ChosenLine = ProposalLineInput & { lineId: number };

/**
 * The proposal's totals with the chosen options included, exactly as the server will price them on
 * approval; null when the rule refuses the combination (a fixed discount larger than the subtotal).
 */
export function totalsWithOptions(p: ProposalDto, chosenOptionIds: ReadonlySet<number>): ProposalTotals<ChosenLine> | null {
  try {
    return proposalTotals({
      lines: p.lines.map((l) => ({
        lineId: l.id,
        id: pricingLineId(l.id),
        quantity: l.quantity,
        unitPriceCents: l.unitPriceCents,
        taxable: l.taxable,
        optional: l.optional,
        selected: l.optional ? chosenOptionIds.has(l.id) : true,
        category: l.category,
        description: l.description,
        unit: l.unit,
      })),
      discount: p.discount,
      taxRatePct: p.taxRatePct.toFixed(4),
      depositPct: p.depositPct.toFixed(4),
    });
  } catch (e) {
    if (e instanceof DomainValidationError) return null;
    throw e;
  }
}
