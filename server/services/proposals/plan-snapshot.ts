/** Freezes a property's plan (boundary and units) and what the document shows beside it, for a proposal version when it is sent. */
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { Firm, Property, ProposalLine, type Proposal } from '../../models';
import { documentFirm } from '../firm-profile';
import { proposalContext } from './proposal-reader';
import { presentUnit, type UnitRow } from '../../presenters/unit';
import { stripCrs } from '../../presenters/geojson';
import type { PlanSnapshot } from '../../../shared/domain/proposal-totals';

/** The plan of the proposal's property and the document's context as they stand, read inside the caller's transaction. */
export async function takePlanSnapshot(proposal: Proposal, transaction: Transaction): Promise<PlanSnapshot> {
  const property = await Property.findByPk(proposal.propertyId, { transaction });
  const firm = await Firm.findByPk(proposal.firmId, { transaction });
  const lines = await ProposalLine.findAll({ where: { proposalId: proposal.id }, order: [['position', 'ASC']], transaction });
  const context = await proposalContext(proposal, lines, transaction);
  const rows = await sequelize.query<UnitRow>(
    `SELECT id, property_id AS "propertyId", kind, name, notes, ST_AsGeoJSON(geometry, 9)::json AS geometry,
            acres, perimeter_ft AS "perimeterFt", length_ft AS "lengthFt", created_at AS "createdAt", updated_at AS "updatedAt"
     FROM units WHERE property_id = :propertyId ORDER BY id`,
    { replacements: { propertyId: proposal.propertyId }, type: QueryTypes.SELECT, transaction },
  );
  return {
    property: {
      name: property?.name ?? '',
      acres: property?.acres ?? null,
      boundary: property?.boundary ? stripCrs(property.boundary) : null,
      locality: property ? [property.county && `${property.county} County`, property.state].filter(Boolean).join(', ') || null : null,
    },
    units: rows.map(presentUnit).map((u) => ({ id: u.id, name: u.name, kind: u.kind, geometry: u.geometry, acres: u.acres, lengthFt: u.lengthFt })),
    context: { clientName: context.clientName, groups: context.groups, cautions: context.cautions },
    ...(firm ? { firm: documentFirm(firm) } : {}),
  };
}
