/**
 * Changes to tasks: the consultant schedules and assigns; the crew completes (with photos, once per
 * idempotency key) or skips with a reason. Every change is one transaction with its audit record.
 */
import { emailFirmContact } from '../services/firm-profile';
import { Op, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Firm, Property, Task, TaskPhoto, User } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { TaskAssignInput, TaskCompleteInput, TaskUpdateInput } from '../../shared/schemas/task';
import { plannedOrScheduled, progressOf } from '../../shared/domain/tasks';
import { addDays } from '../../shared/domain/planting-windows';
import { conflict, forbidden, notFound, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { recordSprayApplication } from './spray-record-writer';
import { deleteFile, saveFile } from '../services/storage/storage';
import type { InspectedPhoto } from '../services/tasks/photo-intake';
import { enqueueEmail } from '../services/mail/outbox';
import { unitDoneEmail } from '../../templates/email/unit-done';
import { clientRecipients } from '../services/mail/client-recipients';
import { config } from '../config';
import { firmToday } from '../services/clock';
import { formatDate } from '../../shared/domain/clock';

const STAFF_ROLES = new Set(['owner', 'consultant']);
const isStaff = (actor: SessionUser) => STAFF_ROLES.has(actor.role);

/** A task the actor may work on: staff of its firm, or the crew member it is assigned to. Locked when a transaction is given. */
export async function taskForActor(actor: SessionUser, id: number, transaction?: Transaction): Promise<Task> {
  const task = await Task.findOne({ where: { id, firmId: actor.firmId }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!task) throw notFound('That task');
  if (isStaff(actor)) return task;
  if (actor.role === 'crew') {
    if (task.assigneeId !== actor.id) throw forbidden('This task is assigned to someone else. Ask your consultant to assign it to you.');
    return task;
  }
  throw notFound('That task');
}

/** Reschedules, reassigns or annotates a task (staff only). Done and skipped tasks keep their dates. */
export async function updateTask(actor: SessionUser, id: number, input: TaskUpdateInput, ip: string | null): Promise<Task> {
  if (!isStaff(actor)) throw forbidden('Only the firm’s consultants schedule and assign tasks.');
  return sequelize.transaction(async (transaction) => {
    const task = await taskForActor(actor, id, transaction);
    const finished = task.status === 'done' || task.status === 'skipped';
    if (finished && (input.assigneeId !== undefined || input.startDate !== undefined || input.endDate !== undefined)) {
      throw conflict(`This task is ${task.status} already; reopen it before moving or reassigning it.`);
    }
    if (input.assigneeId !== undefined && input.assigneeId !== null) {
      const assignee = await User.findOne({ where: { id: input.assigneeId, firmId: actor.firmId, active: true, role: { [Op.in]: ['crew', 'owner', 'consultant'] } }, transaction });
      if (!assignee) throw unprocessable('assigneeId: pick an active crew member or consultant of your firm.');
    }
    const next = {
      assigneeId: input.assigneeId !== undefined ? input.assigneeId : task.assigneeId,
      startDate: input.startDate !== undefined ? input.startDate : task.startDate,
      endDate: input.endDate !== undefined ? input.endDate : task.endDate,
    };
    if (input.startDate !== undefined && input.endDate === undefined && next.startDate && (!next.endDate || next.endDate < next.startDate)) next.endDate = next.startDate;
    if (next.startDate === null) next.endDate = null;
    if (next.endDate && !next.startDate) throw unprocessable('startDate: give a start date along with the end date.');
    if (next.startDate && next.endDate && next.endDate < next.startDate) throw unprocessable('endDate: the end date must not come before the start date.');
    await task.update({ ...next, ...(input.notes !== undefined ? { notes: input.notes } : {}), ...(finished ? {} : { status: plannedOrScheduled(next.assigneeId, next.startDate) }) }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'task.updated', subjectType: 'Task', subjectId: task.id, data: { ...input }, ip }, transaction);
    return task;
  });
}

/**
 * Gives several tasks to one person (or to nobody) in one transaction: every task must be of the
 * actor's firm and still open, or nothing changes. Dates stay as they are; the status follows.
 */
export async function assignTasks(actor: SessionUser, input: TaskAssignInput, ip: string | null): Promise<Task[]> {
  if (!isStaff(actor)) throw forbidden('Only the firm’s consultants schedule and assign tasks.');
  return sequelize.transaction(async (transaction) => {
    const tasks = await Task.findAll({ where: { id: { [Op.in]: input.taskIds }, firmId: actor.firmId }, order: [['id', 'ASC']], transaction, lock: transaction.LOCK.UPDATE });
    if (tasks.length !== input.taskIds.length) throw notFound(input.taskIds.length === 1 ? 'That task' : 'One of the selected tasks');
    const finished = tasks.filter((t) => t.status === 'done' || t.status === 'skipped');
    if (finished.length > 0) {
      throw conflict(`${finished.map((t) => t.name).join(', ')} ${finished.length === 1 ? 'is' : 'are'} finished already; reopen ${finished.length === 1 ? 'it' : 'them'} or leave ${finished.length === 1 ? 'it' : 'them'} out of the selection.`);
    }
    if (input.assigneeId !== null) {
      const assignee = await User.findOne({ where: { id: input.assigneeId, firmId: actor.firmId, active: true, role: { [Op.in]: ['crew', 'owner', 'consultant'] } }, transaction });
      if (!assignee) throw unprocessable('assigneeId: pick an active crew member or consultant of your firm.');
    }
    for (const task of tasks) {
      await task.update({ assigneeId: input.assigneeId, status: plannedOrScheduled(input.assigneeId, task.startDate) }, { transaction });
    }
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'tasks.assigned', subjectType: 'Task', subjectId: tasks[0].id, data: { taskIds: input.taskIds, assigneeId: input.assigneeId }, ip }, transaction);
    return tasks;
  });
}

