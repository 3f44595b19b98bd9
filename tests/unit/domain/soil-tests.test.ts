import { describe, expect, it } from 'vitest';
import { checkBufferMethod, cropGroupOf, limeRecommendation, ncdacsAcidity, ncdacsLimeTonsPerAcre, nutrientRecommendation, retestDue } from '../../../shared/domain/soil-tests';
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
    // (Ohio State agBMPs citing Vitosh et al. 1995), 20 lb P2O5 per ppm and 4 years (Tri-State build-up);
    // K 110 ppm: (150 − 110) × 8 ÷ 4 = 80 + 60 = 140 — 8 lb K2O per ppm is the middle of Tri-State's 6–10; 150 ppm and maintenance from memory
    const rec = nutrientRecommendation({ ph: 6, pPpm: 20, kPpm: 110 }, 'brassica');
    expect(rec.p2o5LbPerAcre).toBe(65);
    expect(rec.k2oLbPerAcre).toBe(140);
    expect(rec.source).toMatch(/Tri-State/);
    expect(rec.source).toMatch(/from memory/); // the K critical level and maintenance are still not from a table
  });

  it('builds P at 20 lb P2O5 per ppm: the Tri-State figure', () => {
    // Legume, P 5 ppm, K at critical: (25 − 5) × 20 ÷ 4 = 100 + 30 maintenance = 130; K 150 → maintenance 60 only
    expect(nutrientRecommendation({ ph: 6, pPpm: 5, kPpm: 150 }, 'legume')).toMatchObject({ p2o5LbPerAcre: 130, k2oLbPerAcre: 60 });
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
