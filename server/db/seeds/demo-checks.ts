/**
 * Checks on Kettle Hollow Farm, all invented: a thin brassica stand (with its re-seeding drafted for
 * the consultant), a browse check with cages on the clover plot, a prism cruise of the oak slope, and
 * a soil test of the clover plot. Idempotent: each check carries a fixed idempotency key and the soil
 * test is found by unit and date, so seeding again stores nothing new.
 */
import { Unit, User, type Firm } from '../../models';
import { createCheck } from '../../commands/check-writer';
import { UnitCheckCreateSchema, type UnitCheckCreateInput } from '../../../shared/schemas/checks';
import { toSessionUser } from '../../services/auth/passport';
import { createSoilTest } from '../../commands/soil-test-writer';
import { SoilTest } from '../../models/soil-test';

const CHECKS: { unit: string; key: string; body: UnitCheckCreateInput }[] = [
  {
    unit: 'Hollow brassica plot',
    key: 'demo-check-hollow-establishment',
    body: {
      kind: 'establishment',
      checkedOn: '2025-09-24',
      frameSqFt: 1,
      samples: [
        { species: 'rape', plants: 3 },
        { species: 'rape', plants: 2 },
        { species: 'turnip', plants: 2 },
        { species: 'turnip', plants: 3 },
        { species: 'forage radish', plants: 1 },
        { species: 'forage radish', plants: 2 },
      ],
      groundCoverPct: 45,
      weedPressure: 'moderate',
      notes: 'Dry three weeks after seeding; the low end washed.',
    },
  },
  {
    unit: 'Ridge clover plot',
    key: 'demo-check-ridge-browse',
    body: {
      kind: 'browse',
      checkedOn: '2025-10-20',
      measure: 'height-in',
      pairs: [
        { species: 'white clover', caged: 9, open: 3 },
        { species: 'white clover', caged: 8, open: 3.5 },
        { species: 'forage chicory', caged: 14, open: 11 },
        { species: 'forage chicory', caged: 12, open: 10 },
      ],
      notes: 'Two cages per species since early September.',
    },
  },
  {
    unit: 'North oak slope',
    key: 'demo-check-oak-cruise',
    body: { kind: 'timber', checkedOn: '2025-11-08', baf: 10, targetResidualBaSqFtPerAcre: 70, points: [{ inTrees: 11, dbhIn: 9 }, { inTrees: 13, dbhIn: 8 }, { inTrees: 9, dbhIn: 11 }] },
  },
];

/** Records the demo checks that are missing. */
export async function seedDemoChecks(firm: Firm): Promise<number> {
  const consultant = await User.findOne({ where: { firmId: firm.id, role: 'consultant' } });
  if (!consultant) return 0;
  const actor = await toSessionUser(consultant);
  let made = 0;
  for (const item of CHECKS) {
    const unit = await Unit.findOne({ where: { firmId: firm.id, name: item.unit } });
    if (!unit) continue;
    const { replayed } = await createCheck(actor, unit.id, UnitCheckCreateSchema.parse(item.body), item.key, null);
    if (!replayed) made += 1;
  }
  const ridge = await Unit.findOne({ where: { firmId: firm.id, name: 'Ridge clover plot' } });
  if (ridge && !(await SoilTest.findOne({ where: { unitId: ridge.id, sampledOn: '2025-03-18' } }))) {
    await createSoilTest(actor, ridge.id, { sampledOn: '2025-03-18', lab: 'Driftless Soil Lab', ph: 5.6, bufferPh: 6.6, bufferMethod: 'woodruff', pPpm: 18, kPpm: 120, organicMatterPct: 3.1, cec: 12, enmLbPerAcre: 900 }, null);
    made += 1;
  }
  return made;
}