export interface CompletionResult {
  task: Task;
  /** True when this idempotency key had completed the task already: nothing new was stored. */
  replayed: boolean;
}

/** The completion an idempotency key already made, if any (a phone resending after a lost answer). */
async function earlierCompletion(actor: SessionUser, taskId: number, key: string): Promise<Task | null> {
  const earlier = await Task.findOne({ where: { firmId: actor.firmId, completionKey: key } });
  if (!earlier) return null;
  if (earlier.id !== taskId) throw conflict('This idempotency key was used for another task; make a new key for each completion.');
  return earlier;
}

/** When every task of the unit is finished, tells the client (if the property asks for it), in the same transaction. */
async function notifyUnitDone(task: Task, transaction: Transaction): Promise<void> {
  if (task.unitId === null) return;
  const property = await Property.findByPk(task.propertyId, { attributes: ['id', 'name', 'clientId', 'notifyClientOnUnitDone'], transaction });
  if (!property?.notifyClientOnUnitDone) return;
  const unitTasks = await Task.findAll({ where: { unitId: task.unitId }, attributes: ['status', 'costCents', 'unitId', 'name'], transaction });
  const progress = progressOf(unitTasks);
  if (progress.open > 0 || progress.done === 0) return;
  const [firm, recipients] = await Promise.all([Firm.findByPk(task.firmId, { transaction }), clientRecipients(property.clientId, transaction)]);
  for (const to of recipients) {
    await enqueueEmail(
      {
        firmId: task.firmId,
        kind: 'unit-done',
        to,
        email: unitDoneEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), propertyName: property.name, unitName: task.unitName, taskNames: unitTasks.filter((t) => t.status === 'done').map((t) => t.name), doneOn: task.doneOn ?? (await firmToday(task.firmId, transaction)), url: `${config.publicUrl}/portal/properties/${property.id}/progress` }),
      },
      transaction,
    );
  }
}

/**
 * Marks a task done with the date, notes, hours, quantities used and photos. The same idempotency
 * key answers the first completion again and stores nothing; a task already finished otherwise is 409.
 * Photo bytes are written before the transaction and removed again if it fails.
 */
