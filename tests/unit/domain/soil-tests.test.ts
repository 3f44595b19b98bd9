import { describe, expect, it } from 'vitest';
import { checkBufferMethod, cropGroupOf, kCriticalPpm, limeRecommendation, ncdacsAcidity, ncdacsLimeTonsPerAcre, nutrientRecommendation, recommendSoilTest, retestDue, TARGET_PH, toTriStateBasis } from '../../../shared/domain/soil-tests';
import { validationErrorOf } from './support';

describe('lime by the NCDA&CS Mehlich-buffer method', () => {
  it('reproduces the published worked example', () => {
    // NCDA&CS (ncagr.gov "bufftab1"): pH 5.0 → 6.0, acidity 1.2, no residual credit → 1.2 × 0.625 = 0.75 t/acre (the page prints 0.76)
    expect(ncdacsLimeTonsPerAcre(5.0, 1.2, 6.0)).toBeCloseTo(0.75, 10);
    // Same page: acidity = (6.6 − buffer pH) × 4 → buffer pH 6.3 gives 1.2 meq/100 cm³
    expect(ncdacsAcidity(6.3)).toBeCloseTo(1.2, 10);
    const rec = limeRecommendation('ncdacs', { ph: 5.0, bufferPh: 6.3, bufferMethod: 'mehlich' }, 6.0);
    expect(rec.tonsPerAcre).toBe(0.75);
    expect(rec.working).toMatch(/6\.6 − 6\.3/);
  });

  it('subtracts the residual credit and never goes below zero', () => {
    expect(ncdacsLimeTonsPerAcre(5.0, 1.2, 6.0, 0.1)).toBeCloseTo(0.65, 10); // formula on the same page
    expect(ncdacsLimeTonsPerAcre(6.2, 1.2, 6.0)).toBe(0);
  });

  it('refuses a buffer the method does not use, and a pH outside 3–10', () => {
    expect(validationErrorOf(() => checkBufferMethod('ncdacs', 'smp')).field).toBe('bufferMethod');
    expect(validationErrorOf(() => limeRecommendation('missouri', { ph: 5.5, bufferMethod: 'mehlich', enmLbPerAcre: 800 }, 6.5)).field).toBe('bufferMethod');
    expect(validationErrorOf(() => limeRecommendation('ncdacs', { ph: 11, bufferPh: 6 }, 6.5)).field).toBe('ph');
    expect(validationErrorOf(() => limeRecommendation('ncdacs', { ph: 5.2 }, 6.5)).field).toBe('bufferPh');
  });
});

describe('lime by the University of Missouri ENM method', () => {
  it('divides the lab’s ENM recommendation by the lime’s ENM per ton', () => {
    expect(limeRecommendation('missouri', { ph: 5.2, enmLbPerAcre: 1600 }, 6.5, 400).tonsPerAcre).toBe(4); // University of Missouri: 1,600 ÷ 400 = 4 t/acre
    expect(limeRecommendation('missouri', { ph: 5.2, enmLbPerAcre: 1200, bufferMethod: 'woodruff' }, 6.5, 400).tonsPerAcre).toBe(3); // MU Extension: 1,200 ENM ÷ 400 = 3 tons
    expect(limeRecommendation('missouri', { ph: 6.8 }, 6.5).tonsPerAcre).toBe(0);
  });
});

describe('phosphate and potash (Tri-State build-up and maintenance)', () => {
  it('adds a quarter of the build-up to maintenance below the critical level', () => {
    // P 20 ppm Bray P1: (25 − 20) × 20 ÷ 4 = 25 + 40 brassica maintenance = 65 — critical 25 ppm for wheat/alfalfa
    // (Ohio State agBMPs citing Vitosh et al. 1995), 20 lb P2O5 per ppm and 4 years (Tri-State build-up); maintenance from memory.
    // K 90 ppm ammonium acetate, CEC unknown: critical 105 ppm (2020 Tri-State 120 ppm Mehlich-3 ÷ 1.14, Ohio State ANR-75):
    // (105 − 90) × 8 ÷ 4 = 30 + 60 = 90 — 8 lb K2O per ppm is the middle of Tri-State's 6–10
    const rec = nutrientRecommendation({ ph: 6, pPpm: 20, kPpm: 90 }, 'brassica');
    expect(rec.p2o5LbPerAcre).toBe(65);
    expect(rec.k2oLbPerAcre).toBe(90);
    expect(rec.source).toMatch(/Tri-State/);
    expect(rec.source).toMatch(/maintenance from memory/); // crop maintenance is still not from a table
    expect(rec.working).toMatch(/against 25 and 105 ppm/);
  });

  it('sets the K critical level by CEC (2020 Tri-State, on the ammonium-acetate basis)', () => {
    // 2020 Tri-State (Culman et al., OSU Bulletin 974): 100 ppm Mehlich-3 K at CEC ≤ 5, 120 ppm above; ÷ 1.14 (ANR-75) → 87.7 → 88 and 105.3 → 105
    expect(kCriticalPpm(4)).toBe(88);
    expect(kCriticalPpm(5)).toBe(88);
    expect(kCriticalPpm(5.1)).toBe(105);
    expect(kCriticalPpm(null)).toBe(105); // unknown CEC: the higher level
    // A sandy soil (CEC 4) at K 80: (88 − 80) × 8 ÷ 4 = 16 + 60 legume maintenance = 76; the same K on a CEC 12 silt loam: (105 − 80) × 8 ÷ 4 = 50 + 60 = 110
    expect(nutrientRecommendation({ ph: 6, kPpm: 80, cec: 4 }, 'legume').k2oLbPerAcre).toBe(76);
    expect(nutrientRecommendation({ ph: 6, kPpm: 80, cec: 12 }, 'legume').k2oLbPerAcre).toBe(110);
  });

  it('builds P at 20 lb P2O5 per ppm: the Tri-State figure', () => {
    // Legume, P 5 ppm, K at critical: (25 − 5) × 20 ÷ 4 = 100 + 30 maintenance = 130; K 105 → maintenance 60 only
    expect(nutrientRecommendation({ ph: 6, pPpm: 5, kPpm: 105 }, 'legume')).toMatchObject({ p2o5LbPerAcre: 130, k2oLbPerAcre: 60 });
  });

  it('drops everything at or above twice the critical level (P 50 ppm Bray P1: Ohio State agBMPs)', () => {
    expect(nutrientRecommendation({ ph: 6, pPpm: 80, kPpm: 400 }, 'legume')).toMatchObject({ p2o5LbPerAcre: 0, k2oLbPerAcre: 0 });
    expect(nutrientRecommendation({ ph: 6, pPpm: 50, kPpm: 150 }, 'legume').p2o5LbPerAcre).toBe(0);
    expect(nutrientRecommendation({ ph: 6, pPpm: 49, kPpm: 150 }, 'legume').p2o5LbPerAcre).toBe(30); // maintenance only
  });

  it('groups crops by what they sow and dates the retest', () => {
    expect(cropGroupOf(['white clover', 'forage chicory'])).toBe('legume');
    expect(cropGroupOf(['forage radish', 'turnip'])).toBe('brassica');
    expect(retestDue('2025-03-14')).toBe('2028-03-14'); // default 3 years (common practice, no source)
    expect(retestDue('2024-02-29', 3)).toBe('2027-02-28');
  });
});

