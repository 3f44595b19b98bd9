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

describe('phosphate and potash (from memory)', () => {
  it('adds a quarter of the build-up to maintenance below the critical level', () => {
    // P 20 ppm: (30 − 20) × 18 ÷ 4 = 45 + 40 brassica maintenance = 85; K 110: (150 − 110) × 8 ÷ 4 = 80 + 60 = 140 (rules from memory)
    const rec = nutrientRecommendation({ ph: 6, pPpm: 20, kPpm: 110 }, 'brassica');
    expect(rec.p2o5LbPerAcre).toBe(85);
    expect(rec.k2oLbPerAcre).toBe(140);
    expect(rec.source).toMatch(/from memory/);
  });

  it('drops everything well above the critical level', () => {
    expect(nutrientRecommendation({ ph: 6, pPpm: 80, kPpm: 400 }, 'legume')).toMatchObject({ p2o5LbPerAcre: 0, k2oLbPerAcre: 0 });
  });

  it('groups crops by what they sow and dates the retest', () => {
    expect(cropGroupOf(['white clover', 'forage chicory'])).toBe('legume');
    expect(cropGroupOf(['forage radish', 'turnip'])).toBe('brassica');
    expect(retestDue('2025-03-14')).toBe('2028-03-14'); // default 3 years (common practice, no source)
    expect(retestDue('2024-02-29', 3)).toBe('2027-02-28');
  });
});
