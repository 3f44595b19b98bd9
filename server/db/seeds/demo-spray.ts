/**
 * A spray record on the demo farm, invented: the crew finishes the first open herbicide step with
 * its record (product, total amount, area, wind, temperature, applicator), through the same
 * completion the field sheet uses. Idempotent: a firm with a spray record already gets nothing new.
 */
import { Op } from 'sequelize';
import { Task, Unit, User, type Firm } from '../../models';
import { SprayRecord } from '../../models/spray-record';
import { completeTask, updateTask } from '../../commands/task-writer';
import { toSessionUser } from '../../services/auth/passport';
import { firmToday } from '../../services/clock';
import { addDays } from '../../../shared/domain/planting-windows';
import { isHerbicideTask } from '../../commands/spray-record-writer';
import { SPRAY_AMOUNT_UNITS, type SprayAmountUnit } from '../../../shared/domain/spray-records';

/** Completes one herbicide step with its spray record; answers how many records were made. */
export async function seedDemoSpray(firm: Firm): Promise<number> {
  if (await SprayRecord.count({ where: { firmId: firm.id } })) return 0;
  const [staff, crew] = await Promise.all([User.findOne({ where: { firmId: firm.id, role: 'consultant' } }), User.findOne({ where: { firmId: firm.id, role: 'crew', active: true }, order: [['id', 'ASC']] })]);
  if (!staff || !crew) return 0;
  const open = await Task.findAll({ where: { firmId: firm.id, status: { [Op.in]: ['planned', 'scheduled'] } }, order: [['id', 'ASC']] });
  const task = open.find((t) => isHerbicideTask(t) && t.quantities.some((q) => q.key.startsWith('herb-')));
  if (!task) return 0;
  const product = task.quantities.find((q) => q.key.startsWith('herb-'))!;
  const unit = task.unitId ? await Unit.findByPk(task.unitId, { attributes: ['acres'] }) : null;
  const doneOn = addDays(await firmToday(firm.id), -2);
  await updateTask(await toSessionUser(staff), task.id, { assigneeId: crew.id, startDate: doneOn, endDate: doneOn }, null);
  await completeTask(
    await toSessionUser(crew),
    task.id,
    {
      doneOn,
      notes: 'Sprayed early, before the breeze picked up; no drift toward the creek side.',
      hours: 1,
      quantitiesUsed: [],
      spray: {
        products: [{ materialKey: product.key, amount: Math.max(0.1, Number(product.amount.toFixed(2))), unit: (SPRAY_AMOUNT_UNITS as readonly string[]).includes(product.unit) ? (product.unit as SprayAmountUnit) : 'gal' }],
        cropOrSite: `${task.unitName}: vegetation burndown before seeding`,
        areaTreatedAcres: Math.max(0.1, Number((unit?.acres ?? 1).toFixed(2))),
        windMph: 4,
        windDirection: 'SW',
        airTempF: 68,
        applicatorName: crew.name,
        applicatorCertNo: null,
      },
    },
    [],
    `demo-spray-${task.id}`,
    null,
  );
  return SprayRecord.count({ where: { firmId: firm.id } });
}
