/**
 * Reads tasks as the API answers them: with their property, unit, crew member, photos and a point
 * inside the unit for the phone's maps app. Crew members get no costs.
 */
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import type { Geometry } from 'geojson';
import { sequelize } from '../../db/sequelize';
import { Property, Task, TaskPhoto, Unit, User } from '../../models';
import type { SessionUser } from '../../../shared/schemas/auth';
import { TASK_PAGE, type TaskDto, type TaskListDto, type TaskListQuery } from '../../../shared/schemas/task';
import { pageOf, type PageDto } from '../../../shared/schemas/common';
import { fieldBucket, taskWarnings, type TaskWarning } from '../../../shared/domain/tasks';
import { stripCrs } from '../../presenters/geojson';
import { todayInZone } from '../clock';

export type TaskView = TaskDto & { unitGeometry: Geometry | null };

/** The list filter for an actor: crew see only their own tasks; staff filter by property, crew member, unit, status and dates. */
export function taskScope(actor: SessionUser, query: TaskListQuery): WhereOptions {
  const where: Record<string | symbol, unknown> = { firmId: actor.firmId };
  if (actor.role === 'crew') where.assigneeId = actor.id;
  else if (query.assigneeId === 'none') where.assigneeId = null;
  else if (query.assigneeId) where.assigneeId = query.assigneeId;
  if (query.propertyId) where.propertyId = query.propertyId;
  if (query.unitId) where.unitId = query.unitId;
  if (query.status) where.status = query.status;
  const and: unknown[] = [];
  if (query.to) and.push(sequelize.where(sequelize.fn('COALESCE', sequelize.col('start_date'), sequelize.col('earliest')), { [Op.lte]: query.to }));
  if (query.from) and.push(sequelize.where(sequelize.fn('COALESCE', sequelize.col('end_date'), sequelize.col('start_date'), sequelize.col('latest')), { [Op.gte]: query.from }));
  if (and.length) where[Op.and] = and;
  return where as WhereOptions;
}

/** The task columns a view is made of: a Task model or a plain row from `listTasks`'s query. */
type TaskFields = Pick<
  Task,
  'id' | 'propertyId' | 'unitId' | 'prescriptionId' | 'proposalId' | 'stepKey' | 'name' | 'kind' | 'practiceName' | 'unitName' | 'dependsOn' | 'earliest' | 'latest' | 'startDate' | 'endDate' | 'status' | 'assigneeId' | 'quantities' | 'cautions' | 'costCents' | 'doneOn' | 'completedAt' | 'completedById' | 'notes' | 'hours' | 'quantitiesUsed' | 'skipReason' | 'invoiceId'
>;

/** What a view needs beside the task's own columns. */
interface TaskRelated {
  propertyName: string;
  unitKind: string | null;
  point: string | null;
  geometry: string | null;
  assigneeName: string | null;
  completedByName: string | null;
  photos: TaskView['photos'];
}

/** Views of tasks with their related names, warnings among them and the field bucket, in one pass. */
function viewsOf(actor: SessionUser, tasks: readonly TaskFields[], related: (t: TaskFields) => TaskRelated): { tasks: TaskView[]; warnings: TaskWarning[] } {
  const today = todayInZone(actor.firmTimezone);
  const warnings = taskWarnings(
    tasks.map((t) => ({ id: t.id, prescriptionId: t.prescriptionId, stepKey: t.stepKey, name: t.name, unitName: t.unitName, status: t.status, earliest: t.earliest, latest: t.latest, startDate: t.startDate, endDate: t.endDate, doneOn: t.doneOn, dependsOn: t.dependsOn })),
    today,
  );
  const warningsOf = new Map<number, TaskWarning[]>();
  for (const w of warnings) {
    const list = warningsOf.get(w.taskId);
    if (list) list.push(w);
    else warningsOf.set(w.taskId, [w]);
  }
  const crew = actor.role === 'crew';
  const views = tasks.map((t): TaskView => {
    const r = related(t);
    const point = r.point ? (JSON.parse(r.point) as { coordinates: [number, number] }).coordinates : null;
    return {
      id: t.id,
      propertyId: t.propertyId,
      propertyName: r.propertyName,
      unitId: t.unitId,
      unitName: t.unitName,
      unitKind: r.unitKind,
      prescriptionId: t.prescriptionId,
      proposalId: crew ? null : t.proposalId,
      stepKey: t.stepKey,
      name: t.name,
      kind: t.kind,
      practiceName: t.practiceName,
      dependsOn: t.dependsOn,
      earliest: t.earliest,
      latest: t.latest,
      startDate: t.startDate,
      endDate: t.endDate,
      status: t.status,
      assigneeId: t.assigneeId,
      assigneeName: t.assigneeId ? r.assigneeName : null,
      quantities: t.quantities,
      cautions: t.cautions,
      costCents: crew ? null : t.costCents,
      doneOn: t.doneOn,
      completedAt: t.completedAt?.toISOString() ?? null,
      completedByName: t.completedById ? r.completedByName : null,
      notes: t.notes,
      hours: t.hours,
      quantitiesUsed: t.quantitiesUsed,
      skipReason: t.skipReason,
      invoiceId: crew ? null : t.invoiceId,
      photos: r.photos,
      bucket: fieldBucket(t, today),
      location: point ? [point[0], point[1]] : null,
      warnings: warningsOf.get(t.id) ?? [],
      unitGeometry: r.geometry ? stripCrs(JSON.parse(r.geometry) as Geometry) : null,
    };
  });
  return { tasks: views, warnings };
}

