/**
 * Writes of the hunting planner: a stand site's details, the property's wind record, a sit (keyed by
 * the phone's idempotency key), the firm's planner settings and the client switch for sit logging.
 * Each is one transaction with its audit record.
 */
import { UniqueConstraintError } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Buck, Client, Firm, Property, Sit, StandSite, Unit, WindRecord } from '../models';
import { findInFirm } from '../policies/firm-scope';
import { conflict, forbidden, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { readableProperty } from '../services/results/results-reader';
import type { SessionUser } from '../../shared/schemas/auth';
import type { HuntingSettingsUpdateInput, SitCreateValues, StandSiteUpdateInput } from '../../shared/schemas/hunting';
import type { RoseShare } from '../../shared/domain/wind-record';
import { KIND_STYLES } from '../../shared/domain/unit-kinds';

const kindLabel = (kind: keyof typeof KIND_STYLES) => KIND_STYLES[kind].label.toLowerCase();

/** Sets what a stand site watches, its type, height and approach side (422 for a unit that is not a stand site). */
export async function updateStandSite(me: SessionUser, unitId: number, input: StandSiteUpdateInput, ip: string | null): Promise<{ unit: Unit; site: StandSite }> {
  return sequelize.transaction(async (transaction) => {
    const unit = await findInFirm(Unit, unitId, me.firmId, 'That unit', { transaction });
    if (unit.kind !== 'stand-site') throw unprocessable(`“${unit.name}” is a ${kindLabel(unit.kind)}, not a stand site: only stand sites have a watched unit, type and height.`);
    if (input.watchedUnitId != null) {
      const watched = await Unit.findOne({ where: { id: input.watchedUnitId, firmId: me.firmId, propertyId: unit.propertyId }, transaction });
      if (!watched) throw unprocessable('watchedUnitId must be a unit of the same property.', { field: 'watchedUnitId' });
      if (watched.id === unit.id) throw unprocessable('A stand cannot watch itself: choose the plot, trail or area it overlooks.', { field: 'watchedUnitId' });
    }
    const [site] = await StandSite.findOrCreate({ where: { unitId: unit.id }, defaults: { unitId: unit.id, firmId: me.firmId, watchedUnitId: null, standType: null, heightFt: null, approachFrom: null }, transaction });
    const changes: Partial<StandSite> = {};
    if (input.watchedUnitId !== undefined) changes.watchedUnitId = input.watchedUnitId;
    if (input.standType !== undefined) changes.standType = input.standType;
    if (input.heightFt !== undefined) changes.heightFt = input.heightFt;
    if (input.approachFrom !== undefined) changes.approachFrom = input.approachFrom;
    await site.update(changes, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'stand-site.updated', subjectType: 'Unit', subjectId: unit.id, data: { ...input }, ip }, transaction);
    return { unit, site };
  });
}

export interface WindRecordValues {
  source: 'csv' | 'isd-lite' | 'sectors';
  fileName: string | null;
  months: number[];
  hoursFilter: 'hunting' | 'all' | 'typed';
  rose: RoseShare[];
  hours: number;
  calmHours: number;
  skippedRows: number;
}

/** Replaces the property's wind record. */
export async function saveWindRecord(me: SessionUser, propertyId: number, values: WindRecordValues, ip: string | null): Promise<WindRecord> {
  return sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, me.firmId, 'That property', { transaction });
    await WindRecord.destroy({ where: { propertyId: property.id }, transaction });
    const record = await WindRecord.create({ propertyId: property.id, firmId: me.firmId, ...values, createdById: me.id }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'wind-record.saved', subjectType: 'Property', subjectId: property.id, data: { source: values.source, hours: values.hours, months: values.months }, ip }, transaction);
    return record;
  });
}

/** A client's contacts may log sits only when their consultant turned it on; 403 otherwise. */
export async function assertMayLogSits(me: SessionUser): Promise<void> {
  if (me.role !== 'client') return;
  const client = me.clientId ? await Client.findOne({ where: { id: me.clientId, firmId: me.firmId }, attributes: ['id', 'portalSitsAllowed'] }) : null;
  if (!client?.portalSitsAllowed) throw forbidden('Logging sits is not turned on for your account. Ask your consultant to turn it on.');
}

