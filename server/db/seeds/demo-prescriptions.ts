/** Prescriptions on the demo plan, written through the same command the API uses. */
import { Practice, Prescription, Unit, User } from '../../models';
import { createPrescription } from '../../commands/prescription-writer';
import { toSessionUser } from '../../services/auth/passport';
import type { Firm } from '../../models';

const PLAN: { unit: string; practice: string; targetMonthDay?: string }[] = [
  { unit: 'Hollow brassica plot', practice: 'fall-brassica-plot' },
  { unit: 'Ridge clover plot', practice: 'perennial-clover-chicory' },
  { unit: 'South slope bedding', practice: 'tsi-hinge-cut' },
  { unit: 'Switchgrass screen', practice: 'switchgrass-screen' },
  { unit: 'East walk-in to ridge stand', practice: 'access-route-clearing' },
  { unit: 'Mock scrape by the oak', practice: 'mock-scrape' },
  { unit: 'Cedar draw sanctuary', practice: 'sanctuary-posting' },
  { unit: 'Club plot', practice: 'fall-brassica-plot' },
];

/** Writes the demo prescriptions that are missing (one per unit). */
export async function seedDemoPrescriptions(firm: Firm): Promise<number> {
  const consultant = await User.findOne({ where: { firmId: firm.id, role: 'consultant' } });
  if (!consultant) return 0;
  const actor = await toSessionUser(consultant);
  let written = 0;
  for (const item of PLAN) {
    const unit = await Unit.findOne({ where: { firmId: firm.id, name: item.unit } });
    const practice = await Practice.findOne({ where: { firmId: firm.id, key: item.practice } });
    if (!unit || !practice) continue;
    if (await Prescription.count({ where: { unitId: unit.id } })) continue;
    await createPrescription(actor, unit.id, { practiceId: practice.id }, null);
    written++;
  }
  return written;
}