/** Answers tasks as DTOs, loading their related names, photos and unit points in a few queries. */
export async function presentTasks(actor: SessionUser, tasks: Task[], options: { withGeometry?: boolean } = {}): Promise<{ tasks: TaskView[]; warnings: TaskWarning[] }> {
  if (tasks.length === 0) return { tasks: [], warnings: [] };
  const ids = tasks.map((t) => t.id);
  const unitIds = [...new Set(tasks.map((t) => t.unitId).filter((v): v is number => v !== null))];
  const userIds = [...new Set(tasks.flatMap((t) => [t.assigneeId, t.completedById]).filter((v): v is number => v !== null))];
  const [properties, users, photos, units] = await Promise.all([
    Property.findAll({ where: { id: [...new Set(tasks.map((t) => t.propertyId))] }, attributes: ['id', 'name'] }),
    User.findAll({ where: { id: userIds }, attributes: ['id', 'name'] }),
    TaskPhoto.findAll({ where: { taskId: ids }, order: [['id', 'ASC']] }),
    unitIds.length
      ? sequelize.query<{ id: number; kind: string; point: string | null; geometry: string | null }>(
          `SELECT id, kind, ST_AsGeoJSON(ST_PointOnSurface(geometry), 6) AS point${options.withGeometry ? ', ST_AsGeoJSON(geometry, 7) AS geometry' : ', NULL AS geometry'} FROM units WHERE id IN (:ids)`,
          { replacements: { ids: unitIds }, type: QueryTypes.SELECT },
        )
      : Promise.resolve([]),
  ]);
  const propertyName = new Map(properties.map((p) => [p.id, p.name]));
  const userName = new Map(users.map((u) => [u.id, u.name]));
  const unit = new Map(units.map((u) => [u.id, u]));
  const photosOf = new Map<number, TaskView['photos']>();
  for (const p of photos) {
    const view = { id: p.id, url: `/api/task-photos/${p.id}`, takenAt: p.takenAt?.toISOString() ?? null, latitude: p.latitude, longitude: p.longitude, createdAt: p.createdAt.toISOString() };
    const list = photosOf.get(p.taskId);
    if (list) list.push(view);
    else photosOf.set(p.taskId, [view]);
  }
  return viewsOf(actor, tasks, (t) => {
    const u = t.unitId !== null ? unit.get(t.unitId) : undefined;
    return {
      propertyName: propertyName.get(t.propertyId) ?? '',
      unitKind: u?.kind ?? null,
      point: u?.point ?? null,
      geometry: u?.geometry ?? null,
      assigneeName: t.assigneeId ? (userName.get(t.assigneeId) ?? null) : null,
      completedByName: t.completedById ? (userName.get(t.completedById) ?? null) : null,
      photos: photosOf.get(t.id) ?? [],
    };
  });
}

/** A task's planned window as a date range, exactly as indexed by tasks_firm_window_idx (migration 0091). */
export const TASK_WINDOW_SQL =
  "daterange(LEAST(COALESCE(t.start_date, t.earliest), COALESCE(t.end_date, t.start_date, t.latest)), GREATEST(COALESCE(t.start_date, t.earliest), COALESCE(t.end_date, t.start_date, t.latest)), '[]')";

/** The longest date range (days) read through the window index: a week or a month view. */
const WINDOW_INDEX_MAX_DAYS = 31;

