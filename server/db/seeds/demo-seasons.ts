/**
 * A second season on Kettle Hollow Farm, all invented, so the portal's "this season and last" and
 * the season report have two seasons to compare: the brassica plot re-seeded and established, the
 * clover plot browsed again, the oak slope cruised after its thinning, and soil tests of both plots
 * in both seasons (the clover plot's pH up after its lime). Seasons follow the firm's today: "this
 * season" is the latest year whose fall checks are already past, "last season" the year before.
 * Idempotent: each check carries an idempotency key with its year, and a unit that already has a
 * check of that kind in a season (demo-checks.ts) or a soil test that year gets no second one.
 */
import { Op } from 'sequelize';
import { Unit, User, type Firm } from '../../models';
import { createCheck } from '../../commands/check-writer';
import { createSoilTest } from '../../commands/soil-test-writer';
import { UnitCheck } from '../../models/unit-check';
import { SoilTest } from '../../models/soil-test';
import { toSessionUser } from '../../services/auth/passport';
import { firmToday } from '../../services/clock';
import { UnitCheckCreateSchema, type UnitCheckCreateInput } from '../../../shared/schemas/checks';
import { SoilTestCreateSchema } from '../../../shared/schemas/soil-tests';

type Season = 'last' | 'this';
/** A check body without its date (distributed over the three kinds). */
type Undated<T> = T extends unknown ? Omit<T, 'checkedOn'> : never;

/** [season, unit, key, check with its month-day]. */
const CHECKS: { season: Season; unit: string; key: string; monthDay: string; body: Undated<UnitCheckCreateInput> }[] = [
  {
    season: 'last',
    unit: 'Hollow brassica plot',
    key: 'hollow-establishment',
    monthDay: '09-24',
    body: { kind: 'establishment', frameSqFt: 1, samples: [{ species: 'rape', plants: 1 }, { species: 'turnip', plants: 1 }, { species: 'forage radish', plants: 0 }], groundCoverPct: 25, weedPressure: 'high', notes: 'Dry after seeding; most of the stand never came.' },
  },
  {
    season: 'last',
    unit: 'Ridge clover plot',
    key: 'ridge-browse',
    monthDay: '10-20',
    body: { kind: 'browse', measure: 'height-in', pairs: [{ species: 'white clover', caged: 9, open: 3 }, { species: 'forage chicory', caged: 14, open: 11 }] },
  },
  {
    season: 'last',
    unit: 'North oak slope',
    key: 'oak-cruise',
    monthDay: '11-08',
    body: { kind: 'timber', baf: 10, targetResidualBaSqFtPerAcre: 70, points: [{ inTrees: 11, dbhIn: 9 }, { inTrees: 13, dbhIn: 8 }, { inTrees: 9, dbhIn: 11 }] },
  },
  {
    season: 'this',
    unit: 'Hollow brassica plot',
    key: 'hollow-establishment',
    monthDay: '09-22',
    body: {
      kind: 'establishment',
      frameSqFt: 1,
      samples: [{ species: 'rape', plants: 6 }, { species: 'rape', plants: 5 }, { species: 'turnip', plants: 5 }, { species: 'turnip', plants: 4 }, { species: 'forage radish', plants: 4 }, { species: 'forage radish', plants: 3 }],
      groundCoverPct: 80,
      weedPressure: 'low',
      notes: 'Re-seeded at full rate after last fall’s failure; rain a day after seeding.',
    },
  },
  {
    season: 'this',
    unit: 'Ridge clover plot',
    key: 'ridge-browse',
    monthDay: '10-18',
    body: { kind: 'browse', measure: 'height-in', pairs: [{ species: 'white clover', caged: 10, open: 4 }, { species: 'forage chicory', caged: 13, open: 8 }], notes: 'Same two cages, moved ten paces.' },
  },
  {
    season: 'this',
    unit: 'North oak slope',
    key: 'oak-cruise',
    monthDay: '11-05',
    body: { kind: 'timber', baf: 10, targetResidualBaSqFtPerAcre: 70, points: [{ inTrees: 7, dbhIn: 11 }, { inTrees: 8, dbhIn: 10 }, { inTrees: 6, dbhIn: 12 }], notes: 'After the winter thinning.' },
  },
];

const SOIL_TESTS: { season: Season; unit: string; monthDay: string; ph: number; bufferPh: number; pPpm: number; kPpm: number; enmLbPerAcre: number }[] = [
  { season: 'last', unit: 'Hollow brassica plot', monthDay: '03-20', ph: 5.4, bufferPh: 6.5, pPpm: 12, kPpm: 105, enmLbPerAcre: 1400 },
  { season: 'this', unit: 'Ridge clover plot', monthDay: '03-16', ph: 6.3, bufferPh: 6.8, pPpm: 24, kPpm: 135, enmLbPerAcre: 200 },
  { season: 'this', unit: 'Hollow brassica plot', monthDay: '03-17', ph: 6.0, bufferPh: 6.7, pPpm: 19, kPpm: 120, enmLbPerAcre: 400 },
];

/** Records the second season's checks and soil tests that are missing; answers how many it made. */
export async function seedDemoSeasons(firm: Firm): Promise<number> {
  const consultant = await User.findOne({ where: { firmId: firm.id, role: 'consultant' } });
  if (!consultant) return 0;
  const actor = await toSessionUser(consultant);
  const today = await firmToday(firm.id);
  // "This season" is the latest year whose last demo check (Nov 5) has passed.
  const thisYear = today.slice(5) >= '11-05' ? Number(today.slice(0, 4)) : Number(today.slice(0, 4)) - 1;
  const yearOf = (s: Season) => (s === 'this' ? thisYear : thisYear - 1);
  let made = 0;
  for (const item of CHECKS) {
    const unit = await Unit.findOne({ where: { firmId: firm.id, name: item.unit } });
    if (!unit) continue;
    const year = yearOf(item.season);
    const existing = await UnitCheck.findOne({ where: { unitId: unit.id, kind: item.body.kind, season: year, idempotencyKey: { [Op.notLike]: `demo-season-%` } } });
    if (existing) continue; // demo-checks.ts already recorded this kind of check on the unit that season
    const body = UnitCheckCreateSchema.parse({ ...item.body, checkedOn: `${year}-${item.monthDay}` });
    const { replayed } = await createCheck(actor, unit.id, body, `demo-season-${year}-${item.key}`, null);
    if (!replayed) made += 1;
  }
  for (const t of SOIL_TESTS) {
    const unit = await Unit.findOne({ where: { firmId: firm.id, name: t.unit } });
    if (!unit) continue;
    const year = yearOf(t.season);
    if (await SoilTest.findOne({ where: { unitId: unit.id, sampledOn: { [Op.between]: [`${year}-01-01`, `${year}-12-31`] } } })) continue;
    const values = SoilTestCreateSchema.parse({ sampledOn: `${year}-${t.monthDay}`, lab: 'Driftless Soil Lab', ph: t.ph, bufferPh: t.bufferPh, bufferMethod: 'woodruff', pPpm: t.pPpm, kPpm: t.kPpm, organicMatterPct: 3, cec: 12, enmLbPerAcre: t.enmLbPerAcre });
    await createSoilTest(actor, unit.id, values, null);
    made += 1;
  }
  return made;
}
