/**
 * A unit's history by season (the calendar year prescriptions carry): prescriptions, the work done
 * and what it used, checks and soil tests. The unit's id is its identity: editing its outline keeps it.
 */
import { Practice, Prescription, Task, type Unit } from '../models';
import { UnitCheck } from '../models/unit-check';
import { SoilTest } from '../models/soil-test';
import { presentCheck } from '../presenters/unit-check';
import { presentSoilTest } from '../presenters/soil-test';
import type { UnitHistoryDto, UnitHistorySeasonDto } from '../../shared/schemas/unit-history';

/** Everything recorded on a unit, grouped by season, newest first. */
export async function readUnitHistory(unit: Unit): Promise<UnitHistoryDto> {
  const [prescriptions, tasks, checks, soilTests] = await Promise.all([
    Prescription.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['year', 'DESC'], ['id', 'ASC']] }),
    Task.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['earliest', 'ASC'], ['id', 'ASC']] }),
    UnitCheck.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['checkedOn', 'ASC'], ['id', 'ASC']] }),
    SoilTest.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['sampledOn', 'ASC'], ['id', 'ASC']] }),
  ]);
  const practices = new Map((await Practice.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.practiceId))] }, attributes: ['id', 'name'] })).map((p) => [p.id, p.name]));
  const prescriptionYear = new Map(prescriptions.map((p) => [p.id, p.year]));
  const seasons = new Map<number, UnitHistorySeasonDto>();
  const season = (year: number) => {
    let s = seasons.get(year);
    if (!s) seasons.set(year, (s = { season: year, prescriptions: [], work: [], checks: [], soilTests: [] }));
    return s;
  };
  for (const p of prescriptions) season(p.year).prescriptions.push({ id: p.id, practiceName: practices.get(p.practiceId) ?? '', summary: p.summary, totalCents: p.totalCents, notes: p.notes });
  for (const t of tasks) {
    const year = t.doneOn ? Number(t.doneOn.slice(0, 4)) : (prescriptionYear.get(t.prescriptionId ?? 0) ?? Number(t.earliest.slice(0, 4)));
    season(year).work.push({ taskId: t.id, name: t.name, status: t.status, doneOn: t.doneOn ?? null, quantitiesUsed: t.quantitiesUsed ?? [] });
  }
  for (const c of checks) season(c.season).checks.push(presentCheck(c, unit.name));
  for (const s of soilTests) season(Number(s.sampledOn.slice(0, 4))).soilTests.push(presentSoilTest(s, unit.name));
  return { unitId: unit.id, unitName: unit.name, kind: unit.kind, seasons: [...seasons.values()].sort((a, b) => b.season - a.season) };
}
