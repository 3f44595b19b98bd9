/** Assembles a proposal's document input and renders its PDF. */
import type { Transaction } from 'sequelize';
import { Firm, Property, Proposal } from '../../models';
import { readProposal } from './proposal-reader';
import { renderProposalPdf } from '../../../templates/documents/proposal';
import type { ProposalDocumentInput } from '../../../templates/documents/proposal-input';
import { stripCrs } from '../../presenters/geojson';
import { loadPlan } from '../plan/plan-reader';
import { presentUnit } from '../../presenters/unit';
import { unprocessable } from '../../errors';

/** The PDF of a proposal as it stands (totals from the shared rule, the plan map from the units). */
export async function renderProposalPdfFor(proposal: Proposal, transaction?: Transaction): Promise<Buffer> {
  const dto = await readProposal(proposal, transaction);
  const [firm, property] = await Promise.all([Firm.findByPk(proposal.firmId, { transaction }), Property.findByPk(proposal.propertyId, { transaction })]);
  if (!property?.boundary || !property.acres) throw unprocessable('Draw the property boundary before making the proposal’s PDF.');
  const plan = await loadPlan(property.id, proposal.firmId);
  const units = (await plan.units()).map(presentUnit);
  const input: ProposalDocumentInput = {
    firm: { name: firm!.name, phone: firm!.phone, email: firm!.email, address: firm!.address },
    client: { name: dto.clientName },
    property: { name: property.name, acres: property.acres, boundary: stripCrs(property.boundary), locality: [property.county && `${property.county} County`, property.state].filter(Boolean).join(', ') || undefined },
    proposal: {
      number: dto.number,
      version: dto.version,
      title: dto.title,
      introduction: dto.introduction,
      preparedOn: (proposal.sentAt ?? proposal.updatedAt).toISOString().slice(0, 10),
      expiresOn: dto.expiresOn,
      status: dto.status,
      terms: dto.terms,
      currency: dto.currency,
    },
    units: units.map((u) => ({ name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres, lengthFt: u.lengthFt })),
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
  };
  return renderProposalPdf(input);
}
