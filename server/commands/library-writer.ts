/**
 * Writes to the firm's practice library (materials, service rates, practices): each in one
 * transaction with its audit record. Entries in use are archived, never deleted, because
 * prescriptions keep pointing at their keys.
 */
import { sequelize } from '../db/sequelize';
import { Material, Practice, Prescription, ServiceRateEntry } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { z } from 'zod';
import type { MaterialCreateInput, RateCreateInput, RateUpdateSchema } from '../../shared/schemas/library';
import { validatePracticeDefinition, type PracticeDefinition } from '../../shared/domain/practice';
import { validateServiceRate, type ServiceRate } from '../../shared/domain/service-rates';
import { conflict, unprocessable } from '../errors';
import { findInFirm } from '../policies/firm-scope';
import { loadLibrary } from '../services/library/library-reader';
import { materialKind } from '../presenters/library';
import { newLibraryKey, toMaterialDefinition } from './material-writer';
import { recordAudit } from './audit-recorder';

type Ip = string | null;
type RateUpdateInput = z.infer<typeof RateUpdateSchema>;
/** The firm's library as `loadLibrary` answers it (for presenting a practice). */
export type FirmLibrary = Awaited<ReturnType<typeof loadLibrary>>;
const audit = (actor: SessionUser, action: string, subjectType: string, subjectId: number, name: string, ip: Ip) =>
  ({ firmId: actor.firmId, userId: actor.id, action, subjectType, subjectId, data: { name }, ip });

/** Names of the firm's practices that use a library key (material or rate). */
async function practicesUsing(firmId: number, key: string): Promise<string[]> {
  const all = await Practice.findAll({ where: { firmId, archived: false } });
  return all.filter((p) => JSON.stringify(p.definition.steps).includes(`"${key}"`)).map((p) => p.name);
}

/** Adds a material to the firm's library. */
export async function createMaterial(actor: SessionUser, input: MaterialCreateInput, ip: Ip): Promise<Material> {
  const key = newLibraryKey(input.kind, input.name);
  const definition = toMaterialDefinition(input, key);
  return sequelize.transaction(async (transaction) => {
    const row = await Material.create({ firmId: actor.firmId, key, name: definition.name, definition }, { transaction });
    await recordAudit(audit(actor, 'material.created', 'Material', row.id, row.name, ip), transaction);
    return row;
  });
}

/** Edits a material (its kind stays: a different kind is a new material). */
export async function updateMaterial(actor: SessionUser, id: number, input: MaterialCreateInput, ip: Ip): Promise<Material> {
  return sequelize.transaction(async (transaction) => {
    const row = await findInFirm(Material, id, actor.firmId, 'That material', { transaction, lock: true });
    if (materialKind(row.definition.type) !== input.kind) throw unprocessable(`kind: this material is ${materialKind(row.definition.type)}; add a new material instead of changing its kind.`);
    const definition = toMaterialDefinition(input, row.key);
    await row.update({ name: definition.name, definition }, { transaction });
    await recordAudit(audit(actor, 'material.updated', 'Material', row.id, row.name, ip), transaction);
    return row;
  });
}

/** Archives a material no practice uses (409 naming the practices otherwise). */
export async function archiveMaterial(actor: SessionUser, id: number, ip: Ip): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const row = await findInFirm(Material, id, actor.firmId, 'That material', { transaction, lock: true });
    const users = await practicesUsing(actor.firmId, row.key);
    if (users.length) throw conflict(`“${row.name}” is used by ${users.slice(0, 3).join(', ')}${users.length > 3 ? ' and others' : ''}. Change those practices first.`);
    await row.update({ archived: true }, { transaction });
    await recordAudit(audit(actor, 'material.archived', 'Material', row.id, row.name, ip), transaction);
  });
}

/** Adds a service rate to the firm's library. */
export async function createRate(actor: SessionUser, input: RateCreateInput, ip: Ip): Promise<ServiceRateEntry> {
  const key = newLibraryKey('rate', input.name);
  const definition = { key, ...input };
  validateServiceRate(definition, 'rate');
  return sequelize.transaction(async (transaction) => {
    const row = await ServiceRateEntry.create({ firmId: actor.firmId, key, name: definition.name, definition }, { transaction });
    await recordAudit(audit(actor, 'rate.created', 'ServiceRateEntry', row.id, row.name, ip), transaction);
    return row;
  });
}

