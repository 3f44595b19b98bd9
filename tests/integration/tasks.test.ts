import { beforeAll, describe, expect, it } from 'vitest';
import { TaskDtoSchema, TaskListDtoSchema } from '../../shared/schemas/task';
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { signedInAgent, anonymousAgent, capturedMailTo, deliverAllMail, type Agent } from '../support/test-app';
import { makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { withGpsExif } from '../support/exif';
import { AuditEvent, OutboxMessage, Practice, Property, Task, TaskPhoto } from '../../server/models';
import { config } from '../../server/config';
import { PHOTO_LIMITS } from '../../shared/limits';

const JPEG = fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/photos/field-plot.jpg'));
const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
let client: Agent;
let propertyId: number;
let plotUnitId: number;
let crew2Id: number;

const key = () => `test-${crypto.randomUUID()}`;

function complete(agent: Agent, taskId: number, fields: Record<string, string>, photos: { name: string; bytes: Buffer; type?: string }[] = [], idempotencyKey: string | null = key()) {
  let req = agent.post(`/api/tasks/${taskId}/complete`).set('X-CSRF-Token', agent.csrf);
  if (idempotencyKey) req = req.set('Idempotency-Key', idempotencyKey);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  for (const p of photos) req = req.attach('photos', p.bytes, { filename: p.name, contentType: p.type ?? 'image/jpeg' });
  return req;
}

async function tasksOf(agent: Agent, query = ''): Promise<{ id: number; name: string; stepKey: string; unitId: number; status: string; assigneeId: number | null; costCents: number | null; quantities: { label: string; amount: number; rateText: string }[]; cautions: { id: string }[]; dependsOn: string[]; location: [number, number] | null; earliest: string; latest: string }[]> {
  const res = await agent.get(`/api/tasks${query}`);
  expect(res.status).toBe(200);
  return TaskListDtoSchema.parse(res.body.data).tasks as unknown as Awaited<ReturnType<typeof tasksOf>>;
}

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew2Id = (await makeUser(ctx.firm.id, 'crew')).id;
  propertyId = (await makeProperty(ctx.firm.id, ctx.client.id)).id;
  const plot = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'food-plot', name: 'North plot', geometry: rectangle(-90.938, 43.2655, 120, 80) });
  const timber = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'timber', name: 'Oak slope', geometry: rectangle(-90.936, 43.2655, 200, 150) });
  plotUnitId = plot.body.data.id;
  const brassica = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'fall-brassica-plot' } }))!.id;
  const tsi = (await Practice.findOne({ where: { firmId: ctx.firm.id, key: 'tsi-hinge-cut' } }))!.id;
  expect((await send(consultant, 'post', `/api/units/${plotUnitId}/prescriptions`, { practiceId: brassica })).status).toBe(201);
  expect((await send(consultant, 'post', `/api/units/${timber.body.data.id}/prescriptions`, { practiceId: tsi })).status).toBe(201);
  const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { depositPct: 30 });
  expect(draft.status).toBe(201);
  expect((await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`)).status).toBe(200);
  expect((await send(client, 'post', `/api/proposals/${draft.body.data.id}/approve`, { signedName: 'Pat Landowner' })).status).toBe(200);
});

describe('tasks from an approved proposal', () => {
  it('makes one task per prescription step, in the approval’s transaction, with windows, quantities, costs and cautions', async () => {
    const tasks = await tasksOf(consultant, `?propertyId=${propertyId}`);
    const rows = await Task.findAll({ where: { propertyId } });
    expect(tasks.length).toBe(rows.length);
    expect(tasks.length).toBeGreaterThanOrEqual(4);
    expect(tasks.every((t) => t.status === 'planned' && t.assigneeId === null)).toBe(true);
    expect(tasks.every((t) => t.earliest <= t.latest)).toBe(true);
    // Seeding carries the seed with its rate as written; a spray step carries the herbicide caution.
    const seeding = tasks.find((t) => t.quantities.some((q) => /lb\/acre/.test(q.rateText)));
    expect(seeding).toBeDefined();
    const spray = tasks.find((t) => t.cautions.some((c) => c.id === 'herbicide'));
    expect(spray).toBeDefined();
    const hinge = tasks.find((t) => t.cautions.some((c) => c.id === 'hinge-cutting'));
    expect(hinge).toBeDefined();
    // Cost shares add up to the prescriptions' totals exactly (largest-remainder split).
    const sum = rows.reduce((s, t) => s + t.costCents, 0);
    const { Prescription } = await import('../../server/models');
    const rx = await Prescription.findAll({ where: { propertyId } });
    expect(sum).toBe(rx.reduce((s, p) => s + p.totalCents, 0));
    expect(tasks[0].location).not.toBeNull();
  });

  it('lets the consultant assign and move a task; the status follows; bad edits are 422 and change nothing', async () => {
    const [task] = await tasksOf(consultant, `?propertyId=${propertyId}`);
    const moved = await send(consultant, 'patch', `/api/tasks/${task.id}`, { assigneeId: ctx.users.crew.id, startDate: task.earliest });
    expect(moved.status).toBe(200);
    expect(TaskDtoSchema.parse(moved.body.data)).toMatchObject({ status: 'scheduled', assigneeId: ctx.users.crew.id, startDate: task.earliest, endDate: task.earliest });
    const backwards = await send(consultant, 'patch', `/api/tasks/${task.id}`, { startDate: '2026-09-10', endDate: '2026-09-01' });
    expect(backwards.status).toBe(422);
    expect((await send(consultant, 'patch', `/api/tasks/${task.id}`, { startDate: '2026-02-30' })).status).toBe(422);
    const stranger = await makeFirm();
    expect((await send(consultant, 'patch', `/api/tasks/${task.id}`, { assigneeId: stranger.users.crew.id })).status).toBe(422);
    const after = await Task.findByPk(task.id);
    expect(after).toMatchObject({ assigneeId: ctx.users.crew.id, startDate: task.earliest });
    const unassigned = await send(consultant, 'patch', `/api/tasks/${task.id}`, { assigneeId: null });
    expect(unassigned.body.data.status).toBe('planned');
    await send(consultant, 'patch', `/api/tasks/${task.id}`, { assigneeId: ctx.users.crew.id }).expect(200);
  });

  it('warns when a step is scheduled before the step it depends on', async () => {
    const tasks = await tasksOf(consultant, `?propertyId=${propertyId}`);
    const dependent = tasks.find((t) => t.dependsOn.length > 0)!;
    const dep = tasks.find((t) => t.stepKey === dependent.dependsOn[0] && t.unitId === dependent.unitId)!;
    await send(consultant, 'patch', `/api/tasks/${dep.id}`, { startDate: dep.latest }).expect(200);
    await send(consultant, 'patch', `/api/tasks/${dependent.id}`, { startDate: dependent.earliest < dep.latest ? dependent.earliest : '2020-01-01' }).expect(200);
    const res = await consultant.get(`/api/tasks?propertyId=${propertyId}`).expect(200);
    expect(res.body.data.warnings.some((w: { taskId: number; code: string }) => w.taskId === dependent.id && w.code === 'before-dependency')).toBe(true);
  });
});

describe('assigning several tasks at once', () => {
  it('gives the selected tasks to one crew member in one transaction; a stranger’s task or a crew caller changes nothing', async () => {
    const tasks = await tasksOf(consultant, `?propertyId=${propertyId}`);
    const [a, b] = tasks.filter((t) => t.status !== 'done' && t.status !== 'skipped');
    const before = await Task.findAll({ where: { id: [a.id, b.id] }, order: [['id', 'ASC']] });
    const res = await send(consultant, 'post', '/api/tasks/assign', { taskIds: [a.id, b.id], assigneeId: crew2Id });
    expect(res.status).toBe(200);
    expect(res.body.data.map((t: { assigneeId: number }) => t.assigneeId)).toEqual([crew2Id, crew2Id]);
    expect((await Task.findAll({ where: { id: [a.id, b.id] } })).every((t) => t.assigneeId === crew2Id)).toBe(true);
    expect(await AuditEvent.count({ where: { action: 'tasks.assigned', firmId: ctx.firm.id } })).toBe(1);

    // Another firm's task in the selection: 404 and neither task changes.
    const other = await makeFirm();
    const otherProperty = await makeProperty(other.firm.id, other.client.id);
    const foreign = await Task.create({ firmId: other.firm.id, propertyId: otherProperty.id, stepKey: 'seed', name: 'Seed the plot', kind: 'seeding', practiceName: 'Fall brassica plot', unitName: 'Their plot', earliest: '2026-08-01', latest: '2026-09-15' } as never);
    const refused = await send(consultant, 'post', '/api/tasks/assign', { taskIds: [a.id, foreign.id], assigneeId: null });
    expect(refused.status).toBe(404);
    expect(refused.body.error).toMatch(/selected tasks/);
    expect((await Task.findByPk(foreign.id))!.assigneeId).toBeNull();
    expect((await Task.findByPk(a.id))!.assigneeId).toBe(crew2Id);
    // Someone of another firm as the assignee, a repeated id, an empty list: 422 with a sentence.
    expect((await send(consultant, 'post', '/api/tasks/assign', { taskIds: [a.id], assigneeId: other.users.crew.id })).status).toBe(422);
    const repeated = await send(consultant, 'post', '/api/tasks/assign', { taskIds: [a.id, a.id], assigneeId: null });
    expect(repeated.status).toBe(422);
    expect(JSON.stringify(repeated.body)).toMatch(/each task once/);
    expect((await send(consultant, 'post', '/api/tasks/assign', { taskIds: [], assigneeId: null })).status).toBe(422);
    // The crew cannot assign.
    expect((await send(crew, 'post', '/api/tasks/assign', { taskIds: [a.id], assigneeId: null })).status).toBe(403);
    expect((await Task.findByPk(a.id))!.assigneeId).toBe(crew2Id);

    // Back as they were, for the tests that follow.
    for (const t of before) await send(consultant, 'patch', `/api/tasks/${t.id}`, { assigneeId: t.assigneeId }).expect(200);
  });
});

describe('the crew’s view', () => {
  it('shows a crew member only their own tasks, without prices; a client sees none', async () => {
    const mine = await tasksOf(crew);
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((t) => t.assigneeId === ctx.users.crew.id && t.costCents === null)).toBe(true);
    const other = (await Task.findOne({ where: { propertyId, assigneeId: null } }))!;
    await crew.get(`/api/tasks/${other.id}`).expect(404);
    await client.get('/api/tasks').expect(403);
    const anon = await anonymousAgent();
    await anon.get('/api/tasks').expect(401);
    // Filters from the query string do not widen a crew member's view.
    const widened = await tasksOf(crew, `?assigneeId=${crew2Id}`);
    expect(widened.every((t) => t.assigneeId === ctx.users.crew.id)).toBe(true);
  });
});

describe('completing a task', () => {
  let taskId: number;
  beforeAll(async () => {
    taskId = (await tasksOf(crew))[0].id;
  });

  it('refuses what must be refused, storing nothing', async () => {
    const before = await TaskPhoto.count();
    const filesBefore = fs.existsSync(path.join(config.uploadsDir, 'photos')) ? fs.readdirSync(path.join(config.uploadsDir, 'photos')).length : 0;
    // No idempotency key.
    expect((await complete(crew, taskId, { doneOn: '2026-06-14' }, [], null)).status).toBe(400);
    // Not an image, whatever its name and claimed type says.
    const fake = await complete(crew, taskId, { doneOn: '2026-06-14' }, [{ name: 'photo.jpg', bytes: Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n'), type: 'image/jpeg' }]);
    expect(fake.status).toBe(415);
    expect(fake.body.error).toMatch(/not a photo/);
    // Over the size cap.
    const big = Buffer.concat([JPEG, Buffer.alloc(PHOTO_LIMITS.maxBytes + 1)]);
    const tooBig = await complete(crew, taskId, { doneOn: '2026-06-14' }, [{ name: 'huge.jpg', bytes: big }]);
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.error).toMatch(/larger than 15 MB/);
    // A date in the future, negative hours.
    expect((await complete(crew, taskId, { doneOn: '2999-01-01' })).status).toBe(422);
    expect((await complete(crew, taskId, { doneOn: '2026-06-14', hours: '-2' })).status).toBe(422);
    // A client completes nothing; another crew member cannot complete it.
    expect((await complete(client, taskId, { doneOn: '2026-06-14' })).status).toBe(403);
    const other = await signedInAgent((await makeUser(ctx.firm.id, 'crew')).email, PASSWORD);
    expect((await complete(other, taskId, { doneOn: '2026-06-14' }, [{ name: 'a.jpg', bytes: JPEG }])).status).toBe(403);
    expect(await TaskPhoto.count()).toBe(before);
    const filesAfter = fs.existsSync(path.join(config.uploadsDir, 'photos')) ? fs.readdirSync(path.join(config.uploadsDir, 'photos')).length : 0;
    expect(filesAfter).toBe(filesBefore);
    expect((await Task.findByPk(taskId))!.status).not.toBe('done');
  });

  it('marks it done with notes, hours, quantities used and photos; the photo’s GPS position is kept', async () => {
    const k = key();
    const photo = withGpsExif(JPEG, 43.26571, -90.93748);
    const res = await complete(crew, taskId, { doneOn: '2026-06-14', notes: 'Soil was dry; drilled shallow.', hours: '3.5', quantitiesUsed: JSON.stringify([{ key: 'x', label: 'Seed', amount: 12.5, unit: 'lb' }]) }, [{ name: 'plot.jpg', bytes: photo }], k);
    expect(res.status).toBe(201);
    expect(res.body.replayed).toBe(false);
    expect(res.body.data).toMatchObject({ status: 'done', doneOn: '2026-06-14', hours: 3.5, notes: 'Soil was dry; drilled shallow.' });
    expect(res.body.data.quantitiesUsed[0]).toMatchObject({ label: 'Seed', amount: 12.5 });
    expect(res.body.data.photos).toHaveLength(1);
    expect(res.body.data.photos[0].latitude).toBeCloseTo(43.26571, 4);
    expect(res.body.data.photos[0].longitude).toBeCloseTo(-90.93748, 4);
    const url = res.body.data.photos[0].url as string;
    const got = await crew.get(url).buffer(true).expect(200);
    expect(got.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(got.body as Buffer, photo)).toBe(0);
    // The photo is for those who may see the task: the owning client yes, another firm's staff no.
    await client.get(url).expect(200);
    const stranger = await makeFirm();
    const outsider = await signedInAgent(stranger.users.consultant.email, PASSWORD);
    await outsider.get(url).expect(404);

    // The same key again: the first completion is answered, nothing is stored twice.
    const again = await complete(crew, taskId, { doneOn: '2026-06-14' }, [{ name: 'plot.jpg', bytes: photo }], k);
    expect(again.status).toBe(200);
    expect(again.body.replayed).toBe(true);
    expect(await TaskPhoto.count({ where: { taskId } })).toBe(1);
    expect(await AuditEvent.count({ where: { action: 'task.completed', subjectId: taskId } })).toBe(1);
    // A new key for a task already done: 409.
    const twice = await complete(crew, taskId, { doneOn: '2026-06-15' }, [], key());
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatch(/already/);
  });

  it('records one completion when the same key arrives twice at once', async () => {
    const open = (await Task.findOne({ where: { propertyId, assigneeId: null, status: 'planned' } }))!;
    await send(consultant, 'patch', `/api/tasks/${open.id}`, { assigneeId: ctx.users.crew.id }).expect(200);
    const task = (await tasksOf(crew)).find((t) => t.id === open.id)!;
    const k = key();
    const [a, b] = await Promise.all([complete(crew, task.id, { doneOn: '2026-06-14' }, [{ name: 'a.jpg', bytes: JPEG }], k), complete(crew, task.id, { doneOn: '2026-06-14' }, [{ name: 'a.jpg', bytes: JPEG }], k)]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(await TaskPhoto.count({ where: { taskId: task.id } })).toBe(1);
  });

  it('skips with a reason, and the consultant can reopen', async () => {
    const [task] = await tasksOf(consultant, `?propertyId=${propertyId}&status=planned`);
    await send(consultant, 'patch', `/api/tasks/${task.id}`, { assigneeId: ctx.users.crew.id }).expect(200);
    expect((await send(crew, 'post', `/api/tasks/${task.id}/skip`, { reason: '' })).status).toBe(422);
    const skipped = await send(crew, 'post', `/api/tasks/${task.id}/skip`, { reason: 'Standing water; the plot is too wet to work.' });
    expect(skipped.status).toBe(200);
    expect(skipped.body.data).toMatchObject({ status: 'skipped', skipReason: 'Standing water; the plot is too wet to work.' });
    expect((await send(crew, 'post', `/api/tasks/${task.id}/reopen`)).status).toBe(403);
    const reopened = await send(consultant, 'post', `/api/tasks/${task.id}/reopen`);
    expect(reopened.body.data.status).toBe(reopened.body.data.startDate ? 'scheduled' : 'planned');
    expect(reopened.body.data.skipReason).toBeNull();
  });
});

describe('progress', () => {
  it('reports the plan and each unit by count and by cost, and e-mails the client when a unit is finished (if asked)', async () => {
    await send(consultant, 'patch', `/api/properties/${propertyId}/progress-settings`, { notifyClientOnUnitDone: true }).expect(200);
    expect((await Property.findByPk(propertyId))!.notifyClientOnUnitDone).toBe(true);
    const plotTasks = await Task.findAll({ where: { unitId: plotUnitId } });
    for (const t of plotTasks.filter((t) => t.status !== 'done')) {
      await send(consultant, 'patch', `/api/tasks/${t.id}`, { assigneeId: ctx.users.crew.id }).expect(200);
      // A herbicide step is completed with its spray record (7 CFR Part 110 fields; tests/integration/spray-records.test.ts).
      const herbicide = t.kind === 'spray' || t.cautions.some((c) => c.id === 'herbicide');
      const spray = { products: t.quantities.filter((q) => q.key.startsWith('herb-')).map((q) => ({ materialKey: q.key, amount: q.amount, unit: 'gal' })), cropOrSite: 'Food plot', areaTreatedAcres: 1, windMph: 3, windDirection: 'W', airTempF: 70, applicatorName: 'Sam Crew' };
      expect((await complete(crew, t.id, { doneOn: '2026-06-20', ...(herbicide ? { spray: JSON.stringify(spray) } : {}) })).status).toBe(201);
    }
    const res = await consultant.get(`/api/properties/${propertyId}/progress`).expect(200);
    const unit = res.body.data.units.find((u: { unitId: number }) => u.unitId === plotUnitId);
    expect(unit).toMatchObject({ status: 'done', percentByCount: 100, percentByCost: 100 });
    const all = await Task.findAll({ where: { propertyId } });
    const done = all.filter((t) => t.status === 'done');
    expect(res.body.data.plan.done).toBe(done.length);
    expect(res.body.data.plan.doneCostCents).toBe(done.reduce((s, t) => s + t.costCents, 0));
    // The client reads their own progress; one e-mail tells them the plot is finished.
    await client.get(`/api/properties/${propertyId}/progress`).expect(200);
    expect(await OutboxMessage.count({ where: { kind: 'unit-done', toAddress: ctx.users.client.email } })).toBe(1);
    await deliverAllMail();
    const mail = await capturedMailTo(ctx.users.client.email);
    expect(mail.some((m) => /Work finished on North plot/.test(m.subject))).toBe(true);
    await crew.get(`/api/properties/${propertyId}/progress`).expect(403);
    // The Desk's "in the window" list leaves out steps whose task is finished.
    const finishedSteps = new Set(done.map((t) => `${t.prescriptionId}:${t.name}`));
    const desk = await consultant.get('/api/desk').expect(200);
    const listed = (desk.body.data.inWindow as { prescriptionId: number; stepName: string }[]).map((s) => `${s.prescriptionId}:${s.stepName}`);
    expect(listed.filter((k) => finishedSteps.has(k))).toEqual([]);
  });
});

describe('calendar feed', () => {
  it('serves the crew member’s scheduled tasks as iCalendar at a private URL until revoked', async () => {
    const made = await send(crew, 'post', '/api/calendar-feeds');
    expect(made.status).toBe(201);
    const url = new URL(made.body.data.url as string);
    const anon = await anonymousAgent();
    const feed = await anon.get(url.pathname).expect(200);
    expect(feed.headers['content-type']).toMatch(/text\/calendar/);
    const text = feed.text.replace(/\r\n /g, '');
    // RFC 5545: a VCALENDAR with VERSION 2.0 and a PRODID; all-day events as DTSTART;VALUE=DATE.
    expect(text).toMatch(/^BEGIN:VCALENDAR\r\nVERSION:2\.0\r\n/);
    expect(text).toMatch(/PRODID:/);
    const scheduled = await Task.count({ where: { assigneeId: ctx.users.crew.id } });
    expect(scheduled).toBeGreaterThan(0);
    expect(text).toMatch(/DTSTART;VALUE=DATE:\d{8}/);
    expect(text).not.toMatch(/\$\d/); // no prices in the crew's calendar
    const list = await crew.get('/api/calendar-feeds').expect(200);
    expect(list.body.data[0].url).toBeUndefined();
    await crew.delete(`/api/calendar-feeds/${made.body.data.id}`).set('X-CSRF-Token', crew.csrf).expect(204);
    await anon.get(url.pathname).expect(404);
    await anon.get('/api/calendar/not-a-real-token-at-all-xx.ics').expect(404);
  });
});
