import { describe, expect, it } from 'vitest';
import { parametersWithChanges, planNextSeason, rotationWarning, type UnitEvidence } from '../../../shared/domain/next-season';

const clover: UnitEvidence = {
  unitId: 7,
  unitName: 'Ridge clover plot',
  prescription: {
    practiceId: 3,
    practiceName: 'Perennial clover and chicory plot',
    family: 'legume',
    seedStepKey: 'seed',
    components: [
      { materialKey: 'seed-white-clover', species: 'white clover', rateLbPerAcre: 4 },
      { materialKey: 'seed-chicory', species: 'forage chicory', rateLbPerAcre: 2 },
    ],
    limeStepKey: 'lime',
    fertilizerStepKey: 'fertilize',
    parameters: { steps: { seed: { seedRatesLbPerAcre: { 'seed-white-clover': 2, 'seed-chicory': 1 } } } },
  },
  previousFamily: 'legume',
  establishment: { status: 'failed', checkedOn: '2026-10-01', reason: 'The stand is at 8 % of target on average.' },
  preference: [
    { species: 'white clover', jacobsD: 0.8 },
    { species: 'forage chicory', jacobsD: -0.8 },
  ],
  soilTest: { sampledOn: '2026-03-10', limeTonsPerAcre: 4, p2o5LbPerAcre: 85, k2oLbPerAcre: 140, source: 'University of Missouri' },
};

describe('next season’s plan', () => {
  it('lists each change with its reason, and carries the full rates over', () => {
    const plan = planNextSeason(2027, [clover]);
    expect(plan.changes.map((c) => c.kind)).toEqual(['reseed', 'shift-mix', 'lime', 'rotation']);
    expect(plan.units[0]!.parameters.steps!.seed!.seedRatesLbPerAcre).toBeUndefined(); // this season's half-rate overseeding is not carried
    const shift = plan.changes.find((c) => c.kind === 'shift-mix')!;
    // 4 × 1.25 = 5 and 2 × 0.75 = 1.5 lb/acre (factors: common practice, no source)
    expect(shift.steps.seed!.seedRatesLbPerAcre).toEqual({ 'seed-white-clover': 5, 'seed-chicory': 1.5 });
    expect(shift.reason).toMatch(/prefer white clover \(D 0\.80\) and pass over forage chicory \(D -0\.80\)/);
    expect(plan.changes.every((c) => c.decision === 'proposed')).toBe(true);
  });

  it('lays only the accepted changes over the carried-over parameters', () => {
    const plan = planNextSeason(2027, [clover]);
    const decided = plan.changes.map((c) => ({ ...c, decision: c.kind === 'rotation' ? ('rejected' as const) : ('accepted' as const) }));
    const params = parametersWithChanges(plan.units[0]!, decided);
    expect(params.steps!.seed!.seedRatesLbPerAcre).toEqual({ 'seed-white-clover': 5, 'seed-chicory': 1.5 });
    expect(params.steps!.lime!.limeTonsPerAcre).toBe(4);
    expect(params.steps!.fertilize).toMatchObject({ p2o5LbPerAcre: 85, k2oLbPerAcre: 140 });
    const none = parametersWithChanges(plan.units[0]!, plan.changes);
    expect(none.steps!.lime).toBeUndefined();
  });

  it('leaves an established plot with an old soil test and a new family alone', () => {
    const plan = planNextSeason(2031, [{ ...clover, establishment: { ...clover.establishment!, status: 'established' }, preference: null, previousFamily: 'grain' }]);
    expect(plan.changes).toEqual([]);
  });

  it('warns of the same crop family two seasons running', () => {
    expect(rotationWarning('Hollow plot', 'brassica', 'brassica')).toMatch(/two seasons running/);
    expect(rotationWarning('Hollow plot', 'brassica', 'grain')).toBeNull();
  });
});
