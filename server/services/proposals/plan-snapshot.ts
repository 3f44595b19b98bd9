/** Freezes a property's plan (boundary and units) and what the document shows beside it, for a proposal version when it is sent. */
import type { Transaction } from 'sequelize';
import { Firm, Property, ProposalLine, type Proposal } from '../../models';
import { documentFirm } from '../firm-profile';
import { proposalContext } from './proposal-reader';
import { presentUnit } from '../../presenters/unit';
import { readUnitRows } from '../plan/plan-reader';
import type { UnitDto } from '../../../shared/schemas/unit';
import { stripCrs } from '../../presenters/geojson';
import type { PlanSnapshot } from '../../../shared/domain/proposal-totals';
import { freezeOverlaysForPrint } from '../documents/overlay-print';

/** The plan part of a snapshot: the property's name, size, boundary and locality, and its units. */
export function planOf(property: Property | null, units: readonly UnitDto[]): Pick<PlanSnapshot, 'property' | 'units'> {
  return {
    property: {
      name: property?.name ?? '',
      acres: property?.acres ?? null,
      boundary: property?.boundary ? stripCrs(property.boundary) : null,
      locality: property ? [property.county && `${property.county} County`, property.state].filter(Boolean).join(', ') || null : null,
    },
    units: units.map((u) => ({ id: u.id, name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres, lengthFt: u.lengthFt })),
  };
}

/** The plan of the proposal's property, the document's context and print copies of its marked aerial photos as they stand, read inside the caller's transaction. */
export async function takePlanSnapshot(proposal: Proposal, transaction: Transaction): Promise<PlanSnapshot> {
  const property = await Property.findByPk(proposal.propertyId, { transaction });
  const firm = await Firm.findByPk(proposal.firmId, { transaction });
  const lines = await ProposalLine.findAll({ where: { proposalId: proposal.id }, order: [['position', 'ASC']], transaction });
  const context = await proposalContext(proposal, lines, transaction);
  const rows = await readUnitRows(proposal.propertyId, transaction);
  const overlays = await freezeOverlaysForPrint(proposal.propertyId, proposal.firmId, transaction);
  return {
    ...planOf(property, rows.map(presentUnit)),
    context: { clientName: context.clientName, groups: context.groups, cautions: context.cautions },
    ...(firm ? { firm: documentFirm(firm) } : {}),
    overlays,
  };
}
