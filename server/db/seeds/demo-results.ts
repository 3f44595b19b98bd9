/**
 * Two seasons of results on Kettle Hollow Farm, all invented: a late-summer camera survey each
 * year on the farm's two camera sites, and the deer the family took. Idempotent: finds before it creates.
 */
import type { Transaction } from 'sequelize';
import { CameraSurvey, HarvestRecord, Property, Unit, type Firm } from '../../models';
import { huntingSeasonOf } from '../../../shared/domain/survey-estimates';
import type { AgeClass } from '../../../shared/domain/survey-estimates';
import type { HarvestSex, IdentifiedBuck } from '../../../shared/schemas/results';

const SURVEYS: { name: string; startDate: string; endDate: string; buckPhotos: number; uniqueBucks: number; doePhotos: number; fawnPhotos: number; bucks: IdentifiedBuck[]; notes: string }[] = [
  {
    name: 'Late-summer survey 2024',
    startDate: '2024-08-12',
    endDate: '2024-08-25',
    buckPhotos: 42,
    uniqueBucks: 6,
    doePhotos: 119,
    fawnPhotos: 56,
    bucks: [
      { label: 'Wide eight', ageClass: '3.5' },
      { label: 'Split brow', ageClass: '2.5' },
      { label: 'Tall six', ageClass: '2.5' },
      { label: 'Forky', ageClass: '1.5' },
      { label: 'Spike A', ageClass: '1.5' },
      { label: 'Spike B', ageClass: '1.5' },
    ],
    notes: 'Cameras on the ridge and in the hollow, no bait.',
  },
  {
    name: 'Late-summer survey 2025',
    startDate: '2025-08-11',
    endDate: '2025-08-24',
    buckPhotos: 54,
    uniqueBucks: 8,
    doePhotos: 108,
    fawnPhotos: 61,
    bucks: [
      { label: 'Wide eight', ageClass: '4.5' },
      { label: 'Split brow', ageClass: '3.5' },
      { label: 'Tall six', ageClass: '3.5' },
      { label: 'Forky', ageClass: '2.5' },
      { label: 'Kicker', ageClass: '2.5' },
      { label: 'Spike C', ageClass: '1.5' },
      { label: 'Spike D', ageClass: '1.5' },
      { label: 'Short four', ageClass: '1.5' },
    ],
    notes: 'Same two sites as last year, no bait.',
  },
];

const HARVESTS: { date: string; sex: HarvestSex; ageClass: AgeClass; dressedWeightLb: number | null; antlerPoints: number | null; stand: string; hunter: string }[] = [
  { date: '2024-11-16', sex: 'male', ageClass: '2.5', dressedWeightLb: 128, antlerPoints: 6, stand: 'Ridge stand', hunter: 'Priya Okonkwo' },
  { date: '2024-11-17', sex: 'female', ageClass: '3.5', dressedWeightLb: 104, antlerPoints: null, stand: 'Hollow stand', hunter: 'Arne Larsen' },
  { date: '2024-11-23', sex: 'female', ageClass: '1.5', dressedWeightLb: 84, antlerPoints: null, stand: 'Hollow stand', hunter: 'Mina Larsen' },
  { date: '2024-12-07', sex: 'female', ageClass: '2.5', dressedWeightLb: 96, antlerPoints: null, stand: 'Ridge stand', hunter: 'Arne Larsen' },
  { date: '2024-12-14', sex: 'female', ageClass: 'fawn', dressedWeightLb: 52, antlerPoints: null, stand: 'Hollow stand', hunter: 'Mina Larsen' },
  { date: '2025-11-22', sex: 'male', ageClass: '4.5', dressedWeightLb: 172, antlerPoints: 8, stand: 'Ridge stand', hunter: 'Priya Okonkwo' },
  { date: '2025-11-23', sex: 'female', ageClass: '3.5', dressedWeightLb: 108, antlerPoints: null, stand: 'Hollow stand', hunter: 'Arne Larsen' },
  { date: '2025-11-29', sex: 'female', ageClass: '2.5', dressedWeightLb: 99, antlerPoints: null, stand: 'Hollow stand', hunter: 'Mina Larsen' },
  { date: '2025-12-06', sex: 'male', ageClass: '3.5', dressedWeightLb: 151, antlerPoints: 9, stand: 'Ridge stand', hunter: 'Arne Larsen' },
];

/** Writes the demo surveys and harvests that are missing; answers how many rows were written. */
export async function seedDemoResults(firm: Firm, transaction?: Transaction): Promise<number> {
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' }, transaction });
  if (!property) return 0;
  const units = await Unit.findAll({ where: { propertyId: property.id }, attributes: ['id', 'kind', 'name'], transaction });
  const cameraUnitIds = units.filter((u) => u.kind === 'camera-site').map((u) => u.id);
  const unitByName = new Map(units.map((u) => [u.name, u.id]));
  let written = 0;
  for (const s of SURVEYS) {
    if (await CameraSurvey.count({ where: { propertyId: property.id, name: s.name }, transaction })) continue;
    await CameraSurvey.create(
      { firmId: firm.id, propertyId: property.id, ...s, season: huntingSeasonOf(s.startDate), cameraUnitIds, cameraCount: Math.max(1, cameraUnitIds.length), createdById: null },
      { transaction },
    );
    written++;
  }
  if ((await HarvestRecord.count({ where: { propertyId: property.id }, transaction })) === 0) {
    for (const h of HARVESTS) {
      await HarvestRecord.create(
        { firmId: firm.id, propertyId: property.id, ...h, season: huntingSeasonOf(h.date), unitId: unitByName.get(h.stand) ?? null, stand: null, notes: null, createdById: null },
        { transaction },
      );
      written++;
    }
  }
  return written;
}
