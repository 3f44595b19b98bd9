/**
 * Fertilizer: product pounds from a nutrient recommendation (lb N, P2O5, K2O per acre) and a
 * product grade such as 13-13-13. Product lb = nutrient lb ÷ (grade % / 100) (standard formula:
 * 5 lb N from 35-0-0 → 14.3 lb). With several nutrients, the product rate is set by the limiting
 * nutrient (the largest need ÷ grade fraction), which over-supplies the others; a needed nutrient
 * the grade lacks is reported unmet, to be met by another application.
 */
import { DomainValidationError } from './errors';
import { packagesFor } from './rounding';
import { requireCents, requireNumber } from './validation';

export type Nutrient = 'n' | 'p2o5' | 'k2o';
export const NUTRIENTS: readonly Nutrient[] = ['n', 'p2o5', 'k2o'];
export const NUTRIENT_LABELS: Record<Nutrient, string> = { n: 'N', p2o5: 'P2O5', k2o: 'K2O' };

/** Guaranteed analysis in percent by weight. */
export interface FertilizerGrade {
  nPct: number;
  p2o5Pct: number;
  k2oPct: number;
}

/** A nutrient recommendation in pounds per acre. */
export interface NutrientNeed {
  nLbPerAcre: number;
  p2o5LbPerAcre: number;
  k2oLbPerAcre: number;
}

export type NutrientAmounts = Record<Nutrient, number>;

/** Highest single-nutrient recommendation accepted, lb/acre. */
export const MAX_NUTRIENT_LB_PER_ACRE = 500;

const GRADE_FIELDS: Record<Nutrient, keyof FertilizerGrade> = { n: 'nPct', p2o5: 'p2o5Pct', k2o: 'k2oPct' };
const NEED_FIELDS: Record<Nutrient, keyof NutrientNeed> = { n: 'nLbPerAcre', p2o5: 'p2o5LbPerAcre', k2o: 'k2oLbPerAcre' };

/** Validate a grade: each value 0–100 and the sum at most 100; throws DomainValidationError naming the field. */
export function validateFertilizerGrade(grade: FertilizerGrade, field = 'grade'): void {
  for (const nutrient of NUTRIENTS) {
    requireNumber(`${field}.${GRADE_FIELDS[nutrient]}`, grade[GRADE_FIELDS[nutrient]], {
      label: `${NUTRIENT_LABELS[nutrient]} in the grade`,
      unit: '%',
      min: 0,
      max: 100,
    });
  }
  const sum = grade.nPct + grade.p2o5Pct + grade.k2oPct;
  if (sum > 100) {
    throw new DomainValidationError(
      field,
      `A fertilizer grade cannot add up to more than 100 % (${formatGrade(grade)} adds up to ${sum} %). Check the bag's analysis.`,
    );
  }
}

/** Parse a grade written "N-P-K", e.g. "13-13-13" or "46-0-0". */
export function parseFertilizerGrade(text: string, field = 'grade'): FertilizerGrade {
  const match = /^\s*(\d+(?:\.\d+)?)\s*-\s*(\d+(?:\.\d+)?)\s*-\s*(\d+(?:\.\d+)?)\s*$/.exec(text ?? '');
  if (!match) {
    throw new DomainValidationError(field, `Write the grade as three numbers N-P-K, like 13-13-13 (got ${JSON.stringify(text)}).`);
  }
  const grade = { nPct: Number(match[1]), p2o5Pct: Number(match[2]), k2oPct: Number(match[3]) };
  validateFertilizerGrade(grade, field);
  return grade;
}

/** Format a grade as "13-13-13". */
export function formatGrade(grade: FertilizerGrade): string {
  return `${grade.nPct}-${grade.p2o5Pct}-${grade.k2oPct}`;
}

/** Validate a nutrient recommendation (each 0–500 lb/acre); throws DomainValidationError. */
export function validateNutrientNeed(need: NutrientNeed, field = 'need'): void {
  for (const nutrient of NUTRIENTS) {
    requireNumber(`${field}.${NEED_FIELDS[nutrient]}`, need[NEED_FIELDS[nutrient]], {
      label: `${NUTRIENT_LABELS[nutrient]} recommendation`,
      unit: 'lb/acre',
      min: 0,
      max: MAX_NUTRIENT_LB_PER_ACRE,
    });
  }
}

