/** Reads of soil tests: a unit's, and the firm's retests due (for the Desk). */
import { Op } from 'sequelize';
import { Unit } from '../models';
import { SoilTest } from '../models/soil-test';
import { presentSoilTest } from '../presenters/soil-test';
import type { SoilTestDto } from '../../shared/schemas/soil-tests';

/** A unit's soil tests, newest first. */
export async function listUnitSoilTests(unit: Unit): Promise<SoilTestDto[]> {
  const rows = await SoilTest.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['sampledOn', 'DESC'], ['id', 'DESC']] });
  return rows.map((r) => presentSoilTest(r, unit.name));
}

/** Units whose latest soil test is due for a retest on or before `by` (the firm's today plus a look-ahead). */
export async function retestsDue(firmId: number, by: string): Promise<SoilTestDto[]> {
  const rows = await SoilTest.findAll({ where: { firmId }, order: [['unitId', 'ASC'], ['sampledOn', 'DESC'], ['id', 'DESC']] });
  const latest = new Map<number, SoilTest>();
  for (const row of rows) if (!latest.has(row.unitId)) latest.set(row.unitId, row);
  const due = [...latest.values()].filter((r) => r.retestDue <= by).sort((a, b) => a.retestDue.localeCompare(b.retestDue));
  const units = due.length ? await Unit.findAll({ where: { id: { [Op.in]: due.map((r) => r.unitId) } }, attributes: ['id', 'name'] }) : [];
  const names = new Map(units.map((u) => [u.id, u.name]));
  return due.map((r) => presentSoilTest(r, names.get(r.unitId) ?? ''));
}
