import { describe, expect, it } from 'vitest';
import {
  computeFertilizer,
  fertilizerProductLbPerAcre,
  parseFertilizerGrade,
  productLbForNutrient,
  validateFertilizerGrade,
} from '../../../shared/domain/fertilizer';
import { validationErrorOf } from './support';

const grade = (n: number, p: number, k: number) => ({ nPct: n, p2o5Pct: p, k2oPct: k });
const need = (n: number, p: number, k: number) => ({ nLbPerAcre: n, p2o5LbPerAcre: p, k2oLbPerAcre: k });

describe('fertilizer product from a nutrient need', () => {
  it('divides the nutrient pounds by the grade fraction (standard formula)', () => {
    expect(productLbForNutrient(5, 35)).toBeCloseTo(14.3, 1); // 5 lb N from 35-0-0 → 14.3 lb (standard formula)
    expect(productLbForNutrient(15, 21)).toBeCloseTo(71.4, 1); // 15 lb N from 21-0-0 → 71.4 lb (standard formula)
    expect(fertilizerProductLbPerAcre(need(5, 0, 0), grade(35, 0, 0)).productLbPerAcre).toBeCloseTo(14.3, 1); // same check through the full function
  });

  it('meets the limiting nutrient and reports the surplus of the others', () => {
    // 40-40-60 lb/acre from 13-13-13: K2O limits at 60 ÷ 0.13 = 461.5 lb/acre, oversupplying N and P2O5 by 20 lb (standard formula)
    const r = fertilizerProductLbPerAcre(need(40, 40, 60), grade(13, 13, 13));
    expect(r.limitingNutrient).toBe('k2o');
    expect(r.productLbPerAcre).toBeCloseTo(461.54, 2);
    expect(r.surplusLbPerAcre.n).toBeCloseTo(20, 9);
    expect(r.surplusLbPerAcre.p2o5).toBeCloseTo(20, 9);
    expect(r.surplusLbPerAcre.k2o).toBeCloseTo(0, 9);
    expect(r.unmetNutrients).toEqual([]);
  });

  it('reports a needed nutrient the grade lacks as unmet', () => {
    // 40 lb N from urea 46-0-0 = 86.96 lb/acre (standard formula); the 20 lb P2O5 asked for is not supplied
    const r = fertilizerProductLbPerAcre(need(40, 20, 0), grade(46, 0, 0));
    expect(r.productLbPerAcre).toBeCloseTo(86.96, 2);
    expect(r.unmetNutrients).toEqual(['p2o5']);
    expect(r.unmetLbPerAcre.p2o5).toBe(20);
    expect(r.unmetLbPerAcre.n).toBeCloseTo(0, 9);
  });

  it('applies nothing when the grade carries none of the needed nutrients', () => {
    const r = fertilizerProductLbPerAcre(need(30, 0, 0), grade(0, 20, 20));
    expect(r.productLbPerAcre).toBe(0);
    expect(r.limitingNutrient).toBeNull();
    expect(r.unmetNutrients).toEqual(['n']);
  });

  it('rounds up to whole bags with the leftover and cost', () => {
    // 40 lb N/acre from 13-13-13 on 2.4 acres: 307.69 lb/acre × 2.4 = 738.46 lb → 15 × 50-lb bags, 11.54 lb left (standard formula)
    const r = computeFertilizer({ acres: 2.4, need: need(40, 40, 40), grade: grade(13, 13, 13), bagSizeLb: 50, bagPriceCents: 2600 });
    expect(r.fertilizerProductLb).toBeCloseTo(738.46, 2);
    expect(r.bags).toBe(15);
    expect(r.leftoverLb).toBeCloseTo(11.54, 2);
    expect(r.costCents).toBe(39000);
  });
});

describe('fertilizer grades', () => {
  it('parses N-P-K text', () => {
    expect(parseFertilizerGrade('13-13-13')).toEqual(grade(13, 13, 13));
    expect(parseFertilizerGrade(' 46 - 0 - 0 ')).toEqual(grade(46, 0, 0));
  });

  it('rejects grades over 100 %, negative values and bad text, naming the field', () => {
    const over = validationErrorOf(() => validateFertilizerGrade(grade(60, 30, 20)));
    expect(over.field).toBe('grade');
    expect(over.message).toMatch(/more than 100 %/);
    expect(validationErrorOf(() => validateFertilizerGrade(grade(-1, 0, 0))).field).toBe('grade.nPct');
    expect(validationErrorOf(() => parseFertilizerGrade('13-13')).field).toBe('grade');
    expect(validationErrorOf(() => fertilizerProductLbPerAcre(need(900, 0, 0), grade(13, 13, 13))).field).toBe('need.nLbPerAcre');
    expect(validationErrorOf(() => computeFertilizer({ acres: 1, need: need(10, 0, 0), grade: grade(10, 10, 10), bagSizeLb: 0, bagPriceCents: 100 })).field).toBe('bagSizeLb');
  });
});