/** Edits a service rate; `minimumCents: null` removes the minimum. */
export async function updateRate(actor: SessionUser, id: number, input: RateUpdateInput, ip: Ip): Promise<ServiceRateEntry> {
  return sequelize.transaction(async (transaction) => {
    const row = await findInFirm(ServiceRateEntry, id, actor.firmId, 'That rate', { transaction, lock: true });
    const { minimumCents, ...changes } = input;
    const definition: ServiceRate = { ...row.definition, ...changes, key: row.key };
    if (minimumCents === null) delete definition.minimumCents;
    else if (minimumCents !== undefined) definition.minimumCents = minimumCents;
    validateServiceRate(definition, 'rate');
    await row.update({ name: definition.name, definition }, { transaction });
    await recordAudit(audit(actor, 'rate.updated', 'ServiceRateEntry', row.id, row.name, ip), transaction);
    return row;
  });
}

/** Archives a service rate no practice uses (409 naming the practices otherwise). */
export async function archiveRate(actor: SessionUser, id: number, ip: Ip): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const row = await findInFirm(ServiceRateEntry, id, actor.firmId, 'That rate', { transaction, lock: true });
    const users = await practicesUsing(actor.firmId, row.key);
    if (users.length) throw conflict(`“${row.name}” is used by ${users.slice(0, 3).join(', ')}. Change those practices first.`);
    await row.update({ archived: true }, { transaction });
    await recordAudit(audit(actor, 'rate.archived', 'ServiceRateEntry', row.id, row.name, ip), transaction);
  });
}

/** Validates a practice against the firm's library; answers the library for presenting it. */
async function checkedPractice(firmId: number, definition: PracticeDefinition): Promise<FirmLibrary> {
  const library = await loadLibrary(firmId);
  validatePracticeDefinition(definition, library.materials, library.rates);
  return library;
}

/** Adds a practice checked against the firm's library; answers it with the library for presenting. */
export async function createPractice(actor: SessionUser, input: Omit<PracticeDefinition, 'key'>, ip: Ip): Promise<{ row: Practice; library: FirmLibrary }> {
  const key = newLibraryKey('practice', input.name);
  const definition = { ...input, key };
  const library = await checkedPractice(actor.firmId, definition);
  const row = await sequelize.transaction(async (transaction) => {
    const created = await Practice.create({ firmId: actor.firmId, key, name: definition.name, definition }, { transaction });
    await recordAudit(audit(actor, 'practice.created', 'Practice', created.id, created.name, ip), transaction);
    return created;
  });
  return { row, library };
}

/** Edits a practice, checked against the firm's library. */
export async function updatePractice(actor: SessionUser, id: number, changes: Partial<PracticeDefinition>, ip: Ip): Promise<{ row: Practice; library: FirmLibrary }> {
  return sequelize.transaction(async (transaction) => {
    const row = await findInFirm(Practice, id, actor.firmId, 'That practice', { transaction, lock: true });
    const definition = { ...row.definition, ...changes, key: row.key };
    const library = await checkedPractice(actor.firmId, definition);
    await row.update({ name: definition.name, definition }, { transaction });
    await recordAudit(audit(actor, 'practice.updated', 'Practice', row.id, row.name, ip), transaction);
    return { row, library };
  });
}

/** Copies a practice as "<name> (copy)" under a new key. */
export async function duplicatePractice(actor: SessionUser, id: number, ip: Ip): Promise<Practice> {
  return sequelize.transaction(async (transaction) => {
    const row = await findInFirm(Practice, id, actor.firmId, 'That practice', { transaction });
    const key = newLibraryKey('practice', row.name);
    const name = `${row.name} (copy)`.slice(0, 120);
    const copy = await Practice.create({ firmId: actor.firmId, key, name, definition: { ...row.definition, key, name } }, { transaction });
    await recordAudit(audit(actor, 'practice.duplicated', 'Practice', copy.id, name, ip), transaction);
    return copy;
  });
}

/** Archives a practice; its prescriptions stay. Answers how many prescriptions keep it. */
export async function archivePractice(actor: SessionUser, id: number, ip: Ip): Promise<number> {
  return sequelize.transaction(async (transaction) => {
    const row = await findInFirm(Practice, id, actor.firmId, 'That practice', { transaction, lock: true });
    const inUse = await Prescription.count({ where: { firmId: actor.firmId, practiceId: row.id }, transaction });
    await row.update({ archived: true }, { transaction });
    await recordAudit(audit(actor, 'practice.archived', 'Practice', row.id, row.name, ip), transaction);
    return inUse;
  });
}
