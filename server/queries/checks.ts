/** Reads of checks on units: a unit's checks, a property's, and the latest status of each checked plot. */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Unit } from '../models';
import { UnitCheck } from '../models/unit-check';
import { presentCheck } from '../presenters/unit-check';
import type { PlotStatusDto, UnitCheckDto } from '../../shared/schemas/checks';

/** A unit's checks, newest first. */
export async function listUnitChecks(unit: Unit): Promise<UnitCheckDto[]> {
  const rows = await UnitCheck.findAll({ where: { unitId: unit.id, firmId: unit.firmId }, order: [['checkedOn', 'DESC'], ['id', 'DESC']] });
  return rows.map((row) => presentCheck(row, unit.name));
}

/** A property's checks (optionally of one season), newest first, with unit names. */
export async function listPropertyChecks(firmId: number, propertyId: number, season?: number): Promise<UnitCheckDto[]> {
  const rows = await UnitCheck.findAll({ where: { firmId, propertyId, ...(season !== undefined ? { season } : {}) }, order: [['checkedOn', 'DESC'], ['id', 'DESC']] });
  const units = await Unit.findAll({ where: { propertyId }, attributes: ['id', 'name'] });
  const names = new Map(units.map((u) => [u.id, u.name]));
  return rows.map((row) => presentCheck(row, names.get(row.unitId) ?? ''));
}

/** The latest check's status of each checked unit of a property (one query). */
export async function plotStatuses(firmId: number, propertyId: number): Promise<PlotStatusDto[]> {
  const rows = await sequelize.query<{ unit_id: number; unit_name: string; status: string; kind: string; checked_on: string }>(
    `SELECT DISTINCT ON (c.unit_id) c.unit_id, u.name AS unit_name, c.status, c.kind, c.checked_on::text AS checked_on
       FROM unit_checks c JOIN units u ON u.id = c.unit_id
      WHERE c.firm_id = :firmId AND c.property_id = :propertyId
      ORDER BY c.unit_id, c.checked_on DESC, c.id DESC`,
    { replacements: { firmId, propertyId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ unitId: r.unit_id, unitName: r.unit_name, status: r.status as PlotStatusDto['status'], kind: r.kind as PlotStatusDto['kind'], checkedOn: r.checked_on }));
}
