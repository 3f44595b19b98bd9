/**
 * Spray records: written when a herbicide step is completed, in the completion's transaction, with
 * its audit record. Restricted-use products need a certified applicator and the EPA Reg. No.
 */
import { Op, type Transaction } from 'sequelize';
import { Material, Property, Unit, type Task } from '../models';
import { SprayRecord } from '../models/spray-record';
import type { SessionUser } from '../../shared/schemas/auth';
import type { SprayApplicationInput } from '../../shared/schemas/spray-records';
import type { SprayMaterial } from '../../shared/domain/practice';
import { centroidOf } from '../../shared/domain/geometry';
import { isHerbicideTask } from '../../shared/domain/spray-records';
import { unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';

const isSpray = (d: { type: string }): d is SprayMaterial => d.type === 'herbicide' || d.type === 'adjuvant';

export { isHerbicideTask };

/**
 * Stores one spray record per product of a herbicide step's completion. A non-herbicide step with a
 * spray record, a herbicide step without one, a product outside the firm's spray products, or a
 * restricted-use product without a certified applicator or EPA Reg. No. is a 422; nothing is stored.
 */
export async function recordSprayApplication(
  actor: SessionUser,
  task: Task,
  spray: SprayApplicationInput | undefined,
  appliedOn: string,
  transaction: Transaction,
  ip: string | null,
): Promise<SprayRecord[]> {
  if (!isHerbicideTask(task)) {
    if (spray) throw unprocessable('spray: this task is not a herbicide step; leave the spray record out.');
    return [];
  }
  if (!spray) throw unprocessable('spray: a herbicide step is completed with its spray record — product, total amount, area, crop or site, wind, temperature and the applicator.');
  const planned = (task.quantities ?? []).map((q) => q.key);
  const keys = [...new Set([...planned, ...spray.products.map((p) => p.materialKey)])];
  const materials = await Material.findAll({ where: { firmId: actor.firmId, key: { [Op.in]: keys } }, transaction });
  const byKey = new Map(materials.filter((m) => isSpray(m.definition)).map((m) => [m.key, m.definition as SprayMaterial]));
  spray.products.forEach((p, i) => {
    if (!byKey.has(p.materialKey)) throw unprocessable(`spray.products[${i}].materialKey: “${p.materialKey}” is not a spray product in your firm’s library.`);
  });
  const restricted = [...new Set([...planned, ...spray.products.map((p) => p.materialKey)])].map((k) => byKey.get(k)).filter((d): d is SprayMaterial => !!d?.restrictedUse);
  if (restricted.length > 0 && !spray.applicatorCertNo) {
    throw unprocessable(`spray.applicatorCertNo: ${restricted.map((d) => d.name).join(', ')} ${restricted.length === 1 ? 'is a restricted-use product' : 'are restricted-use products'}; only a certified applicator may apply ${restricted.length === 1 ? 'it' : 'them'}. Enter the certified applicator’s name and certification number.`);
  }
  const rows = spray.products.map((p, i) => {
    const material = byKey.get(p.materialKey)!;
    const epaRegNo = p.epaRegNo ?? material.epaRegNo ?? null;
    if (material.restrictedUse && !epaRegNo) throw unprocessable(`spray.products[${i}].epaRegNo: enter the EPA Reg. No. from the label of ${material.name}; a restricted-use record needs it.`);
    return { p, material, epaRegNo };
  });
  const [unit, property] = await Promise.all([
    task.unitId ? Unit.findOne({ where: { id: task.unitId, firmId: actor.firmId }, transaction }) : null,
    Property.findOne({ where: { id: task.propertyId, firmId: actor.firmId }, attributes: ['id', 'name'], transaction }),
  ]);
  const centre = unit ? centroidOf(unit.geometry) : null;
  const made = await SprayRecord.bulkCreate(
    rows.map(({ p, material, epaRegNo }) => ({
      firmId: actor.firmId,
      propertyId: task.propertyId,
      unitId: task.unitId,
      taskId: task.id,
      appliedOn,
      propertyName: property?.name ?? '',
      unitName: unit?.name ?? task.unitName,
      latitude: centre ? Number(centre.lat.toFixed(6)) : null,
      longitude: centre ? Number(centre.lon.toFixed(6)) : null,
      cropOrSite: spray.cropOrSite,
      areaTreated: spray.areaTreatedAcres,
      areaUnit: 'acres',
      materialKey: p.materialKey,
      productName: material.name,
      epaRegNo,
      restrictedUse: material.restrictedUse,
      amount: p.amount,
      amountUnit: p.unit,
      applicatorName: spray.applicatorName,
      applicatorCertNo: spray.applicatorCertNo,
      windMph: spray.windMph,
      windDirection: spray.windDirection,
      airTempF: spray.airTempF,
      recordedById: actor.id,
    })),
    { transaction, returning: true },
  );
  await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'spray-record.created', subjectType: 'Task', subjectId: task.id, data: { sprayRecordIds: made.map((r) => r.id), products: spray.products.map((p) => p.materialKey), restrictedUse: restricted.length > 0 }, ip }, transaction);
  return made;
}
