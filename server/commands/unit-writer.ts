/** Creates, edits and deletes plan units; every write re-measures on the server and bumps the plan revision. */
import type { Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Firm, Property, Unit } from '../models';
import { GeometryKindMismatchError, measureUnit } from '../../shared/domain/geometry';
import type { UnitCreateInput, UnitUpdateInput } from '../../shared/schemas/unit';
import type { SessionUser } from '../../shared/schemas/auth';
import type { UnitKind } from '../../shared/domain/unit-kinds';
import type { Geometry } from 'geojson';
import { GEOMETRY_LIMITS } from '../../shared/limits';
import { conflict, notFound, unprocessable } from '../errors';
import { assertValidInDatabase } from './geometry-validator';
import { recordAudit } from './audit-recorder';
import { stripCrs } from '../presenters/geojson';
import { CONFIRM_LARGE_AREA_FIELD, largeAreaThreshold, largeUnitMessage } from '../../shared/domain/large-area';

/** The stored measure columns of a unit; 422 when the geometry does not fit the kind. */
function measureColumns(kind: UnitKind, geometry: Geometry, field = 'geometry') {
  try {
    const m = measureUnit(kind, geometry);
    const round = (v: number | null, places: number) => (v === null ? null : Math.round(v * 10 ** places) / 10 ** places);
    return { acres: round(m.acres, 4), perimeterFt: round(m.perimeterFt, 1), lengthFt: round(m.lengthFt, 1) };
  } catch (err) {
    if (err instanceof GeometryKindMismatchError) throw unprocessable(`${field}: ${err.message}`, [{ path: field, message: err.message }]);
    throw err;
  }
}

/** Locks the property (serialising revision bumps) and checks it belongs to the firm. */
async function lockProperty(propertyId: number, firmId: number, transaction: Transaction): Promise<Property> {
  const property = await Property.findOne({ where: { id: propertyId, firmId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!property) throw notFound('That property');
  return property;
}

/** The firm's large-area threshold, acres. */
export async function firmLargeAreaAcres(firmId: number, transaction: Transaction): Promise<number> {
  const firm = await Firm.findByPk(firmId, { attributes: ['id', 'settings'], transaction });
  return largeAreaThreshold(firm?.settings);
}

/**
 * 422 naming `confirmLargeArea` when a unit is larger than its property (or, with no boundary, than
 * the firm's threshold) and the request did not confirm it. Checked before anything is written.
 */
function assertSizeConfirmed(unitAcres: number | null, property: Property, thresholdAcres: number, name: string, confirmed: boolean | undefined, prefix: string): void {
  if (confirmed) return;
  const message = largeUnitMessage(unitAcres, property.acres, thresholdAcres, name);
  if (message) throw unprocessable(message, [{ path: `${prefix}${CONFIRM_LARGE_AREA_FIELD}`, message }]);
}

async function bump(property: Property, transaction: Transaction): Promise<void> {
  await property.update({ revision: property.revision + 1 }, { transaction });
}

/** Adds units to a property in one transaction (one for a drawing, many for an import). */
export async function createUnits(actor: SessionUser, propertyId: number, inputs: UnitCreateInput[], ip: string | null, options: { confirmLargeArea?: boolean } = {}): Promise<Unit[]> {
  return sequelize.transaction(async (transaction) => {
    const property = await lockProperty(propertyId, actor.firmId, transaction);
    const threshold = await firmLargeAreaAcres(actor.firmId, transaction);
    const existing = await Unit.count({ where: { propertyId }, transaction });
    if (existing + inputs.length > GEOMETRY_LIMITS.unitsPerProperty) {
      throw conflict(`A property holds at most ${GEOMETRY_LIMITS.unitsPerProperty} units; this one has ${existing}. Merge or delete some first.`);
    }
    const units: Unit[] = [];
    for (const [i, input] of inputs.entries()) {
      const field = inputs.length > 1 ? `units.${i}.geometry` : 'geometry';
      const measures = measureColumns(input.kind, input.geometry, field);
      assertSizeConfirmed(measures.acres, property, threshold, input.name, options.confirmLargeArea || input.confirmLargeArea, inputs.length > 1 ? `units.${i}.` : '');
      await assertValidInDatabase(input.geometry, field, transaction);
      units.push(
        await Unit.create({ firmId: actor.firmId, propertyId, kind: input.kind, name: input.name, notes: input.notes ?? null, geometry: input.geometry, ...measures }, { transaction }),
      );
    }
    await bump(property, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'unit.created', subjectType: 'Property', subjectId: propertyId, data: { count: units.length }, ip }, transaction);
    return units;
  });
}

/** Edits a unit; a new geometry or kind is re-measured. */
export async function updateUnit(actor: SessionUser, unitId: number, input: UnitUpdateInput, ip: string | null): Promise<Unit> {
  return sequelize.transaction(async (transaction) => {
    const found = await Unit.findOne({ where: { id: unitId, firmId: actor.firmId }, transaction, attributes: ['id', 'propertyId'] });
    if (!found) throw notFound('That unit');
    const property = await lockProperty(found.propertyId, actor.firmId, transaction);
    const unit = (await Unit.findByPk(unitId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const kind = input.kind ?? unit.kind;
    const changes: Record<string, unknown> = {};
    if (input.name !== undefined) changes.name = input.name;
    if (input.notes !== undefined) changes.notes = input.notes ?? null;
    if (input.kind !== undefined || input.geometry !== undefined) {
      const geometry = input.geometry ?? unit.geometry;
      const measures = measureColumns(kind, geometry, input.geometry ? 'geometry' : 'kind');
      if (input.geometry) {
        assertSizeConfirmed(measures.acres, property, await firmLargeAreaAcres(actor.firmId, transaction), input.name ?? unit.name, input.confirmLargeArea, '');
        await assertValidInDatabase(input.geometry, 'geometry', transaction);
      }
      Object.assign(changes, { kind, geometry: stripCrs(geometry) }, measures);
    }
    await unit.update(changes, { transaction });
    await bump(property, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'unit.updated', subjectType: 'Unit', subjectId: unit.id, ip }, transaction);
    return unit;
  });
}

/** Deletes a unit. */
export async function deleteUnit(actor: SessionUser, unitId: number, ip: string | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const unit = await Unit.findOne({ where: { id: unitId, firmId: actor.firmId }, transaction, attributes: ['id', 'propertyId', 'name'] });
    if (!unit) throw notFound('That unit');
    const property = await lockProperty(unit.propertyId, actor.firmId, transaction);
    await Unit.destroy({ where: { id: unitId }, transaction });
    await bump(property, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'unit.deleted', subjectType: 'Unit', subjectId: unitId, data: { name: unit.name }, ip }, transaction);
  });
}