/** Pounds of product that carry `nutrientLb` pounds of a nutrient at `gradePct` percent. */
export function productLbForNutrient(nutrientLb: number, gradePct: number): number {
  requireNumber('nutrientLb', nutrientLb, { label: 'Nutrient pounds', unit: 'lb', min: 0 });
  requireNumber('gradePct', gradePct, { label: 'Grade percent', unit: '%', min: 0, minExclusive: true, max: 100 });
  return nutrientLb / (gradePct / 100);
}

export interface FertilizerRateResult {
  productLbPerAcre: number;
  /** The nutrient that sets the rate; null when nothing the grade carries is needed. */
  limitingNutrient: Nutrient | null;
  suppliedLbPerAcre: NutrientAmounts;
  /** Supplied beyond the need, for each nutrient. */
  surplusLbPerAcre: NutrientAmounts;
  /** Needed nutrients the grade does not carry at all. */
  unmetNutrients: Nutrient[];
  unmetLbPerAcre: NutrientAmounts;
}

/** Product lb/acre that meets the limiting nutrient, with surpluses and nutrients the grade cannot supply. */
export function fertilizerProductLbPerAcre(need: NutrientNeed, grade: FertilizerGrade): FertilizerRateResult {
  validateNutrientNeed(need);
  validateFertilizerGrade(grade);
  let productLbPerAcre = 0;
  let limitingNutrient: Nutrient | null = null;
  const unmetNutrients: Nutrient[] = [];
  for (const nutrient of NUTRIENTS) {
    const needLb = need[NEED_FIELDS[nutrient]];
    const pct = grade[GRADE_FIELDS[nutrient]];
    if (needLb <= 0) continue;
    if (pct <= 0) {
      unmetNutrients.push(nutrient);
      continue;
    }
    const lb = productLbForNutrient(needLb, pct);
    if (lb > productLbPerAcre) {
      productLbPerAcre = lb;
      limitingNutrient = nutrient;
    }
  }
  const suppliedLbPerAcre = {} as NutrientAmounts;
  const surplusLbPerAcre = {} as NutrientAmounts;
  const unmetLbPerAcre = {} as NutrientAmounts;
  for (const nutrient of NUTRIENTS) {
    const needLb = need[NEED_FIELDS[nutrient]];
    const supplied = (productLbPerAcre * grade[GRADE_FIELDS[nutrient]]) / 100;
    suppliedLbPerAcre[nutrient] = supplied;
    surplusLbPerAcre[nutrient] = Math.max(0, supplied - needLb);
    unmetLbPerAcre[nutrient] = Math.max(0, needLb - supplied);
  }
  return { productLbPerAcre, limitingNutrient, suppliedLbPerAcre, surplusLbPerAcre, unmetNutrients, unmetLbPerAcre };
}

export interface FertilizerInput {
  acres: number;
  need: NutrientNeed;
  grade: FertilizerGrade;
  bagSizeLb: number;
  bagPriceCents: number;
}

export interface FertilizerResult extends FertilizerRateResult {
  fertilizerProductLb: number;
  bagSizeLb: number;
  bags: number;
  leftoverLb: number;
  costCents: number;
}

/** Product pounds over the acres, bags to buy (rounded up), leftover and cost of one fertilizer application. */
export function computeFertilizer(input: FertilizerInput): FertilizerResult {
  const acres = requireNumber('acres', input.acres, { label: 'Acres', unit: 'acres', min: 0 });
  requireNumber('bagSizeLb', input.bagSizeLb, { label: 'Fertilizer bag size', unit: 'lb', min: 0, minExclusive: true, max: 4000 });
  requireCents('bagPriceCents', input.bagPriceCents, 'Fertilizer bag price');
  const rate = fertilizerProductLbPerAcre(input.need, input.grade);
  const fertilizerProductLb = rate.productLbPerAcre * acres;
  const { packages, leftover } = packagesFor(fertilizerProductLb, input.bagSizeLb);
  return {
    ...rate,
    fertilizerProductLb,
    bagSizeLb: input.bagSizeLb,
    bags: packages,
    leftoverLb: leftover,
    costCents: packages * input.bagPriceCents,
  };
}
