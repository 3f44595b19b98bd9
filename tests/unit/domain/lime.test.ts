import { describe, expect, it } from 'vitest';
import { computeLime, limeTonsPerAcre, limeTonsPerAcreFromEnm, tonsPerAcreToLbPer1000SqFt } from '../../../shared/domain/lime';
import { validationErrorOf } from './support';

describe('lime rate', () => {
  it('divides the ENM recommendation by the product ENM guarantee (University of Missouri)', () => {
    expect(limeTonsPerAcreFromEnm(1600, 400)).toBe(4); // University of Missouri: 1,600 ÷ 400 = 4 t/acre
    expect(limeTonsPerAcre({ enmLbPerAcre: 1600, productEnmLbPerTon: 400 })).toBe(4); // same source
    expect(limeTonsPerAcre({ tonsPerAcre: 2.5 })).toBe(2.5);
  });

  it('converts tons per acre to pounds per 1,000 ft²', () => {
    expect(tonsPerAcreToLbPer1000SqFt(1)).toBeCloseTo(45.9, 1); // 1 t/acre = 45.9 lb/1,000 ft² (derived: 2,000 ÷ 43.56)
    expect(tonsPerAcreToLbPer1000SqFt(4)).toBeCloseTo(183.65, 2); // derived
  });

  it('totals tons over the acres and prices them per ton', () => {
    const result = computeLime({ acres: 2.5, recommendation: { enmLbPerAcre: 1600, productEnmLbPerTon: 400 }, pricing: { basis: 'per-ton', pricePerTonCents: 4800 } });
    expect(result.limeTons).toBe(10); // 4 t/acre (University of Missouri) × 2.5 acres
    expect(result.limeLb).toBe(20000);
    expect(result.costCents).toBe(48000);
    expect(result.bags).toBeNull();
  });

  it('bills tons rounded to 2 decimals, then rounds the amount once, half up', () => {
    // 0.37 acre × 1.5 t/acre = 0.555 t → billed 0.56 t × $48.00 = $26.88 (worked example of the documented rule)
    const result = computeLime({ acres: 0.37, recommendation: { tonsPerAcre: 1.5 }, pricing: { basis: 'per-ton', pricePerTonCents: 4800 } });
    expect(result.limeTons).toBeCloseTo(0.555, 10);
    expect(result.costCents).toBe(2688);
  });

  it('rounds bagged lime up to whole bags with the leftover', () => {
    // 0.33 acre × 1 t/acre = 660 lb → 17 × 40-lb bags, 20 lb left (worked example)
    const result = computeLime({ acres: 0.33, recommendation: { tonsPerAcre: 1 }, pricing: { basis: 'bag', bagSizeLb: 40, bagPriceCents: 800 } });
    expect(result.limeLb).toBeCloseTo(660, 9);
    expect(result.bags).toBe(17);
    expect(result.leftoverLb).toBeCloseTo(20, 9);
    expect(result.costCents).toBe(13600);
  });

  it('rejects a zero ENM guarantee, absurd rates and unknown pricing', () => {
    expect(validationErrorOf(() => limeTonsPerAcreFromEnm(1600, 0)).field).toBe('productEnmLbPerTon');
    const absurd = validationErrorOf(() => limeTonsPerAcre({ tonsPerAcre: 25 }));
    expect(absurd.field).toBe('tonsPerAcre');
    expect(absurd.message).toMatch(/between 0 and 20 t\/acre/);
    expect(validationErrorOf(() => limeTonsPerAcre({ tonsPerAcre: -1 })).field).toBe('tonsPerAcre');
    expect(validationErrorOf(() => computeLime({ acres: 1, recommendation: { tonsPerAcre: 1 }, pricing: { basis: 'bag', bagSizeLb: 0, bagPriceCents: 800 } })).field).toBe('pricing.bagSizeLb');
  });
});