describe('Mehlich-3 results put on the Tri-State basis (Ohio State ANR-75)', () => {
  it('divides Mehlich-3 P by 1.35 and K by 1.14: a worked example', () => {
    // ANR-75 (Culman et al. 2019): Mehlich-3 P is 35 % higher than Bray P, Mehlich-3 K 14 % higher than ammonium-acetate K.
    // Worked by hand: M3 P 27 ppm ÷ 1.35 = 20.0 Bray P1; M3 K 114 ppm ÷ 1.14 = 100.0 ppm ammonium-acetate K.
    expect(toTriStateBasis({ pPpm: 27, kPpm: 114, labMethod: 'mehlich-3' })).toEqual({ pPpm: 20, kPpm: 100, converted: true });
    // M3 P 40 ÷ 1.35 = 29.63 → 29.6; M3 K 150 ÷ 1.14 = 131.58 → 131.6 (rounded to 0.1 ppm)
    expect(toTriStateBasis({ pPpm: 40, kPpm: 150, labMethod: 'mehlich-3' })).toEqual({ pPpm: 29.6, kPpm: 131.6, converted: true });
    // Bray/ammonium-acetate readings, or no method given, pass unchanged
    expect(toTriStateBasis({ pPpm: 27, kPpm: 114, labMethod: 'bray-nh4oac' })).toEqual({ pPpm: 27, kPpm: 114, converted: false });
    expect(toTriStateBasis({ pPpm: 27, kPpm: null })).toEqual({ pPpm: 27, kPpm: null, converted: false });
  });

  it('works the rules on the converted values, saying so', () => {
    // Brassica, Mehlich-3 P 27, K 114 → Bray 20, AA 100 (above): P (25 − 20) × 20 ÷ 4 + 40 = 65; K (105 − 100) × 8 ÷ 4 + 60 = 70.
    // Read unconverted the same numbers would give P 27 ≥ 25 → 40 and K 114 ≥ 105 → 60: the conversion changes the answer.
    const m3 = nutrientRecommendation({ ph: 6, pPpm: 27, kPpm: 114, labMethod: 'mehlich-3' }, 'brassica');
    expect(m3).toMatchObject({ p2o5LbPerAcre: 65, k2oLbPerAcre: 70 });
    expect(m3.working).toMatch(/Mehlich-3 P 27, K 114 ppm = Bray P1 20, ammonium-acetate K 100 ppm/);
    expect(m3.source).toMatch(/ANR-75/);
    expect(nutrientRecommendation({ ph: 6, pPpm: 27, kPpm: 114 }, 'brassica')).toMatchObject({ p2o5LbPerAcre: 40, k2oLbPerAcre: 60 });
  });
});

describe('target pH by crop group', () => {
  it('names its source beside each value', () => {
    // Tri-State (Vitosh et al. 1995, MSU E-2567) Table 1: small grains 6.0 over a subsoil above pH 6
    expect(TARGET_PH.grain).toMatchObject({ ph: 6.0, source: expect.stringMatching(/Tri-State.*Table 1/) });
    // Univ. of Kentucky AGR-33: red clover 6.1–6.7; Tri-State Table 1: alfalfa 6.5 over a subsoil above pH 6
    expect(TARGET_PH.legume).toMatchObject({ ph: 6.5, source: expect.stringMatching(/AGR-33.*Tri-State/) });
    expect(TARGET_PH.brassica!.source).toMatch(/^from memory/);
    expect(TARGET_PH['native-grass']!.source).toMatch(/^from memory/);
    const rec = recommendSoilTest({ ph: 5.5, enmLbPerAcre: 800 }, { method: 'missouri', cropGroup: 'grain', limeEnmLbPerTon: 400 });
    expect(rec.lime.source).toMatch(/target pH 6 \(Tri-State/);
  });
});
