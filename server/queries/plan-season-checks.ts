/**
 * The plan checks that read the season's work rather than the map: plant-back intervals (herbicide
 * tasks against the seedings after them on the same unit) and rotation (the crop family each unit's
 * prescriptions sow, season by season). Its inputs bump the plan's revision (migration 0092), so the
 * plan reader caches the answer by revision.
 */
import { Op } from 'sequelize';
import { Material, Practice, Prescription, Task, Unit } from '../models';
import { cropGroupOf } from '../../shared/domain/soil-tests';
import { plantBackWarnings, rotationWarnings, type PlanWarning, type SeasonTaskInput } from '../../shared/domain/plan-checks';
import type { PracticeDefinition } from '../../shared/domain/practice';

/** The crop family a practice sows, from the species of its seed step's materials (null when it sows nothing). */
function practiceFamily(definition: PracticeDefinition, speciesOf: Map<string, string>): string | null {
  const step = definition.steps.find((s) => s.application?.type === 'seed');
  if (!step || step.application?.type !== 'seed') return null;
  return cropGroupOf(step.application.components.map((c) => speciesOf.get(c.materialKey) ?? c.materialKey));
}

/** Plant-back and rotation warnings of a property's plan (the property is already checked in the firm). */
export async function seasonPlanWarnings(propertyId: number, firmId: number): Promise<PlanWarning[]> {
  const [materials, tasks, prescriptions, units] = await Promise.all([
    Material.findAll({ where: { firmId }, attributes: ['key', 'name', 'definition'] }),
    Task.findAll({
      where: { propertyId, firmId, unitId: { [Op.ne]: null }, status: { [Op.ne]: 'skipped' } },
      attributes: ['unitId', 'unitName', 'kind', 'name', 'earliest', 'startDate', 'doneOn', 'quantities'],
    }),
    Prescription.findAll({ where: { propertyId, firmId }, attributes: ['unitId', 'practiceId', 'year'], order: [['year', 'ASC'], ['id', 'ASC']] }),
    Unit.findAll({ where: { propertyId, firmId }, attributes: ['id', 'name'] }),
  ]);
  const herbicides = materials.flatMap((m) =>
    m.definition.type === 'herbicide' && m.definition.plantBackDays !== undefined ? [{ key: m.key, name: m.name, plantBackDays: m.definition.plantBackDays }] : [],
  );
  const taskInputs: SeasonTaskInput[] = tasks.map((t) => ({
    unitId: String(t.unitId),
    unitName: t.unitName,
    kind: t.kind,
    name: t.name,
    date: t.doneOn ?? t.startDate ?? t.earliest,
    materialKeys: (t.quantities ?? []).map((q) => q.key),
  }));

  const practices = await Practice.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.practiceId))].concat(0), firmId }, attributes: ['id', 'definition'] });
  const speciesOf = new Map(materials.flatMap((m) => (m.definition.type === 'seed' ? [[m.key, m.definition.species] as const] : [])));
  const familyOf = new Map(practices.map((p) => [p.id, practiceFamily(p.definition, speciesOf)]));
  const unitName = new Map(units.map((u) => [u.id, u.name]));
  const seasons = new Map<number, { year: number; family: string | null }[]>();
  for (const p of prescriptions) {
    if (!unitName.has(p.unitId)) continue;
    const list = seasons.get(p.unitId) ?? [];
    list.push({ year: p.year, family: familyOf.get(p.practiceId) ?? null });
    seasons.set(p.unitId, list);
  }
  return [
    ...plantBackWarnings(taskInputs, herbicides),
    ...rotationWarnings([...seasons].map(([id, s]) => ({ unitId: String(id), unitName: unitName.get(id) ?? '', seasons: s }))),
  ];
}