/** The filter of `taskScope` as SQL over `tasks t`, with its replacements. */
function taskScopeSql(actor: SessionUser, query: TaskListQuery): { sql: string; replacements: Record<string, unknown> } {
  const clauses = ['t.firm_id = :firmId'];
  const replacements: Record<string, unknown> = { firmId: actor.firmId };
  if (actor.role === 'crew') {
    clauses.push('t.assignee_id = :assigneeId');
    replacements.assigneeId = actor.id;
  } else if (query.assigneeId === 'none') clauses.push('t.assignee_id IS NULL');
  else if (query.assigneeId) {
    clauses.push('t.assignee_id = :assigneeId');
    replacements.assigneeId = query.assigneeId;
  }
  if (query.propertyId) {
    clauses.push('t.property_id = :propertyId');
    replacements.propertyId = query.propertyId;
  }
  if (query.unitId) {
    clauses.push('t.unit_id = :unitId');
    replacements.unitId = query.unitId;
  }
  if (query.status) {
    clauses.push('t.status = :status');
    replacements.status = query.status;
  }
  if (query.to) {
    clauses.push('COALESCE(t.start_date, t.earliest) <= CAST(:to AS date)');
    replacements.to = query.to;
  }
  if (query.from) {
    clauses.push('COALESCE(t.end_date, t.start_date, t.latest) >= CAST(:from AS date)');
    replacements.from = query.from;
  }
  // A superset of the two date tests that the GiST index tasks_firm_window_idx (migration 0091) answers,
  // so a week reads only the tasks overlapping it rather than every earlier task of the firm. Only for
  // short ranges: over a season most tasks overlap and the date-ordered btree reads fewer rows.
  if (query.from && query.to && Date.parse(query.to) - Date.parse(query.from) <= WINDOW_INDEX_MAX_DAYS * 86_400_000) {
    clauses.push(`${TASK_WINDOW_SQL} && daterange(CAST(:windowFrom AS date), CAST(:windowTo AS date), '[]')`);
    replacements.windowFrom = query.from;
    replacements.windowTo = query.to;
  }
  return { sql: clauses.join(' AND '), replacements };
}

type TaskListRow = TaskFields & Omit<TaskRelated, 'photos'> & { photos: (Omit<TaskView['photos'][number], 'url'>)[]; total: string; groups?: TaskDayGroup[] | null };

/**
 * A page of the tasks an actor may see, filtered, in date order, with the number matching in all
 * (never cut silently). Unit outlines only when asked (`geometry=true`, the field sheet's sketches).
 * One query: the page's ids and the total (a window count over the filter's cheap columns; a week is
 * found through the window index of migration 0091), then only the page's rows with their names,
 * unit points and photos; no model instances, no second trip. With `perDay` (the week list) the page
 * holds at most that many tasks of each day and `groups` every day's total, from the same read.
 */
