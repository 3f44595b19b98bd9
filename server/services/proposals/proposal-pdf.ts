/** Assembles a proposal's document input and renders its PDF. */
import type { Transaction } from 'sequelize';
import { Firm, Property, Proposal } from '../../models';
import { readProposal } from './proposal-reader';
import { renderProposalPdf } from '../documents/render-documents';
import type { ProposalDocumentInput } from '../../../templates/documents/proposal-input';
import { loadPlan } from '../plan/plan-reader';
import { presentUnit } from '../../presenters/unit';
import { unprocessable } from '../../errors';
import { sequelize } from '../../db/sequelize';
import { planOf, takePlanSnapshot } from './plan-snapshot';
import { usableZone } from '../clock';
import { todayIn } from '../../../shared/domain/clock';
import type { PlanSnapshot } from '../../../shared/domain/proposal-totals';
import { documentFirm } from '../firm-profile';
import { letterheadFirm } from '../documents/firm-letterhead';
import { frozenOverlaysForPrint, liveOverlaysForPrint } from '../documents/overlay-print';

/** The plan a draft shows: the property's boundary and units as they stand now. */
async function livePlan(proposal: Proposal, transaction?: Transaction): Promise<PlanSnapshot> {
  const property = await Property.findByPk(proposal.propertyId, { transaction });
  const plan = await loadPlan(proposal.propertyId, proposal.firmId);
  return planOf(property, (await plan.units()).map(presentUnit));
}

/**
 * The PDF of a proposal: totals from the shared rule; the plan map from the plan frozen when the
 * version was sent (a draft shows the live plan), so a sent or approved proposal reads the same forever.
 */
export async function renderProposalPdfFor(proposal: Proposal, transaction?: Transaction): Promise<Buffer> {
  // A version sent before plans were frozen is frozen the first time its PDF is made.
  if (proposal.status !== 'draft' && !proposal.planSnapshot) {
    const freeze = async (t: Transaction) => proposal.update({ planSnapshot: await takePlanSnapshot(proposal, t) }, { transaction: t });
    await (transaction ? freeze(transaction) : sequelize.transaction(freeze));
  }
  const dto = await readProposal(proposal, transaction);
  const [firm, plan] = await Promise.all([Firm.findByPk(proposal.firmId, { transaction }), proposal.planSnapshot ? Promise.resolve(proposal.planSnapshot) : livePlan(proposal, transaction)]);
  const { property } = plan;
  if (!property.boundary || !property.acres) throw unprocessable('Draw the property boundary before making the proposal’s PDF.');
  const zone = usableZone(firm?.timezone);
  // A sent version prints the aerial photos kept when it was sent (none if sent before photos printed); a draft, those marked now.
  const overlays = proposal.planSnapshot ? await frozenOverlaysForPrint(proposal.planSnapshot.overlays ?? []) : await liveOverlaysForPrint(proposal.propertyId, proposal.firmId);
  const input: ProposalDocumentInput = {
    // A sent version prints the firm as it was when sent; one sent before the profile was kept, and a draft, the firm now.
    firm: await letterheadFirm(plan.firm ?? documentFirm(firm!)),
    client: { name: dto.clientName },
    property: { name: property.name, acres: property.acres, boundary: property.boundary as ProposalDocumentInput['property']['boundary'], locality: property.locality ?? undefined },
    proposal: {
      number: dto.number,
      version: dto.version,
      title: dto.title,
      introduction: dto.introduction,
      preparedOn: todayIn(zone, proposal.sentAt ?? proposal.updatedAt),
      expiresOn: dto.expiresOn,
      status: dto.status,
      terms: dto.terms,
      currency: dto.currency,
    },
    units: plan.units.map((u) => ({ name: u.name, kind: u.kind as ProposalDocumentInput['units'][number]['kind'], geometry: u.geometry as ProposalDocumentInput['units'][number]['geometry'], acres: u.acres, lengthFt: u.lengthFt })),
    overlays,
    groups: dto.groups.map((g) => ({ label: g.label, kind: g.kind as ProposalDocumentInput['groups'][number]['kind'], acres: g.acres, lengthFt: g.lengthFt, summaries: g.summaries })),
    lines: dto.lines.map((l) => ({ id: l.id, groupLabel: l.groupLabel, category: l.category, description: l.description, quantity: String(l.quantity), unit: l.unit, unitPriceCents: l.unitPriceCents, amountCents: l.amountCents, taxable: l.taxable, optional: l.optional, included: l.included })),
    totals: {
      subtotalCents: dto.subtotalCents,
      discountCents: dto.discountCents,
      taxableCents: dto.taxableCents,
      taxCents: dto.taxCents,
      totalCents: dto.totalCents,
      depositCents: dto.depositCents,
      balanceCents: dto.balanceCents,
      taxRatePct: dto.taxRatePct,
      depositPct: dto.depositPct,
      discountLabel: dto.discount.kind === 'percent' ? `${dto.discount.percent}% discount` : dto.discount.kind === 'fixed' ? 'Discount' : undefined,
    },
    cautions: dto.cautions.map((c) => ({ title: c.title, text: c.text })),
    approval: dto.approval ? { signedName: dto.approval.signedName, signedAt: dto.approval.signedAt, contentHash: dto.approval.contentHash } : null,
    timeZone: zone,
  };
  return renderProposalPdf(input);
}
