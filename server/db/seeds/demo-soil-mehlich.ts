/**
 * A Mehlich-3 soil test on Bluestem Ridge's Club plot, invented: the club sent its sample to a
 * commercial lab that reads P and K with Mehlich-3, so the recommendation shown is worked after the
 * conversion to the Tri-State basis (Ohio State ANR-75: P ÷ 1.35, K ÷ 1.14). Sampled in late July of
 * the latest year whose July 22 has passed, before the fall brassicas go in. Idempotent: a unit that
 * already has a Mehlich-3 test gets no second one.
 */
import { Property, Unit, User, type Firm } from '../../models';
import { SoilTest } from '../../models/soil-test';
import { createSoilTest } from '../../commands/soil-test-writer';
import { toSessionUser } from '../../services/auth/passport';
import { firmToday } from '../../services/clock';
import { SoilTestCreateSchema } from '../../../shared/schemas/soil-tests';

/** Records the Club plot's Mehlich-3 soil test when it is missing; answers how many it made (0 or 1). */
export async function seedDemoSoilMehlich(firm: Firm): Promise<number> {
  const consultant = await User.findOne({ where: { firmId: firm.id, role: 'consultant' } });
  const property = await Property.findOne({ where: { firmId: firm.id, name: 'Bluestem Ridge' } });
  if (!consultant || !property) return 0;
  const plot = await Unit.findOne({ where: { firmId: firm.id, propertyId: property.id, name: 'Club plot' } });
  if (!plot || (await SoilTest.findOne({ where: { unitId: plot.id, labMethod: 'mehlich-3' } }))) return 0;
  const today = await firmToday(firm.id);
  const year = today.slice(5) >= '07-22' ? Number(today.slice(0, 4)) : Number(today.slice(0, 4)) - 1;
  // Mehlich-3 P 24 and K 115 ppm: below the Tri-State critical levels only once converted (17.8 Bray P1, 100.9 ammonium-acetate K).
  const values = SoilTestCreateSchema.parse({ sampledOn: `${year}-07-22`, lab: 'Sandstone Bluff Ag Lab', labMethod: 'mehlich-3', ph: 5.9, bufferPh: 6.7, bufferMethod: 'woodruff', pPpm: 24, kPpm: 115, organicMatterPct: 2.8, cec: 11, enmLbPerAcre: 450 });
  await createSoilTest(await toSessionUser(consultant), plot.id, values, null);
  return 1;
}
