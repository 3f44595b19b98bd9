import { describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import {
  AGE_CLASSES,
  cameraSurveyEstimates,
  harvestSummary,
  huntingSeasonOf,
  type CameraSurveyInput,
  type HarvestRecord,
} from '../../../shared/domain/survey-estimates';

function expectField(fn: () => unknown, field: string): void {
  let error: unknown;
  try {
    fn();
  } catch (caught) {
    error = caught;
  }
  expect(error).toBeInstanceOf(DomainValidationError);
  expect((error as DomainValidationError).field).toBe(field);
  expect((error as DomainValidationError).message.length).toBeGreaterThan(10);
}

// Tallies built to reproduce the published example (SEDSG 1993 abstract, REFERENCES.md):
// 10,000 acres, 213 bucks, buck:doe 1:1.4, doe:fawn 1:0.67 → 711 deer ≈ 45.5 per mi².
// With 5 photos per buck: 213 × 5 = 1,065 buck photos; does 213 × 1.4 = 298.2 → 298.2 × 5 = 1,491
// doe photos; fawns 298.2 × 0.67 = 199.794, taken as 199.8 → 999 fawn photos (fawns per doe
// 199.8 ÷ 298.2 = 0.67002, which the abstract's two decimals give as 0.67). Worked by hand.
// 100 cameras = one per 100 acres, 14 days (Jacobson et al. 1997, from memory).
const sedsg: CameraSurveyInput = {
  buckPhotos: 1_065,
  uniqueBucks: 213,
  doePhotos: 1_491,
  fawnPhotos: 999,
  propertyAcres: 10_000,
  cameraCount: 100,
  startDate: '1993-08-01',
  endDate: '1993-08-14',
};

describe('cameraSurveyEstimates', () => {
  it('reproduces the SEDSG 1993 published example', () => {
    const { estimates, display } = cameraSurveyEstimates(sedsg);
    expect(estimates.photosPerBuck).toBe(5); // 1,065 ÷ 213, worked by hand
    expect(estimates.bucks).toBe(213); // SEDSG 1993 abstract
    expect(estimates.does).toBeCloseTo(298.2, 9); // 1,491 ÷ 5, worked by hand
    expect(estimates.fawns).toBeCloseTo(199.8, 9); // 999 ÷ 5, worked by hand
    // SEDSG 1993 abstract: 711 deer. The abstract gives whole deer, so allow ±0.5.
    expect(Math.abs(estimates.total - 711)).toBeLessThanOrEqual(0.5);
    // SEDSG 1993 abstract: 1:1.4 and 1:0.67, given to 0.1 and 0.01, so allow half of that.
    expect(Math.abs(estimates.buckDoeRatio - 1.4)).toBeLessThanOrEqual(0.05);
    expect(Math.abs((estimates.fawnDoeRatio ?? Number.NaN) - 0.67)).toBeLessThanOrEqual(0.005);
    // SEDSG 1993 abstract: ≈ 45.5 deer per mi², given to 0.1 (711 ÷ 15.625 mi² = 45.504).
    expect(Math.abs(estimates.deerPerSqMi - 45.5)).toBeLessThanOrEqual(0.05);
    // Rounded display matches the abstract's figures.
    expect(display).toEqual({
      photosPerBuck: '5.00',
      bucks: '213',
      does: '298',
      fawns: '200',
      total: '711',
      buckDoeRatio: '1:1.4',
      fawnDoeRatio: '0.67',
      deerPerSqMi: '45.5',
    });
  });

  it('follows the formulas on a small survey worked by hand', () => {
    // Worked by hand (Noble Foundation 2002 / OSU NREM "Deer census" formulas):
    // 30 buck photos ÷ 12 bucks = 2.5 photos per buck; 75 doe photos ÷ 2.5 = 30 does;
    // 21 fawn photos ÷ 2.5 = 8.4 fawns; total 50.4; 50.4 ÷ (1,600 ÷ 640) = 20.16 per mi²;
    // does per buck 30 ÷ 12 = 2.5; fawns per doe 8.4 ÷ 30 = 0.28.
    const result = cameraSurveyEstimates({
      buckPhotos: 30,
      uniqueBucks: 12,
      doePhotos: 75,
      fawnPhotos: 21,
      propertyAcres: 1_600,
      cameraCount: 16,
      startDate: '2024-08-20',
      endDate: '2024-09-02',
    });
    expect(result.estimates.photosPerBuck).toBe(2.5);
    expect(result.estimates.does).toBe(30);
    expect(result.estimates.fawns).toBeCloseTo(8.4, 12);
    expect(result.estimates.total).toBeCloseTo(50.4, 12);
    expect(result.estimates.deerPerSqMi).toBeCloseTo(20.16, 12);
    expect(result.estimates.buckDoeRatio).toBe(2.5);
    expect(result.estimates.fawnDoeRatio).toBeCloseTo(0.28, 12);
    expect(result.display.buckDoeRatio).toBe('1:2.5');
    expect(result.display.fawns).toBe('8');
    expect(result.display.total).toBe('50');
    expect(result.display.deerPerSqMi).toBe('20.2'); // 20.16 → 20.2, worked by hand
    expect(result.surveyDays).toBe(14); // Aug 20 – Sep 2, both days counted, worked by hand
    expect(result.acresPerCamera).toBe(100);
  });

  it('refuses tallies the method cannot use, naming the field', () => {
    expectField(() => cameraSurveyEstimates({ ...sedsg, uniqueBucks: 0 }), 'uniqueBucks');
    expectField(() => cameraSurveyEstimates({ ...sedsg, uniqueBucks: 1_066 }), 'uniqueBucks');
    expectField(() => cameraSurveyEstimates({ ...sedsg, doePhotos: -1 }), 'doePhotos');
    expectField(() => cameraSurveyEstimates({ ...sedsg, fawnPhotos: 2.5 }), 'fawnPhotos');
    expectField(() => cameraSurveyEstimates({ ...sedsg, buckPhotos: -3 }), 'buckPhotos');
    expectField(() => cameraSurveyEstimates({ ...sedsg, cameraCount: 0 }), 'cameraCount');
    expectField(() => cameraSurveyEstimates({ ...sedsg, propertyAcres: 0 }), 'propertyAcres');
    expectField(() => cameraSurveyEstimates({ ...sedsg, propertyAcres: Number.NaN }), 'propertyAcres');
    expectField(() => cameraSurveyEstimates({ ...sedsg, startDate: '1993-02-30' }), 'startDate');
    expectField(() => cameraSurveyEstimates({ ...sedsg, startDate: '08/01/1993' }), 'startDate');
    expectField(() => cameraSurveyEstimates({ ...sedsg, endDate: '1993-07-31' }), 'endDate');
  });

  it('always carries the undercount and baiting notes', () => {
    const codes = cameraSurveyEstimates(sedsg).warnings.map((w) => w.code);
    // One camera per 100 acres for 14 days meets the method (Jacobson et al. 1997, from memory): notes only.
    expect(codes).toEqual(['method-undercounts', 'baiting-rules']);
    const notes = cameraSurveyEstimates(sedsg).warnings;
    expect(notes.every((w) => w.severity === 'note')).toBe(true);
    expect(notes[0].message).toMatch(/32 %/); // Moore et al. 2014, SEAFWA Journal 1: mean −32 %
    expect(notes[1].message).toMatch(/illegal in some states and counties/);
  });

  it('warns about too few cameras and a short survey', () => {
    // Fewer than one camera per 100 acres (Jacobson et al. 1997, from memory): 99 cameras on 10,000 acres.
    const sparse = cameraSurveyEstimates({ ...sedsg, cameraCount: 99 });
    expect(sparse.warnings.map((w) => w.code)).toContain('camera-density-low');
    expect(sparse.warnings.find((w) => w.code === 'camera-density-low')?.message).toMatch(/100 cameras here/);
    // Shorter than 10 days (Jacobson et al. 1997, from memory): Aug 1–9 is 9 days; Aug 1–10 is 10.
    const short = cameraSurveyEstimates({ ...sedsg, endDate: '1993-08-09' });
    expect(short.surveyDays).toBe(9);
    expect(short.warnings.map((w) => w.code)).toContain('survey-short');
    const tenDays = cameraSurveyEstimates({ ...sedsg, endDate: '1993-08-10' });
    expect(tenDays.warnings.map((w) => w.code)).not.toContain('survey-short');
    // A one-day survey is allowed, with the warning.
    expect(cameraSurveyEstimates({ ...sedsg, endDate: sedsg.startDate }).surveyDays).toBe(1);
  });

  it('reports no fawn:doe ratio when no doe was photographed', () => {
    const result = cameraSurveyEstimates({ ...sedsg, doePhotos: 0 });
    expect(result.estimates.fawnDoeRatio).toBeNull();
    expect(result.display.fawnDoeRatio).toBe('n/a');
    expect(result.estimates.buckDoeRatio).toBe(0);
    expect(result.warnings.map((w) => w.code)).toContain('no-does');
  });
});

describe('harvestSummary', () => {
  // Invented demo records.
  const records: HarvestRecord[] = [
    { date: '2023-11-18', sex: 'buck', ageClass: '3.5', dressedWeightLb: 150 },
    { date: '2023-11-25', sex: 'doe', ageClass: '2.5', dressedWeightLb: 95 },
    { date: '2023-12-02', sex: 'doe', ageClass: '1.5', dressedWeightLb: 80 },
    { date: '2024-01-06', sex: 'doe', ageClass: '3.5', dressedWeightLb: 105 }, // January → 2023 season
    { date: '2024-01-07', sex: 'buck', ageClass: 'fawn', dressedWeightLb: 45 }, // button buck, not in the ratio
    { date: '2024-10-20', sex: 'buck', ageClass: '3.5', dressedWeightLb: 160 },
    { date: '2024-11-09', sex: 'buck', ageClass: '5.5+' },
    { date: '2024-11-10', sex: 'doe', ageClass: '3.5', dressedWeightLb: null },
    { date: '2024-12-14', sex: 'doe', ageClass: 'fawn', dressedWeightLb: 40 },
  ];

  it('counts the age structure by class and sex', () => {
    const summary = harvestSummary(records);
    expect(summary).toMatchObject({ total: 9, bucks: 4, does: 5 });
    expect(summary.ageClasses.map((c) => c.ageClass)).toEqual([...AGE_CLASSES]); // Texas A&M AgriLife age classes
    const byClass = Object.fromEntries(summary.ageClasses.map((c) => [c.ageClass, [c.bucks, c.does]]));
    // Counted by hand from the records above.
    expect(byClass).toEqual({ fawn: [1, 1], '1.5': [0, 1], '2.5': [0, 1], '3.5': [2, 2], '4.5': [0, 0], '5.5+': [1, 0] });
  });

  it('gives the mean dressed weight by age class over weighed deer only', () => {
    const byClass = new Map(harvestSummary(records).ageClasses.map((c) => [c.ageClass, c]));
    // Worked by hand: 3.5 class weighed 150, 160 (bucks) and 105 (doe); the 2024 doe has no weight.
    expect(byClass.get('3.5')).toMatchObject({ weighed: 3, meanBuckDressedWeightLb: 155, meanDoeDressedWeightLb: 105 });
    expect(byClass.get('3.5')?.meanDressedWeightLb).toBeCloseTo(415 / 3, 12);
    expect(byClass.get('fawn')?.meanDressedWeightLb).toBe(42.5); // (45 + 40) ÷ 2, worked by hand
    expect(byClass.get('5.5+')).toMatchObject({ weighed: 0, meanDressedWeightLb: null }); // no weight given
    expect(byClass.get('4.5')?.meanDressedWeightLb).toBeNull();
  });

  it('groups seasons July–June and gives the adult buck:doe ratio', () => {
    const seasons = harvestSummary(records).seasons;
    // Counted by hand: 2023–24 has 1 adult buck and 3 adult does (plus a button buck);
    // 2024–25 has 2 adult bucks and 1 adult doe (plus a doe fawn).
    expect(seasons.map((s) => s.label)).toEqual(['2023–24', '2024–25']);
    expect(seasons[0]).toMatchObject({ season: 2023, bucks: 2, does: 3, adultBucks: 1, adultDoes: 3, doesPerBuck: 3, buckDoeRatio: '1:3.0' });
    expect(seasons[1]).toMatchObject({ season: 2024, bucks: 2, does: 2, adultBucks: 2, adultDoes: 1, doesPerBuck: 0.5, buckDoeRatio: '1:0.5' });
    const doesOnly = harvestSummary([{ date: '2022-10-01', sex: 'doe', ageClass: '2.5' }]).seasons[0];
    expect(doesOnly).toMatchObject({ doesPerBuck: null, buckDoeRatio: 'no adult bucks' });
  });

  it('names the hunting season by the July it starts in', () => {
    // July–June grouping (our convention): June 30 belongs to the season that began the July before.
    expect(huntingSeasonOf('2025-06-30')).toBe(2024);
    expect(huntingSeasonOf('2025-07-01')).toBe(2025);
    expect(huntingSeasonOf('2025-01-10')).toBe(2024);
    expect(harvestSummary([{ date: '2099-09-01', sex: 'doe', ageClass: '1.5' }]).seasons[0].label).toBe('2099–00');
  });

  it('refuses records it cannot classify, naming the record and field', () => {
    const ok = records[0];
    expectField(() => harvestSummary([ok, { ...ok, sex: 'male' as unknown as 'buck' }]), 'records[1].sex');
    expectField(() => harvestSummary([{ ...ok, ageClass: '6.5' as unknown as '5.5+' }]), 'records[0].ageClass');
    expectField(() => harvestSummary([{ ...ok, dressedWeightLb: -10 }]), 'records[0].dressedWeightLb');
    expectField(() => harvestSummary([{ ...ok, date: '2024-13-01' }]), 'records[0].date');
    expect(harvestSummary([])).toMatchObject({ total: 0, seasons: [] });
  });
});