export async function listTasks(actor: SessionUser, query: TaskListQuery): Promise<{ tasks: TaskView[]; warnings: TaskWarning[]; page: PageDto; groups?: TaskDayGroup[] }> {
  const page = { limit: query.limit ?? TASK_PAGE.defaultLimit, offset: query.offset ?? 0 };
  const scope = taskScopeSql(actor, query);
  const iso = (column: string) => `to_char(${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
  const byDay = query.perDay !== undefined && query.from !== undefined;
  const rows = await sequelize.query<TaskListRow>(
    `${byDay ? weekGroupsSql(scope.sql) : ''}
     SELECT t.id, t.property_id AS "propertyId", t.unit_id AS "unitId", t.prescription_id AS "prescriptionId", t.proposal_id AS "proposalId",
            t.step_key AS "stepKey", t.name, t.kind, t.practice_name AS "practiceName", t.unit_name AS "unitName", t.depends_on AS "dependsOn",
            t.earliest::text AS earliest, t.latest::text AS latest, t.start_date::text AS "startDate", t.end_date::text AS "endDate",
            t.status, t.assignee_id AS "assigneeId", t.quantities, t.cautions, t.cost_cents AS "costCents", t.done_on::text AS "doneOn",
            t.completed_at AS "completedAt", t.completed_by_id AS "completedById", t.notes, t.hours::float8 AS hours,
            t.quantities_used AS "quantitiesUsed", t.skip_reason AS "skipReason", t.invoice_id AS "invoiceId",
            p.name AS "propertyName", u.kind AS "unitKind", ST_AsGeoJSON(ST_PointOnSurface(u.geometry), 6) AS point,
            ${query.geometry === 'true' ? 'ST_AsGeoJSON(u.geometry, 7)' : 'NULL'} AS geometry,
            a.name AS "assigneeName", cb.name AS "completedByName",
            COALESCE((SELECT json_agg(json_build_object('id', ph.id, 'takenAt', ${iso('ph.taken_at')}, 'latitude', ph.latitude, 'longitude', ph.longitude, 'createdAt', ${iso('ph.created_at')}) ORDER BY ph.id)
                      FROM task_photos ph WHERE ph.task_id = t.id), '[]'::json) AS photos,
            pg.total${byDay ? `, (SELECT json_agg(json_build_object('date', g.grp::text, 'total', g.n) ORDER BY g.grp NULLS LAST) FROM g) AS groups` : ''}
     FROM ${byDay ? WEEK_PAGE_SQL : `(SELECT t.id, count(*) OVER () AS total, row_number() OVER (ORDER BY COALESCE(t.start_date, t.earliest), t.property_id, t.unit_name, t.position, t.id) AS n
           FROM tasks t WHERE ${scope.sql}
           ORDER BY n LIMIT :limit OFFSET :offset)`} pg
     JOIN tasks t ON t.id = pg.id
     JOIN properties p ON p.id = t.property_id
     LEFT JOIN units u ON u.id = t.unit_id
     LEFT JOIN users a ON a.id = t.assignee_id
     LEFT JOIN users cb ON cb.id = t.completed_by_id
     ORDER BY pg.n`,
    { replacements: { ...scope.replacements, limit: page.limit, offset: page.offset, ...(byDay ? { groupFrom: query.from, perDay: query.perDay } : {}) }, type: QueryTypes.SELECT },
  );
  // Past the last page the window count has no row to ride on: count on its own.
  const total = rows.length ? Number(rows[0].total) : page.offset > 0 ? await Task.count({ where: taskScope(actor, query) }) : 0;
  const groups = !byDay ? undefined : rows.length ? (rows[0].groups ?? []) : total > 0 ? await weekGroupTotals(scope, query.from!) : [];
  const presented = viewsOf(actor, rows, (t) => {
    const r = t as TaskListRow;
    return { ...r, photos: r.photos.map((ph) => ({ id: ph.id, url: `/api/task-photos/${ph.id}`, takenAt: ph.takenAt, latitude: ph.latitude, longitude: ph.longitude, createdAt: ph.createdAt })) };
  });
  return { ...presented, page: pageOf(page, total), ...(groups ? { groups } : {}) };
}

/** A day of the week list and how many tasks it holds in all (date null: the unscheduled ones). */
export type TaskDayGroup = NonNullable<TaskListDto['groups']>[number];

/** The day a task is listed on from `:groupFrom` on: its first scheduled day in the range; null when it has no date. */
const GROUP_DAY_SQL = 'CASE WHEN t.start_date IS NULL THEN NULL ELSE GREATEST(t.start_date, CAST(:groupFrom AS date)) END';

/** The filter's tasks with their day (`m`) and each day's count (`g`), read once for the page and the totals. */
const weekGroupsSql = (scopeSql: string) =>
  `WITH m AS MATERIALIZED (SELECT t.id, ${GROUP_DAY_SQL} AS grp, COALESCE(t.start_date, t.earliest) AS d, t.property_id, t.unit_name, t.position FROM tasks t WHERE ${scopeSql}),
        g AS (SELECT grp, count(*)::int AS n FROM m GROUP BY grp)`;

/** The page by day: at most `:perDay` of each day (in the list's order), then the usual limit and offset. */
const WEEK_PAGE_SQL = `(SELECT c.id, c.total, row_number() OVER (ORDER BY c.d, c.property_id, c.unit_name, c.position, c.id) AS n
           FROM (SELECT m.*, count(*) OVER () AS total, row_number() OVER (PARTITION BY m.grp ORDER BY m.d, m.property_id, m.unit_name, m.position, m.id) AS k FROM m) c
           WHERE c.k <= :perDay
           ORDER BY n LIMIT :limit OFFSET :offset)`;

/** Each day's total alone (a page past the last row carries none). */
async function weekGroupTotals(scope: { sql: string; replacements: Record<string, unknown> }, from: string): Promise<TaskDayGroup[]> {
  return sequelize.query<TaskDayGroup>(
    `SELECT ${GROUP_DAY_SQL}::text AS date, count(*)::int AS total FROM tasks t WHERE ${scope.sql} GROUP BY 1 ORDER BY 1 NULLS LAST`,
    { replacements: { ...scope.replacements, groupFrom: from }, type: QueryTypes.SELECT },
  );
}

/** One task as its DTO, with the unit's geometry for the small map. */
export async function readTask(actor: SessionUser, task: Task): Promise<TaskView> {
  // Dependencies' dates decide the warnings: read the task's siblings from the same prescription.
  const siblings = task.prescriptionId ? await Task.findAll({ where: { prescriptionId: task.prescriptionId } }) : [task];
  const { tasks } = await presentTasks(actor, siblings, { withGeometry: true });
  return tasks.find((t) => t.id === task.id) as TaskView;
}

/** The units of a property with tasks, for the progress page and map colouring. */
export async function unitsOfProperty(propertyId: number) {
  return Unit.findAll({ where: { propertyId }, attributes: ['id', 'name', 'kind'], order: [['name', 'ASC']] });
}
