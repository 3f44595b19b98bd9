/**
 * The deer taken from Kettle Hollow Farm's ridge stand on the newest demo sit that saw a buck, with
 * the state's disease-sampling number (invented), so this season's report prints its "Hunting
 * pressure and sits" section with a sampled harvest. Runs after the hunting seed; idempotent.
 */
import { Op } from 'sequelize';
import { HarvestRecord, Property, Sit, type Firm } from '../../models';
import { firmToday } from '../../services/clock';
import { zonedReading } from '../../../shared/domain/clock';
import { huntingSeasonOf } from '../../../shared/domain/survey-estimates';

/** Writes the harvest when the property has none linked to a sit; answers how many rows it wrote. */
export async function seedDemoPressureHarvest(firm: Firm): Promise<number> {
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' } });
  if (!property) return 0;
  if (await HarvestRecord.count({ where: { propertyId: property.id, sitId: { [Op.ne]: null } } })) return 0;
  const sit = await Sit.findOne({ where: { propertyId: property.id, bucks: { [Op.gt]: 0 } }, order: [['startedAt', 'DESC']] });
  if (!sit) return 0;
  const date = zonedReading(sit.startedAt, firm.timezone || 'America/Chicago').date;
  // A sit of the last days may fall in last season when today is early July; the report of either season shows it.
  if (date > (await firmToday(firm.id))) return 0;
  await HarvestRecord.create({
    firmId: firm.id,
    propertyId: property.id,
    date,
    season: huntingSeasonOf(date),
    sex: 'male',
    ageClass: '3.5',
    dressedWeightLb: 142,
    antlerPoints: 8,
    unitId: sit.standUnitId,
    stand: null,
    hunter: 'Family hunter',
    notes: 'Came in on the scrape line at last light.',
    standUnitId: sit.standUnitId,
    sitId: sit.id,
    diseaseSampleNumber: 'WI-CWD 2026-0417',
    createdById: null,
  });
  return 1;
}
