/** The work schedule: tasks (crew see only their own), completions with photos, progress and the crew's calendar feed. */
import { z } from 'zod';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { idempotencyKey } from '../middlewares/idempotency-key';
import { arrayUpload } from '../middlewares/upload';
import { Property, Task, TaskPhoto } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { TaskListQuerySchema, TaskSkipSchema, TaskUpdateSchema, TaskAssignSchema } from '../../shared/schemas/task';
import { PHOTO_LIMITS } from '../../shared/limits';
import { TaskCompleteWithSpraySchema } from '../../shared/schemas/spray-records';
import { actor, findInFirm } from '../policies/firm-scope';
import { assignTasks, completeTask, reopenTask, skipTask, taskForActor, updateTask } from '../commands/task-writer';
import { setUnitDoneNotice } from '../commands/property-writer';
import { listTasks, readTask } from '../services/tasks/task-reader';
import { inspectPhoto } from '../services/tasks/photo-intake';
import { propertyProgress } from '../services/tasks/progress';
import { sendStoredFile } from '../services/storage/storage';
import { notFound } from '../errors';

const r = defineRoutes('/tasks');
const photosRouter = defineRoutes('/task-photos');
const perProperty = defineRoutes('/properties');
const WORKERS = ['owner', 'consultant', 'crew'] as const;

r.get('/', WORKERS, ...typed({ query: TaskListQuerySchema }, async ({ query }, req, res) => {
  res.json({ data: await listTasks(actor(req), query) });
}));

r.get('/:id', WORKERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const task = await Task.findOne({ where: { id: params.id, firmId: me.firmId } });
  // A crew member asking for someone else's task learns nothing about it.
  if (!task || (me.role === 'crew' && task.assigneeId !== me.id)) throw notFound('That task');
  res.json({ data: await readTask(me, task) });
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: TaskUpdateSchema }, async ({ params, body }, req, res) => {
  const task = await updateTask(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: await readTask(actor(req), task) });
}));

/** Several selected tasks to one crew member (or unassigned), all or nothing. */
r.post('/assign', STAFF, ...typed({ body: TaskAssignSchema }, async ({ body }, req, res) => {
  const me = actor(req);
  const tasks = await assignTasks(me, body, req.ip ?? null);
  res.json({ data: await Promise.all(tasks.map((t) => readTask(me, t))) });
}));


r.post('/:id/complete', WORKERS, ...typed({ params: IdParamsSchema, body: TaskCompleteWithSpraySchema }, async ({ params, body }, req, res) => {
  const files = (req.files as Express.Multer.File[] | undefined) ?? [];
  const photos = [];
  for (const file of files) photos.push(await inspectPhoto(file.buffer, file.originalname || null));
  const { task, replayed } = await completeTask(actor(req), params.id, body, photos, idempotencyKey(req, 'completion'), req.ip ?? null);
  res.status(replayed ? 200 : 201).json({ data: await readTask(actor(req), task), replayed });
}, {
  // Refuse before reading any file: wrong key, someone else's task or a finished task stores nothing.
  before: async (params, req) => {
    idempotencyKey(req, 'completion');
    await taskForActor(actor(req), params.id);
  },
  upload: arrayUpload('photos', PHOTO_LIMITS.maxBytes, PHOTO_LIMITS.perCompletion, 'photo'),
}));

r.post('/:id/skip', WORKERS, ...typed({ params: IdParamsSchema, body: TaskSkipSchema }, async ({ params, body }, req, res) => {
  const task = await skipTask(actor(req), params.id, body.reason, req.ip ?? null);
  res.json({ data: await readTask(actor(req), task) });
}));

r.post('/:id/reopen', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const task = await reopenTask(actor(req), params.id, req.ip ?? null);
  res.json({ data: await readTask(actor(req), task) });
}));

/** A completion photo, for staff of the firm, the crew member of the task, and the client who owns the property. */
photosRouter.get('/:id', ['owner', 'consultant', 'crew', 'client'], ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const photo = await findInFirm(TaskPhoto, params.id, me.firmId, 'That photo');
  const task = await Task.findByPk(photo.taskId, { attributes: ['id', 'assigneeId', 'propertyId'] });
  if (!task) throw notFound('That photo');
  if (me.role === 'crew' && task.assigneeId !== me.id) throw notFound('That photo');
  if (me.role === 'client') {
    const property = await Property.findOne({ where: { id: task.propertyId, firmId: me.firmId }, attributes: ['clientId'] });
    if (!property || property.clientId !== me.clientId) throw notFound('That photo');
  }
  res.setHeader('Content-Type', photo.contentType);
  res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
  res.setHeader('Content-Disposition', 'inline');
  await sendStoredFile(res, photo.storageKey);
}));

perProperty.get('/:id/progress', ['owner', 'consultant', 'client'], ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, params.id, me.firmId, 'That property');
  if (me.role === 'client' && property.clientId !== me.clientId) throw notFound('That property');
  res.json({ data: await propertyProgress(property) });
}));

const NotifySchema = z.object({ notifyClientOnUnitDone: z.boolean() }).strict();
perProperty.patch('/:id/progress-settings', STAFF, ...typed({ params: IdParamsSchema, body: NotifySchema }, async ({ params, body }, req, res) => {
  const property = await setUnitDoneNotice(actor(req), params.id, body.notifyClientOnUnitDone, req.ip ?? null);
  res.json({ data: { notifyClientOnUnitDone: property.notifyClientOnUnitDone } });
}));

export const tasksRouter = r.router;
export const taskPhotosRouter = photosRouter.router;
export const propertyProgressRouter = perProperty.router;