export async function completeTask(actor: SessionUser, id: number, input: TaskCompleteInput, photos: InspectedPhoto[], key: string, ip: string | null): Promise<CompletionResult> {
  const replay = await earlierCompletion(actor, id, key);
  if (replay) {
    await taskForActor(actor, id);
    return { task: replay, replayed: true };
  }
  const probe = await taskForActor(actor, id);
  // The same key finished it between the two reads (a concurrent copy of this request): its answer.
  if (probe.status === 'done' && probe.completionKey === key) return { task: probe, replayed: true };
  if (probe.status === 'done' || probe.status === 'skipped') throw conflict(`This task was ${probe.status === 'done' ? `marked done on ${probe.doneOn ? formatDate(probe.doneOn) : 'an earlier day'}` : 'skipped'} already; nothing was changed.`);
  // The firm's today, with a day of slack for a crew phone set to a zone east of the firm's.
  if (input.doneOn > addDays(await firmToday(actor.firmId), 1)) throw unprocessable('doneOn: the day the work was done cannot be after today. Pick today or an earlier day.');
  const saved: string[] = [];
  try {
    for (const photo of photos) saved.push(await saveFile('photos', photo.bytes, photo.extension));
    const result = await sequelize.transaction(async (transaction): Promise<CompletionResult> => {
      const task = await taskForActor(actor, id, transaction);
      if (task.status === 'done' || task.status === 'skipped') {
        if (task.completionKey === key) return { task, replayed: true };
        throw conflict(`This task was ${task.status === 'done' ? `marked done on ${task.doneOn ? formatDate(task.doneOn) : 'an earlier day'}` : 'skipped'} already; nothing was changed.`);
      }
      await task.update(
        { status: 'done', doneOn: input.doneOn, completedAt: new Date(), completedById: actor.id, notes: input.notes, hours: input.hours, quantitiesUsed: input.quantitiesUsed ?? [], completionKey: key, skipReason: null },
        { transaction },
      );
      await TaskPhoto.bulkCreate(
        photos.map((p, i) => ({ firmId: task.firmId, taskId: task.id, storageKey: saved[i], originalName: p.originalName?.slice(0, 200) ?? null, contentType: p.contentType, byteSize: p.bytes.length, latitude: p.latitude, longitude: p.longitude, takenAt: p.takenAt, uploadedById: actor.id })),
        { transaction },
      );
      await recordSprayApplication(actor, task, input.spray, input.doneOn, transaction, ip);
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'task.completed', subjectType: 'Task', subjectId: task.id, data: { doneOn: input.doneOn, photos: photos.length, idempotencyKey: key }, ip }, transaction);
      await notifyUnitDone(task, transaction);
      return { task, replayed: false };
    });
    // A concurrent copy with the same key won the row lock: its photos are the stored ones, not ours.
    if (result.replayed) await Promise.all(saved.map((k) => deleteFile(k)));
    return result;
  } catch (error) {
    await Promise.all(saved.map((k) => deleteFile(k)));
    // A concurrent request with the same key won the unique index: answer its completion.
    if ((error as { name?: string }).name === 'SequelizeUniqueConstraintError') {
      const again = await earlierCompletion(actor, id, key);
      if (again) return { task: again, replayed: true };
    }
    throw error;
  }
}

/** Skips a task with a reason (its crew member or staff). */
export async function skipTask(actor: SessionUser, id: number, reason: string, ip: string | null): Promise<Task> {
  return sequelize.transaction(async (transaction) => {
    const task = await taskForActor(actor, id, transaction);
    if (task.status === 'done' || task.status === 'skipped') throw conflict(`This task is ${task.status} already; nothing was changed.`);
    await task.update({ status: 'skipped', skipReason: reason, completedAt: new Date(), completedById: actor.id }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'task.skipped', subjectType: 'Task', subjectId: task.id, data: { reason }, ip }, transaction);
    return task;
  });
}

/** Reopens a done or skipped task (staff): back to planned or scheduled; photos stay, a billed task stays closed. */
export async function reopenTask(actor: SessionUser, id: number, ip: string | null): Promise<Task> {
  if (!isStaff(actor)) throw forbidden('Only the firm’s consultants reopen tasks.');
  return sequelize.transaction(async (transaction) => {
    const task = await taskForActor(actor, id, transaction);
    if (task.status !== 'done' && task.status !== 'skipped') throw conflict('This task is still open.');
    if (task.invoiceId) throw conflict('This task is on an invoice already; void that invoice before reopening the task.');
    await task.update({ status: plannedOrScheduled(task.assigneeId, task.startDate), doneOn: null, completedAt: null, completedById: null, skipReason: null, completionKey: null }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'task.reopened', subjectType: 'Task', subjectId: task.id, ip }, transaction);
    return task;
  });
}