/**
 * Logs a sit. The same idempotency key answers the first sit again (`replayed: true`) and stores
 * nothing, so a phone may resend after a lost answer; a key used on another property is a 409.
 */
export async function createSit(me: SessionUser, propertyId: number, values: SitCreateValues, key: string, ip: string | null): Promise<{ sit: Sit; replayed: boolean }> {
  await assertMayLogSits(me);
  const earlier = await Sit.findOne({ where: { firmId: me.firmId, idempotencyKey: key } });
  if (earlier) {
    if (earlier.propertyId !== propertyId) throw conflict('This idempotency key was used for a sit on another property; make a new key for each sit.');
    return { sit: earlier, replayed: true };
  }
  const property = await readableProperty(me, propertyId);
  try {
    return await sequelize.transaction(async (transaction) => {
      const stand = await Unit.findOne({ where: { id: values.standUnitId, firmId: me.firmId, propertyId: property.id }, transaction });
      if (!stand) throw unprocessable('standUnitId must be a stand site of this property.', { field: 'standUnitId' });
      if (stand.kind !== 'stand-site') throw unprocessable(`standUnitId: “${stand.name}” is a ${kindLabel(stand.kind)}, not a stand site.`, { field: 'standUnitId' });
      const buckIds = values.buckIds ?? [];
      if (buckIds.length) {
        const known = await Buck.findAll({ where: { id: buckIds, firmId: me.firmId, propertyId: property.id }, attributes: ['id'], transaction });
        const strays = buckIds.filter((id) => !known.some((b) => b.id === id));
        if (strays.length) throw unprocessable(`buckIds: ${strays.join(', ')} ${strays.length === 1 ? 'is not a buck' : 'are not bucks'} of this property’s camera roster. Pick bucks from its roster.`, { field: 'buckIds' });
      }
      const sit = await Sit.create(
        {
          firmId: me.firmId,
          propertyId: property.id,
          standUnitId: stand.id,
          startedAt: new Date(values.startedAt),
          endedAt: new Date(values.endedAt),
          windFrom: values.windFrom ?? null,
          windMph: values.windMph ?? null,
          bucks: values.seen.bucks,
          does: values.seen.does,
          fawns: values.seen.fawns,
          notes: values.notes ? values.notes : null,
          buckIds,
          loggedById: me.id,
          idempotencyKey: key,
        },
        { transaction },
      );
      await recordAudit({ firmId: me.firmId, userId: me.id, action: 'sit.logged', subjectType: 'Sit', subjectId: sit.id, data: { propertyId: property.id, standUnitId: stand.id, idempotencyKey: key }, ip }, transaction);
      return { sit, replayed: false };
    });
  } catch (error) {
    // Two sends of the same sit at once: the second finds the first.
    if (error instanceof UniqueConstraintError) {
      const first = await Sit.findOne({ where: { firmId: me.firmId, idempotencyKey: key } });
      if (first && first.propertyId === propertyId) return { sit: first, replayed: true };
    }
    throw error;
  }
}

/** Changes the firm's planner settings (cone half-angle and reach, route buffer, weekly sit limit). */
export async function updateHuntingSettings(me: SessionUser, input: HuntingSettingsUpdateInput, ip: string | null): Promise<Record<string, unknown>> {
  return sequelize.transaction(async (transaction) => {
    const firm = await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!firm) throw notFound('Your firm');
    const settings = { ...(firm.settings ?? {}) } as Record<string, unknown>;
    settings.hunting = { ...((settings.hunting as Record<string, unknown>) ?? {}), ...input };
    await firm.update({ settings }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'firm.hunting-settings', subjectType: 'Firm', subjectId: firm.id, data: { ...input }, ip }, transaction);
    return settings;
  });
}

/** Turns sit and harvest logging in the portal on or off for a client's contacts. */
export async function setSitLogging(me: SessionUser, clientId: number, allowed: boolean, ip: string | null): Promise<Client> {
  return sequelize.transaction(async (transaction) => {
    const client = await findInFirm(Client, clientId, me.firmId, 'That client', { transaction });
    await client.update({ portalSitsAllowed: allowed }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: allowed ? 'client.sit-logging-on' : 'client.sit-logging-off', subjectType: 'Client', subjectId: client.id, ip }, transaction);
    return client;
  });
}
