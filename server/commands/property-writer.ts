/** Creates and edits properties; the boundary is stored as a MultiPolygon with measures computed here. */
import type { MultiPolygon, Polygon } from 'geojson';
import type { Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Client, Property, Proposal } from '../models';
import { measureArea, toMultiPolygon } from '../../shared/domain/geometry';
import type { PropertyCreateInput, PropertyUpdateInput } from '../../shared/schemas/property';
import type { SessionUser } from '../../shared/schemas/auth';
import { conflict, notFound, unprocessable } from '../errors';
import { CONFIRM_LARGE_AREA_FIELD, largeBoundaryMessage } from '../../shared/domain/large-area';
import { firmLargeAreaAcres } from './unit-writer';
import { assertValidInDatabase } from './geometry-validator';
import { recordAudit } from './audit-recorder';
import { findInFirm } from '../policies/firm-scope';

/** The stored boundary columns for a boundary (or its absence). */
export function boundaryColumns(geom: Polygon | MultiPolygon | null) {
  if (!geom) return { boundary: null, acres: null, perimeterFt: null };
  const m = measureArea(geom);
  return { boundary: toMultiPolygon(geom), acres: Math.round(m.acres * 1000) / 1000, perimeterFt: Math.round(m.perimeterFt * 10) / 10 };
}

/**
 * 422 naming `confirmLargeArea` when the boundary is larger than the firm's threshold and the request
 * did not confirm it (a boundary drawn at the map's opening zoom is millions of acres).
 */
async function assertBoundarySizeConfirmed(acres: number | null, firmId: number, confirmed: boolean | undefined, transaction: Transaction): Promise<void> {
  if (confirmed || acres === null) return;
  const message = largeBoundaryMessage(acres, await firmLargeAreaAcres(firmId, transaction));
  if (message) throw unprocessable(message, [{ path: CONFIRM_LARGE_AREA_FIELD, message }]);
}

async function assertClientInFirm(clientId: number, firmId: number, transaction: Transaction): Promise<void> {
  const client = await Client.findOne({ where: { id: clientId, firmId }, transaction, attributes: ['id'] });
  if (!client) throw unprocessable('clientId: choose one of your firm’s clients.', [{ path: 'clientId', message: 'not a client of this firm' }]);
}

/** Creates a property of one of the firm's clients. */
export async function createProperty(actor: SessionUser, input: PropertyCreateInput, ip: string | null): Promise<Property> {
  return sequelize.transaction(async (transaction) => {
    await assertClientInFirm(input.clientId, actor.firmId, transaction);
    const measured = boundaryColumns(input.boundary ?? null);
    await assertBoundarySizeConfirmed(measured.acres, actor.firmId, input.confirmLargeArea, transaction);
    if (input.boundary) await assertValidInDatabase(input.boundary, 'boundary', transaction);
    const property = await Property.create(
      {
        firmId: actor.firmId,
        clientId: input.clientId,
        name: input.name,
        county: input.county ?? null,
        state: input.state ?? null,
        region: input.region ?? null,
        objectives: input.objectives ?? null,
        notes: input.notes ?? null,
        ...measured,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'property.created', subjectType: 'Property', subjectId: property.id, ip }, transaction);
    return property;
  });
}

/** Edits a property; a new boundary is re-measured and bumps the plan's revision. */
export async function updateProperty(actor: SessionUser, propertyId: number, input: PropertyUpdateInput, ip: string | null): Promise<Property> {
  return sequelize.transaction(async (transaction) => {
    const property = await Property.findOne({ where: { id: propertyId, firmId: actor.firmId }, lock: transaction.LOCK.UPDATE, transaction });
    if (!property) throw notFound('That property');
    if (input.clientId !== undefined) await assertClientInFirm(input.clientId, actor.firmId, transaction);
    const { boundary, confirmLargeArea, ...rest } = input;
    const changes: Record<string, unknown> = { ...rest };
    if (boundary !== undefined) {
      const measured = boundaryColumns(boundary ?? null);
      await assertBoundarySizeConfirmed(measured.acres, actor.firmId, confirmLargeArea, transaction);
      if (boundary) await assertValidInDatabase(boundary, 'boundary', transaction);
      Object.assign(changes, measured, { revision: property.revision + 1 });
    }
    await property.update(changes, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: boundary !== undefined ? 'property.boundary-changed' : 'property.updated', subjectType: 'Property', subjectId: property.id, ip }, transaction);
    return property;
  });
}

/**
 * Deletes a property of the actor's firm with its audit record, in one transaction; refused (409)
 * while it has sent or approved proposals, which must stay on record.
 */
export async function deleteProperty(actor: SessionUser, propertyId: number, ip: string | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction, lock: true });
    const binding = await Proposal.count({ where: { propertyId: property.id, status: ['sent', 'approved'] }, transaction });
    if (binding) throw conflict('This property has sent or approved proposals, which must stay on record. Withdraw the sent ones first; approved work cannot be deleted.');
    await property.destroy({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'property.deleted', subjectType: 'Property', subjectId: property.id, data: { name: property.name }, ip }, transaction);
  });
}

/** Turns the client's e-mail on or off for each unit whose work is finished, with its audit record. */
export async function setUnitDoneNotice(actor: SessionUser, propertyId: number, notifyClientOnUnitDone: boolean, ip: string | null): Promise<Property> {
  return sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction, lock: true });
    await property.update({ notifyClientOnUnitDone }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'property.progress-notice-changed', subjectType: 'Property', subjectId: property.id, data: { notifyClientOnUnitDone }, ip }, transaction);
    return property;
  });
}
