/** Progress of a property's plan and of each unit: done by count and by cost weight. */
import { Task, Unit, type Property } from '../../models';
import { progressByUnit, progressOf } from '../../../shared/domain/tasks';
import type { PropertyProgressDto } from '../../../shared/schemas/task';

/** The plan's progress and each unit's, for units that have tasks. */
export async function propertyProgress(property: Property): Promise<PropertyProgressDto & { notifyClientOnUnitDone: boolean }> {
  const [tasks, units] = await Promise.all([
    Task.findAll({ where: { propertyId: property.id }, attributes: ['status', 'costCents', 'unitId'] }),
    Unit.findAll({ where: { propertyId: property.id }, attributes: ['id', 'name', 'kind'], order: [['name', 'ASC']] }),
  ]);
  const byUnit = progressByUnit(tasks);
  return {
    propertyId: property.id,
    propertyName: property.name,
    notifyClientOnUnitDone: property.notifyClientOnUnitDone,
    plan: progressOf(tasks),
    units: units.filter((u) => byUnit.has(u.id)).map((u) => ({ unitId: u.id, unitName: u.name, unitKind: u.kind, ...(byUnit.get(u.id) as NonNullable<ReturnType<typeof byUnit.get>>) })),
  };
}
