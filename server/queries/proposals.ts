/** Reads of proposals as lists show them: numbers, status and totals, with property and client names, without lines. */
import type { WhereOptions } from 'sequelize';
import { Client, Property, Proposal } from '../models';
import { displayStatus } from '../presenters/proposal';
import type { ProposalRowDto } from '../../shared/schemas/proposal-dto';

/** The proposals matching `where`, newest first (one page when given), as list rows; `today` decides which sent ones have expired. */
export async function proposalRows(where: WhereOptions, today: string, page?: { limit: number; offset: number }) {
  const rows = await Proposal.findAll({ where, order: [['createdAt', 'DESC'], ['version', 'DESC'], ['id', 'DESC']], limit: page?.limit, offset: page?.offset });
  const [properties, clients] = await Promise.all([
    Property.findAll({ where: { id: [...new Set(rows.map((p) => p.propertyId))] }, attributes: ['id', 'name'] }),
    Client.findAll({ where: { id: [...new Set(rows.map((p) => p.clientId))] }, attributes: ['id', 'name'] }),
  ]);
  const propertyName = new Map(properties.map((p) => [p.id, p.name]));
  const clientName = new Map(clients.map((c) => [c.id, c.name]));
  return rows.map((p): ProposalRowDto => ({
    id: p.id,
    seriesId: p.seriesId ?? p.id,
    number: p.number,
    version: p.version,
    status: displayStatus(p, today),
    title: p.title,
    propertyId: p.propertyId,
    propertyName: propertyName.get(p.propertyId) ?? '',
    clientId: p.clientId,
    clientName: clientName.get(p.clientId) ?? '',
    totalCents: p.totalCents,
    depositCents: p.depositCents,
    expiresOn: p.expiresOn,
    sentAt: p.sentAt?.toISOString() ?? null,
    firstViewedAt: p.firstViewedAt?.toISOString() ?? null,
    decidedAt: p.decidedAt?.toISOString() ?? null,
    updatedAt: p.updatedAt.toISOString(),
  }));
}
