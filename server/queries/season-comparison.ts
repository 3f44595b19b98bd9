/**
 * Two seasons of a property side by side: per unit, the checks, the soil-test pH and the work done,
 * gathered here and summed by shared/domain/season-comparison. Seasons are calendar years as the
 * unit history counts them (checks by their season, soil tests by sample date, work by the day done
 * or else its prescription's year or earliest date).
 */
import { Prescription, Task, Unit, type Property } from '../models';
import { UnitCheck } from '../models/unit-check';
import { SoilTest } from '../models/soil-test';
import { firmToday } from '../services/clock';
import { compareSeasons, pickSeasons, type SeasonUnitRecord } from '../../shared/domain/season-comparison';
import type { SeasonComparisonDto } from '../../shared/schemas/season-comparison';

/** The property's season `asked` (or its latest with records) against the one before. */
export async function readSeasonComparison(property: Property, asked: number | null): Promise<SeasonComparisonDto> {
  const where = { propertyId: property.id, firmId: property.firmId };
  const [units, checks, soilTests, tasks, prescriptions] = await Promise.all([
    Unit.findAll({ where, attributes: ['id', 'name', 'kind', 'acres'] }),
    UnitCheck.findAll({ where, attributes: ['unitId', 'kind', 'checkedOn', 'season', 'status', 'result'] }),
    SoilTest.findAll({ where, attributes: ['unitId', 'sampledOn', 'ph'] }),
    Task.findAll({ where, attributes: ['unitId', 'prescriptionId', 'name', 'status', 'doneOn', 'earliest'] }),
    Prescription.findAll({ where, attributes: ['id', 'year'] }),
  ]);
  const unitById = new Map(units.map((u) => [u.id, u]));
  const prescriptionYear = new Map(prescriptions.map((p) => [p.id, p.year]));
  const records = new Map<string, SeasonUnitRecord>();
  const record = (unitId: number, season: number): SeasonUnitRecord | null => {
    const unit = unitById.get(unitId);
    if (!unit) return null;
    const key = `${unitId}:${season}`;
    let r = records.get(key);
    if (!r) records.set(key, (r = { unitId, unitName: unit.name, kind: unit.kind, acres: unit.acres, season, checks: [], soilTests: [], tasks: [] }));
    return r;
  };
  for (const c of checks) record(c.unitId, c.season)?.checks.push({ kind: c.kind, checkedOn: c.checkedOn, status: c.status, result: c.result });
  for (const s of soilTests) record(s.unitId, Number(s.sampledOn.slice(0, 4)))?.soilTests.push({ sampledOn: s.sampledOn, ph: Number(s.ph) });
  for (const t of tasks) {
    if (t.unitId === null) continue;
    const year = t.doneOn ? Number(t.doneOn.slice(0, 4)) : (prescriptionYear.get(t.prescriptionId ?? 0) ?? Number(t.earliest.slice(0, 4)));
    record(t.unitId, year)?.tasks.push({ name: t.name, status: t.status });
  }
  const recorded = [...new Set([...records.values()].filter((r) => r.checks.length || r.soilTests.length || r.tasks.some((t) => t.status === 'done')).map((r) => r.season))];
  const todayYear = Number((await firmToday(property.firmId)).slice(0, 4));
  const { season, previousSeason } = pickSeasons(recorded, asked, todayYear);
  return { propertyId: property.id, propertyName: property.name, ...compareSeasons([...records.values()], season, previousSeason) };
}
