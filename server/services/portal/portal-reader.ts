/**
 * What the portal shows a client: their properties, and one property's plan in plain words with the
 * season's progress. Every read is scoped by firm AND client, so another client's property answers
 * 404 exactly as a missing one does. No money leaves here except as percentages.
 */
import { Op } from 'sequelize';
import { Client, Firm, Prescription, Property, Task, TaskPhoto, Unit, Practice } from '../../models';
import { notFound } from '../../errors';
import { loadPlan, planSummary } from '../plan/plan-reader';
import { stripCrs } from '../../presenters/geojson';
import { kindFamily } from '../../../shared/domain/unit-kinds';
import { progressByUnit, progressOf, type Progress } from '../../../shared/domain/tasks';
import type { Caution } from '../../../shared/domain/cautions';
import type { PortalProgress, PortalProperties, PortalPropertyDetail, PortalTask, PortalUnit } from '../../../shared/schemas/portal';

/** Whose portal is being read: the signed-in client, or a client a consultant previews. */
export interface PortalScope {
  firmId: number;
  clientId: number;
}

/** Progress with the cents removed: clients see percentages, never per-task money. */
export function withoutMoney(p: Progress): PortalProgress {
  return { total: p.total, done: p.done, skipped: p.skipped, open: p.open, percentByCount: p.percentByCount, percentByCost: p.percentByCost };
}

const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

/** What the portal shows of a property everywhere: its name, size, place and objectives. */
const propertyBasics = (p: Pick<Property, 'id' | 'name' | 'acres' | 'county' | 'state' | 'objectives'>) => ({
  id: p.id,
  name: p.name,
  acres: num(p.acres),
  county: p.county,
  state: p.state,
  objectives: p.objectives,
});

/** The client (404 when it is not the firm's) with the firm's contact details. */
export async function portalClient(scope: PortalScope): Promise<{ client: Client; firm: Firm | null }> {
  const [client, firm] = await Promise.all([Client.findOne({ where: { id: scope.clientId, firmId: scope.firmId } }), Firm.findByPk(scope.firmId)]);
  if (!client) throw notFound('That client');
  return { client, firm };
}

/** The client's properties with their unit count and the season's percent done. */
export async function readPortalProperties(scope: PortalScope): Promise<PortalProperties> {
  const { client, firm } = await portalClient(scope);
  const properties = await Property.findAll({
    where: { clientId: scope.clientId, firmId: scope.firmId },
    order: [['name', 'ASC']],
    attributes: ['id', 'name', 'acres', 'county', 'state', 'objectives'],
  });
  const ids = properties.map((p) => p.id);
  const [units, tasks] = await Promise.all([
    Unit.findAll({ where: { propertyId: ids.length ? ids : [0] }, attributes: ['id', 'propertyId'] }),
    Task.findAll({ where: { propertyId: ids.length ? ids : [0], firmId: scope.firmId }, attributes: ['propertyId', 'status', 'costCents', 'unitId'] }),
  ]);
  return {
    client: { id: client.id, name: client.name, portalUploadsAllowed: client.portalUploadsAllowed, portalObservationsAllowed: client.portalObservationsAllowed },
    firm: { name: firm?.name ?? '', email: firm?.email ?? null, phone: firm?.phone ?? null },
    properties: properties.map((p) => {
      const own = tasks.filter((t) => t.propertyId === p.id);
      return {
        ...propertyBasics(p),
        unitCount: units.filter((u) => u.propertyId === p.id).length,
        percentDone: own.length ? progressOf(own).percentByCost : null,
      };
    }),
  };
}

/** One property's plan for its client: units with acres and prescriptions in plain words, share by kind, cautions, progress and the task timeline. */
export async function readPortalProperty(scope: PortalScope, propertyId: number): Promise<PortalPropertyDetail> {
  const owned = await Property.findOne({ where: { id: propertyId, firmId: scope.firmId, clientId: scope.clientId }, attributes: ['id'] });
  if (!owned) throw notFound('That property');
  const plan = await loadPlan(propertyId, scope.firmId);
  const [unitRows, summary, prescriptions, tasks] = await Promise.all([
    plan.units(),
    planSummary(plan),
    Prescription.findAll({ where: { propertyId, firmId: scope.firmId }, order: [['id', 'ASC']], attributes: ['id', 'unitId', 'practiceId', 'year', 'targetDate', 'summary', 'schedule', 'cautions'] }),
    Task.findAll({
      where: { propertyId, firmId: scope.firmId },
      order: [['earliest', 'ASC'], ['position', 'ASC'], ['id', 'ASC']],
      attributes: ['id', 'unitId', 'unitName', 'name', 'practiceName', 'status', 'earliest', 'latest', 'startDate', 'endDate', 'doneOn', 'costCents'],
    }),
  ]);
  const practices = await Practice.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.practiceId))].concat(0) }, attributes: ['id', 'name'] });
  const practiceName = new Map(practices.map((p) => [p.id, p.name]));
  const photos = tasks.length
    ? await TaskPhoto.findAll({ where: { taskId: { [Op.in]: tasks.map((t) => t.id) }, firmId: scope.firmId }, order: [['id', 'ASC']], attributes: ['id', 'taskId', 'takenAt'] })
    : [];

  const unitProgress = progressByUnit(tasks);
  const cautions = new Map<string, Caution>();
  for (const p of prescriptions) for (const c of p.cautions ?? []) if (!cautions.has(c.id)) cautions.set(c.id, c);

  const units: PortalUnit[] = unitRows.map((u) => {
    const progress = unitProgress.get(u.id);
    return {
      id: u.id,
      kind: u.kind,
      family: kindFamily(u.kind),
      name: u.name,
      geometry: stripCrs(u.geometry) as unknown as Record<string, unknown>,
      acres: num(u.acres),
      lengthFt: num(u.lengthFt),
      prescriptions: prescriptions
        .filter((p) => p.unitId === u.id)
        .map((p) => ({
          id: p.id,
          practiceName: practiceName.get(p.practiceId) ?? 'Practice',
          year: p.year,
          summary: p.summary,
          windowStart: p.schedule?.anchorWindow?.earliest ?? null,
          windowEnd: p.schedule?.anchorWindow?.latest ?? null,
          targetDate: p.targetDate,
          cautionIds: (p.cautions ?? []).map((c) => c.id),
        })),
      workStatus: progress?.status ?? 'no-work',
      progress: progress ? withoutMoney(progress) : null,
    };
  });

  const taskRows: PortalTask[] = tasks.map((t) => ({
    id: t.id,
    unitId: t.unitId,
    unitName: t.unitName,
    name: t.name,
    practiceName: t.practiceName,
    status: t.status,
    earliest: t.earliest,
    latest: t.latest,
    startDate: t.startDate,
    endDate: t.endDate,
    doneOn: t.doneOn ?? null,
    photos: photos.filter((ph) => ph.taskId === t.id).map((ph) => ({ id: ph.id, url: `/api/task-photos/${ph.id}`, takenAt: ph.takenAt ? ph.takenAt.toISOString() : null })),
  }));

  const p = plan.property;
  return {
    property: {
      ...propertyBasics(p),
      boundary: p.boundary ? (stripCrs(p.boundary) as unknown as Record<string, unknown>) : null,
    },
    units,
    shareByKind: summary.shareByKind,
    cautions: [...cautions.values()],
    progress: withoutMoney(progressOf(tasks)),
    tasks: taskRows,
  };
}
