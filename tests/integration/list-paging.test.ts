/**
 * Lists are paged with totals, never cut silently: the answer says how many match in all, `limit`
 * and `offset` walk through them, bad paging is a 422 with a sentence, and task lists carry unit
 * outlines only when asked.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { signedInAgent, type Agent } from '../support/test-app';
import { Invoice, Task, TaskPhoto, Unit } from '../../server/models';
import { measureUnit } from '../../shared/domain/geometry';
import { LIST_PAGE } from '../../shared/schemas/common';
import { TASK_PAGE, TaskListDtoSchema, weekLimit } from '../../shared/schemas/task';
import { INVOICE_PAGE, InvoiceListSummarySchema } from '../../shared/schemas/invoice';
import type { Polygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db/sequelize';
import { TASK_WINDOW_SQL } from '../../server/services/tasks/task-reader';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let crew: Agent;
const TASKS = 7;

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  const property = await makeProperty(ctx.firm.id, ctx.client.id);
  const geometry: Polygon = { type: 'Polygon', coordinates: [[[-90.938, 43.268], [-90.936, 43.268], [-90.936, 43.267], [-90.938, 43.267], [-90.938, 43.268]]] };
  const m = measureUnit('food-plot', geometry);
  const unit = await Unit.create({ firmId: ctx.firm.id, propertyId: property.id, kind: 'food-plot', name: 'Clover Plot', notes: null, geometry, acres: m.acres, perimeterFt: m.perimeterFt, lengthFt: m.lengthFt });
  await Task.bulkCreate(
    Array.from({ length: TASKS }, (_, i) => ({
      firmId: ctx.firm.id,
      propertyId: property.id,
      unitId: unit.id,
      stepKey: `step-${i}`,
      name: `Step ${i + 1}`,
      kind: 'planting',
      practiceName: 'Clover plot',
      unitName: unit.name,
      earliest: `2026-08-${String(10 + i).padStart(2, '0')}`,
      latest: '2026-09-15',
      assigneeId: ctx.users.crew.id,
    })),
  );
});

describe('paged lists', () => {
  it('answers a page of tasks with the total, and the next page from an offset', async () => {
    const first = await consultant.get('/api/tasks?limit=3').expect(200);
    expect(first.body.data.tasks).toHaveLength(3);
    expect(first.body.data.page).toEqual({ total: TASKS, limit: 3, offset: 0 });
    const rest = await consultant.get('/api/tasks?limit=3&offset=6').expect(200);
    expect(rest.body.data.tasks).toHaveLength(1);
    const ids = new Set([...first.body.data.tasks, ...rest.body.data.tasks].map((t: { id: number }) => t.id));
    expect(ids.size).toBe(4);
    const all = await consultant.get('/api/tasks').expect(200);
    // The task list's own phone-sized page when the address does not say (the other lists keep LIST_PAGE).
    expect(all.body.data.page).toEqual({ total: TASKS, limit: TASK_PAGE.defaultLimit, offset: 0 });
    expect(TASK_PAGE.defaultLimit).toBe(50);
    expect(TASK_PAGE.timelineLimit).toBeGreaterThan(TASK_PAGE.defaultLimit);
  });

  it('answers a listed task exactly as its own read does (names, point, photos)', async () => {
    const [task] = await Task.findAll({ where: { firmId: ctx.firm.id }, order: [['id', 'ASC']], limit: 1 });
    await TaskPhoto.create({ firmId: ctx.firm.id, taskId: task.id, storageKey: 'list-paging-photo', originalName: null, contentType: 'image/jpeg', byteSize: 1, latitude: 43.2675, longitude: -90.937, takenAt: new Date('2026-08-10T14:03:04.567Z'), uploadedById: null });
    const listed = await consultant.get('/api/tasks?geometry=true').expect(200);
    const one = await consultant.get(`/api/tasks/${task.id}`).expect(200);
    const fromList = listed.body.data.tasks.find((t: { id: number }) => t.id === task.id);
    expect(fromList.photos).toHaveLength(1);
    expect(fromList.photos[0].takenAt).toBe('2026-08-10T14:03:04.567Z');
    expect(fromList).toEqual(one.body.data);
  });

  it("answers a week with exactly the tasks whose window overlaps it, read through the window index", async () => {
    const property = await makeProperty(ctx.firm.id, ctx.client.id);
    const base = { firmId: ctx.firm.id, propertyId: property.id, unitId: null, kind: 'planting', practiceName: 'Clover plot', unitName: 'Whole property' };
    const cases: [name: string, dates: { earliest: string; latest: string; startDate?: string; endDate?: string }, inWeek: boolean][] = [
      ['long window across the week', { earliest: '2026-06-01', latest: '2026-12-31' }, true],
      ['ends on the first day', { earliest: '2026-08-01', latest: '2026-08-15', startDate: '2026-08-14', endDate: '2026-08-17' }, true],
      ['starts on the last day', { earliest: '2026-08-23', latest: '2026-09-30' }, true],
      ['scheduled inside, window outside', { earliest: '2026-01-01', latest: '2026-01-31', startDate: '2026-08-19' }, true],
      ['window inverted, inside', { earliest: '2026-08-20', latest: '2026-08-18' }, true],
      ['ends the day before', { earliest: '2026-08-01', latest: '2026-08-16' }, false],
      ['starts the day after', { earliest: '2026-08-24', latest: '2026-09-30' }, false],
      ['scheduled before, window across', { earliest: '2026-08-01', latest: '2026-08-31', startDate: '2026-08-02', endDate: '2026-08-03' }, false],
    ];
    await Task.bulkCreate(cases.map(([name, dates], i) => ({ ...base, stepKey: `window-${i}`, name, ...dates })));
    // The week of Monday 2026-08-17 to Sunday 2026-08-23 (dates as the week page asks for them).
    const week = await consultant.get(`/api/tasks?propertyId=${property.id}&from=2026-08-17&to=2026-08-23&limit=50`).expect(200);
    const names = (week.body.data.tasks as { name: string }[]).map((t) => t.name).sort();
    expect(names).toEqual(cases.filter(([, , inWeek]) => inWeek).map(([name]) => name).sort());
    expect(week.body.data.page.total).toBe(names.length);
    // The index answers the list's own date predicate (same expression as migration 0091), so a week
    // costs what the week holds, not what the firm has done before it.
    const [plan] = await sequelize.transaction(async (transaction) => {
      await sequelize.query('SET LOCAL enable_seqscan = off', { transaction });
      return sequelize.query<{ 'QUERY PLAN': string }>(
        `EXPLAIN SELECT t.id FROM tasks t WHERE t.firm_id = :firmId AND ${TASK_WINDOW_SQL} && daterange(CAST(:from AS date), CAST(:to AS date), '[]')`,
        { replacements: { firmId: ctx.firm.id, from: '2026-08-17', to: '2026-08-23' }, type: QueryTypes.SELECT, transaction, raw: true },
      );
    });
    expect(JSON.stringify(plan)).toContain('tasks_firm_window_idx');
    await Task.destroy({ where: { propertyId: property.id } });
    await property.destroy();
  });

  it("answers the week list a few tasks of each day with every day's total (perDay), never cutting a day silently", async () => {
    const property = await makeProperty(ctx.firm.id, ctx.client.id);
    const base = { firmId: ctx.firm.id, propertyId: property.id, unitId: null, kind: 'planting', practiceName: 'Clover plot', unitName: 'Whole property' };
    // The week of Monday 2026-09-07 to Sunday 2026-09-13.
    const monday = Array.from({ length: 5 }, (_, i) => ({ name: `Monday ${i + 1}`, earliest: '2026-09-01', latest: '2026-09-30', startDate: '2026-09-07' }));
    const spanning = { name: 'From the week before', earliest: '2026-09-01', latest: '2026-09-30', startDate: '2026-09-04', endDate: '2026-09-08' };
    const wednesday = { name: 'Wednesday', earliest: '2026-09-01', latest: '2026-09-30', startDate: '2026-09-09' };
    const open = Array.from({ length: 4 }, (_, i) => ({ name: `Open ${i + 1}`, earliest: '2026-09-01', latest: '2026-09-30' }));
    const outside = { name: 'Next week', earliest: '2026-09-01', latest: '2026-09-30', startDate: '2026-09-14' };
    await Task.bulkCreate([...monday, spanning, wednesday, ...open, outside].map((t, i) => ({ ...base, stepKey: `day-${i}`, position: i, ...t })));
    const week = `propertyId=${property.id}&from=2026-09-07&to=2026-09-13`;

    const res = await consultant.get(`/api/tasks?${week}&perDay=2&limit=${weekLimit(2)}`).expect(200);
    const answer = TaskListDtoSchema.parse(res.body.data);
    // Monday holds the task carried over from the week before (listed on its first day in the week) and five of its own.
    expect(answer.groups).toEqual([
      { date: '2026-09-07', total: 6 },
      { date: '2026-09-09', total: 1 },
      { date: null, total: 4 },
    ]);
    expect(answer.page?.total).toBe(11);
    const names = answer.tasks.map((t) => t.name);
    expect(names).toHaveLength(5);
    expect(names.filter((n) => n.startsWith('Open'))).toHaveLength(2);
    expect(names).toContain('Wednesday');
    // The first two of Monday in the list's own order: the carried-over task (window start 09-04) first.
    expect(names.filter((n) => n === 'From the week before' || n.startsWith('Monday'))).toEqual(['From the week before', 'Monday 1']);

    // A page large enough for every day answers what the plain list answers.
    const all = TaskListDtoSchema.parse((await consultant.get(`/api/tasks?${week}&perDay=50&limit=${weekLimit(50)}`).expect(200)).body.data);
    const plain = TaskListDtoSchema.parse((await consultant.get(`/api/tasks?${week}&limit=50`).expect(200)).body.data);
    expect(all.tasks.map((t) => t.id)).toEqual(plain.tasks.map((t) => t.id));
    expect(plain.groups).toBeUndefined();

    // Past the last row the days' totals still come.
    const past = TaskListDtoSchema.parse((await consultant.get(`/api/tasks?${week}&perDay=2&limit=5&offset=5`).expect(200)).body.data);
    expect(past.tasks).toHaveLength(0);
    expect(past.groups).toEqual(answer.groups);

    // perDay counts days from "from": without it the request is refused with a sentence.
    const bad = await consultant.get(`/api/tasks?propertyId=${property.id}&perDay=2`).expect(422);
    expect(JSON.stringify(bad.body)).toContain('perDay needs');
    await consultant.get(`/api/tasks?${week}&perDay=0`).expect(422);
    await Task.destroy({ where: { propertyId: property.id } });
    await property.destroy();
  });

  it('leaves unit outlines out of task lists unless asked', async () => {
    const plain = await crew.get('/api/tasks').expect(200);
    expect(plain.body.data.tasks[0].unitGeometry).toBeNull();
    expect(plain.body.data.tasks[0].location).toHaveLength(2);
    const withOutlines = await crew.get('/api/tasks?geometry=true').expect(200);
    expect(withOutlines.body.data.tasks[0].unitGeometry.type).toBe('Polygon');
  });

  it('pages properties, clients, proposals and invoices with their totals', async () => {
    await makeProperty(ctx.firm.id, ctx.client.id);
    const properties = await consultant.get('/api/properties?limit=1').expect(200);
    expect(properties.body.data).toHaveLength(1);
    expect(properties.body.page).toEqual({ total: 2, limit: 1, offset: 0 });
    const clients = await consultant.get('/api/clients').expect(200);
    expect(clients.body.page.total).toBe(clients.body.data.length);
    const proposals = await consultant.get('/api/proposals').expect(200);
    expect(proposals.body.page).toEqual({ total: 0, limit: LIST_PAGE.defaultLimit, offset: 0 });
    const invoices = await consultant.get('/api/invoices').expect(200);
    expect(invoices.body.page).toEqual({ total: 0, limit: INVOICE_PAGE.defaultLimit, offset: 0 });
    expect(invoices.body.summary).toEqual({ count: 0, totalCents: 0, balanceCents: 0 });
  });

  it('answers the 50 newest invoices by default, with the count and money of every match summed apart from the page', async () => {
    const firm = await makeFirm();
    const owner = await signedInAgent(firm.users.consultant.email, PASSWORD);
    const property = await makeProperty(firm.firm.id, firm.client.id);
    const COUNT = INVOICE_PAGE.defaultLimit + 5;
    // Open invoices of $100.00 with $30.00 paid each, one paid and one void invoice of $50.00 (made-up figures).
    await Invoice.bulkCreate(
      Array.from({ length: COUNT }, (_, i) => ({
        firmId: firm.firm.id,
        clientId: firm.client.id,
        propertyId: property.id,
        proposalId: null,
        kind: 'final' as const,
        number: `INV-PAGE-${String(i).padStart(4, '0')}`,
        status: i === 0 ? ('paid' as const) : i === 1 ? ('void' as const) : ('open' as const),
        totalCents: i < 2 ? 5_000 : 10_000,
        amountPaidCents: i === 0 ? 5_000 : i === 1 ? 0 : 3_000,
        billedCents: i < 2 ? 5_000 : 10_000,
        subtotalCents: i < 2 ? 5_000 : 10_000,
        issuedOn: '2026-10-01',
        dueOn: '2026-10-31',
        createdById: null,
        createdAt: new Date(Date.UTC(2026, 9, 1, 0, i)),
      })),
    );
    const first = await owner.get('/api/invoices').expect(200);
    expect(first.body.data).toHaveLength(INVOICE_PAGE.defaultLimit);
    expect(first.body.page).toEqual({ total: COUNT, limit: INVOICE_PAGE.defaultLimit, offset: 0 });
    // Newest first: the last one made heads the page.
    expect(first.body.data[0].number).toBe(`INV-PAGE-${String(COUNT - 1).padStart(4, '0')}`);
    // Firm-wide: 53 × $100 + 2 × $50 invoiced; $70 owed on each of the 53 open ones (the void one owes nothing).
    const summary = InvoiceListSummarySchema.parse(first.body.summary);
    expect(summary).toEqual({ count: COUNT, totalCents: (COUNT - 2) * 10_000 + 2 * 5_000, balanceCents: (COUNT - 2) * 7_000 });
    const rest = await owner.get(`/api/invoices?offset=${INVOICE_PAGE.defaultLimit}`).expect(200);
    expect(rest.body.data).toHaveLength(5);
    expect(rest.body.summary).toEqual(summary);
    const paid = await owner.get('/api/invoices?status=paid').expect(200);
    expect(paid.body.summary).toEqual({ count: 1, totalCents: 5_000, balanceCents: 0 });
  });

  it('refuses a page past the limit or a negative offset with a sentence', async () => {
    const tooMany = await consultant.get(`/api/tasks?limit=${LIST_PAGE.maxLimit + 1}`).expect(422);
    expect(JSON.stringify(tooMany.body)).toMatch(/at most 2000/);
    const negative = await consultant.get('/api/invoices?offset=-1').expect(422);
    expect(JSON.stringify(negative.body)).toMatch(/zero or more/);
  });
});
