import type { Proposal, ProposalApproval, ProposalLine } from '../models';
import type { ProposalLineInput, ProposalTotals } from '../../shared/domain/proposal-totals';
import type { ProposalDisplayStatus } from '../../shared/schemas/proposal';
import type { ProposalDto } from '../../shared/schemas/proposal-dto';

/** The state people see: a sent proposal past its date (in the firm's time zone) is expired. */
export function displayStatus(p: Proposal, today: string): ProposalDisplayStatus {
  if (p.status === 'sent' && p.expiresOn && p.expiresOn < today) return 'expired';
  return p.status;
}

export interface ProposalContext {
  propertyName: string;
  clientName: string;
  /** Per unit: its name, kind, size and the plain summaries of its prescriptions. */
  groups: { unitId: number | null; label: string; kind: string | null; acres: number | null; lengthFt: number | null; summaries: string[] }[];
  cautions: { id: string; title: string; text: string }[];
  /** Today in the firm's time zone (a sent proposal past its date reads as expired). */
  today: string;
}

/**
 * A proposal with its priced lines, totals, state and approval record. The caller prices the lines
 * (services/proposals/pricing.ts) and passes the totals in: a presenter only shapes the answer.
 */
export function presentProposal(p: Proposal, lines: ProposalLine[], totals: ProposalTotals<ProposalLineInput & { quantity: string }>, approval: ProposalApproval | null, ctx: ProposalContext): ProposalDto {
  return {
    id: p.id,
    seriesId: p.seriesId ?? p.id,
    number: p.number,
    version: p.version,
    status: displayStatus(p, ctx.today),
    propertyId: p.propertyId,
    propertyName: ctx.propertyName,
    clientId: p.clientId,
    clientName: ctx.clientName,
    title: p.title,
    introduction: p.introduction,
    terms: p.terms,
    currency: p.currency,
    discount: p.discount,
    taxRatePct: p.taxRatePct,
    depositPct: p.depositPct,
    expiresOn: p.expiresOn,
    lines: totals.lines.map((l, i) => ({
      id: lines[i].id,
      position: lines[i].position,
      unitId: lines[i].unitId,
      prescriptionId: lines[i].prescriptionId,
      groupLabel: lines[i].groupLabel,
      category: lines[i].category,
      description: lines[i].description,
      quantity: l.quantity,
      unit: lines[i].unit,
      unitPriceCents: l.unitPriceCents,
      taxable: l.taxable,
      optional: l.optional,
      selected: lines[i].selected,
      included: l.included,
      amountCents: l.amountCents,
      discountCents: l.discountCents,
    })),
    subtotalCents: totals.subtotalCents,
    discountCents: totals.discountCents,
    taxableCents: totals.taxableCents,
    taxCents: totals.taxCents,
    totalCents: totals.totalCents,
    depositCents: totals.depositCents,
    balanceCents: totals.balanceCents,
    groups: ctx.groups,
    cautions: ctx.cautions,
    sentAt: p.sentAt?.toISOString() ?? null,
    firstViewedAt: p.firstViewedAt?.toISOString() ?? null,
    decidedAt: p.decidedAt?.toISOString() ?? null,
    declineReason: p.declineReason ?? null,
    approval: approval
      ? { signedName: approval.signedName, signedAt: approval.signedAt.toISOString(), contentHash: approval.contentHash, ip: approval.ip, userAgent: approval.userAgent, selectedOptionIds: approval.selectedOptionIds }
      : null,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}
