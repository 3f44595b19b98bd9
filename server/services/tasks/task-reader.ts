/**
 * Reads tasks as the API answers them: with their property, unit, crew member, photos and a point
 * inside the unit for the phone's maps app. Crew members get no costs.
 */
import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import type { Geometry } from 'geojson';
import { sequelize } from '../../db/sequelize';
import { Property, Task, TaskPhoto, Unit, User } from '../../models';
import type { SessionUser } from '../../../shared/schemas/auth';
import type { TaskDto, TaskListQuery } from '../../../shared/schemas/task';
import { LIST_PAGE, pageOf, type PageDto } from '../../../shared/schemas/common';
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
  const today = todayInZone(actor.firmTimezone);
  const warnings = taskWarnings(
    tasks.map((t) => ({ id: t.id, prescriptionId: t.prescriptionId, stepKey: t.stepKey, name: t.name, unitName: t.unitName, status: t.status, earliest: t.earliest, latest: t.latest, startDate: t.startDate, endDate: t.endDate, doneOn: t.doneOn, dependsOn: t.dependsOn })),
    today,
  );
  const crew = actor.role === 'crew';
  const views = tasks.map((t): TaskView => {
    const u = t.unitId !== null ? unit.get(t.unitId) : undefined;
    const point = u?.point ? (JSON.parse(u.point) as { coordinates: [number, number] }).coordinates : null;
    return {
      id: t.id,
      propertyId: t.propertyId,
      propertyName: propertyName.get(t.propertyId) ?? '',
      unitId: t.unitId,
      unitName: t.unitName,
      unitKind: u?.kind ?? null,
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
      assigneeName: t.assigneeId ? (userName.get(t.assigneeId) ?? null) : null,
      quantities: t.quantities,
      cautions: t.cautions,
      costCents: crew ? null : t.costCents,
      doneOn: t.doneOn,
      completedAt: t.completedAt?.toISOString() ?? null,
      completedByName: t.completedById ? (userName.get(t.completedById) ?? null) : null,
      notes: t.notes,
      hours: t.hours,
      quantitiesUsed: t.quantitiesUsed,
      skipReason: t.skipReason,
      invoiceId: crew ? null : t.invoiceId,
      photos: photos
        .filter((p) => p.taskId === t.id)
        .map((p) => ({ id: p.id, url: `/api/task-photos/${p.id}`, takenAt: p.takenAt?.toISOString() ?? null, latitude: p.latitude, longitude: p.longitude, createdAt: p.createdAt.toISOString() })),
      bucket: fieldBucket(t, today),
      location: point ? [point[0], point[1]] : null,
      warnings: warnings.filter((w) => w.taskId === t.id),
      unitGeometry: u?.geometry ? stripCrs(JSON.parse(u.geometry) as Geometry) : null,
    };
  });
  return { tasks: views, warnings };
}

/**
 * A page of the tasks an actor may see, filtered, in date order, with the number matching in all
 * (never cut silently). Unit outlines only when asked (`geometry=true`, the field sheet's sketches).
 */
export async function listTasks(actor: SessionUser, query: TaskListQuery): Promise<{ tasks: TaskView[]; warnings: TaskWarning[]; page: PageDto }> {
  const page = { limit: query.limit ?? LIST_PAGE.defaultLimit, offset: query.offset ?? 0 };
  const where = taskScope(actor, query);
  const [total, rows] = await Promise.all([
    Task.count({ where }),
    Task.findAll({
      where,
      order: [[sequelize.fn('COALESCE', sequelize.col('start_date'), sequelize.col('earliest')), 'ASC'], ['propertyId', 'ASC'], ['unitName', 'ASC'], ['position', 'ASC'], ['id', 'ASC']],
      limit: page.limit,
      offset: page.offset,
    }),
  ]);
  const presented = await presentTasks(actor, rows, { withGeometry: query.geometry === 'true' });
  return { ...presented, page: pageOf(page, total) };
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
