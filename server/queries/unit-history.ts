/**
 * A unit's history by season (the calendar year prescriptions carry): prescriptions, the work done
 * and what it used, checks, soil tests and the count of field observations logged on it. The unit's
 * id is its identity: editing its outline keeps it.
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Practice, Prescription, Task, type Unit } from '../models';
import { UnitCheck } from '../models/unit-check';
import { SoilTest } from '../models/soil-test';
import { presentCheck } from '../presenters/unit-check';
import { presentSoilTest } from '../presenters/soil-test';
import type { UnitHistoryDto, UnitHistorySeasonDto } from '../../shared/schemas/unit-history';

/**
 * Observations logged on the unit, counted per year of observed_at in the firm's time zone: one grouped
 * query on the property's (property_id, observed_at) index.
 */
async function observationCountsBySeason(unit: Unit): Promise<{ season: number; n: number }[]> {
  const rows = await sequelize.query<{ season: number; n: string }>(
    `SELECT EXTRACT(YEAR FROM o.observed_at AT TIME ZONE f.timezone)::int AS season, count(*) AS n
       FROM observations o JOIN firms f ON f.id = o.firm_id
      WHERE o.firm_id = :firmId AND o.property_id = :propertyId AND o.unit_id = :unitId
      GROUP BY 1`,
    { replacements: { firmId: unit.firmId, propertyId: unit.propertyId, unitId: unit.id }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ season: Number(r.season), n: Number(r.n) }));
}

/** Everything recorded on a unit, grouped by season, newest first. */
export async function readUnitHistory(unit: Unit): Promise<UnitHistoryDto> {
  const [prescriptions, tasks, checks, soilTests, observationCounts] = await Promise.all([
    Prescription.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['year', 'DESC'], ['id', 'ASC']] }),
    Task.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['earliest', 'ASC'], ['id', 'ASC']] }),
    UnitCheck.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['checkedOn', 'ASC'], ['id', 'ASC']] }),
    SoilTest.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['sampledOn', 'ASC'], ['id', 'ASC']] }),
    observationCountsBySeason(unit),
  ]);
  const practices = new Map((await Practice.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.practiceId))] }, attributes: ['id', 'name'] })).map((p) => [p.id, p.name]));
  const prescriptionYear = new Map(prescriptions.map((p) => [p.id, p.year]));
  const seasons = new Map<number, UnitHistorySeasonDto>();
  const season = (year: number) => {
    let s = seasons.get(year);
    if (!s) seasons.set(year, (s = { season: year, prescriptions: [], work: [], checks: [], soilTests: [], observations: 0 }));
    return s;
  };
  for (const p of prescriptions) season(p.year).prescriptions.push({ id: p.id, practiceName: practices.get(p.practiceId) ?? '', summary: p.summary, totalCents: p.totalCents, notes: p.notes });
  for (const t of tasks) {
    const year = t.doneOn ? Number(t.doneOn.slice(0, 4)) : (prescriptionYear.get(t.prescriptionId ?? 0) ?? Number(t.earliest.slice(0, 4)));
    season(year).work.push({ taskId: t.id, name: t.name, status: t.status, doneOn: t.doneOn ?? null, quantitiesUsed: t.quantitiesUsed ?? [] });
  }
  for (const c of checks) season(c.season).checks.push(presentCheck(c, unit.name));
  for (const s of soilTests) season(Number(s.sampledOn.slice(0, 4))).soilTests.push(presentSoilTest(s, unit.name));
  for (const o of observationCounts) season(o.season).observations = o.n;
  return { unitId: unit.id, unitName: unit.name, kind: unit.kind, seasons: [...seasons.values()].sort((a, b) => b.season - a.season) };
}
