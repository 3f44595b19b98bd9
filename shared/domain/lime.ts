/**
 * Lime: tons per acre from a soil-test recommendation, either given directly or as an ENM
 * (effective neutralizing material) recommendation divided by the product's ENM guarantee per ton
 * (University of Missouri: 1,600 lb ENM/acre ÷ 400 lb ENM/ton = 4 t/acre), then totals and cost.
 */
import { DomainValidationError } from './errors';
import { SQ_FT_PER_ACRE } from '../units';
import { LINE_QUANTITY_DECIMALS, lineAmountCents, packagesFor, roundHalfUp } from './rounding';
import { requireCents, requireNumber } from './validation';

export const LB_PER_TON = 2000;
/** Highest lime rate accepted, t/acre; soil-test recommendations rarely exceed 6. */
export const MAX_LIME_TONS_PER_ACRE = 20;

/** A lime recommendation: tons/acre directly, or ENM lb/acre with the product's ENM per ton. */
export type LimeRecommendation =
  | { tonsPerAcre: number }
  | { enmLbPerAcre: number; productEnmLbPerTon: number };

/** How lime is bought: by the ton (usually spread) or in bags (pelletized, small plots). */
export type LimePricing =
  | { basis: 'per-ton'; pricePerTonCents: number }
  | { basis: 'bag'; bagSizeLb: number; bagPriceCents: number };

export interface LimeInput {
  acres: number;
  recommendation: LimeRecommendation;
  pricing: LimePricing;
}

export interface LimeResult {
  tonsPerAcre: number;
  lbPer1000SqFt: number;
  limeTons: number;
  limeLb: number;
  /** Bags to buy when priced by the bag, else null. */
  bags: number | null;
  leftoverLb: number | null;
  costCents: number;
}

/** Tons of lime per acre from an ENM recommendation and the product's ENM guarantee per ton. */
export function limeTonsPerAcreFromEnm(enmLbPerAcre: number, productEnmLbPerTon: number): number {
  requireNumber('enmLbPerAcre', enmLbPerAcre, { label: 'ENM recommendation', unit: 'lb ENM/acre', min: 0, max: 40000 });
  requireNumber('productEnmLbPerTon', productEnmLbPerTon, {
    label: 'ENM guarantee of the lime',
    unit: 'lb ENM/ton',
    min: 0,
    minExclusive: true,
    max: 4000,
  });
  return enmLbPerAcre / productEnmLbPerTon;
}

/** Tons per acre of a lime recommendation (direct or ENM-based), checked for impossible values. */
export function limeTonsPerAcre(recommendation: LimeRecommendation): number {
  let tonsPerAcre: number;
  if ('tonsPerAcre' in recommendation) {
    tonsPerAcre = recommendation.tonsPerAcre;
  } else if ('enmLbPerAcre' in recommendation) {
    tonsPerAcre = limeTonsPerAcreFromEnm(recommendation.enmLbPerAcre, recommendation.productEnmLbPerTon);
  } else {
    throw new DomainValidationError('recommendation', 'Give lime either as tons per acre or as an ENM recommendation with the product ENM per ton.');
  }
  return requireNumber('tonsPerAcre', tonsPerAcre, {
    label: 'Lime rate',
    unit: 't/acre',
    min: 0,
    max: MAX_LIME_TONS_PER_ACRE,
  });
}

/** Convert tons per acre to pounds per 1,000 ft² (1 t/acre = 2,000 ÷ 43.56 ≈ 45.9 lb/1,000 ft²). */
export function tonsPerAcreToLbPer1000SqFt(tonsPerAcre: number): number {
  return (tonsPerAcre * LB_PER_TON * 1000) / SQ_FT_PER_ACRE;
}

/** Validate how lime is priced; throws DomainValidationError. */
export function validateLimePricing(pricing: LimePricing, field = 'pricing'): void {
  if (pricing.basis === 'per-ton') {
    requireCents(`${field}.pricePerTonCents`, pricing.pricePerTonCents, 'Lime price per ton');
  } else if (pricing.basis === 'bag') {
    requireNumber(`${field}.bagSizeLb`, pricing.bagSizeLb, { label: 'Lime bag size', unit: 'lb', min: 0, minExclusive: true, max: 4000 });
    requireCents(`${field}.bagPriceCents`, pricing.bagPriceCents, 'Lime bag price');
  } else {
    throw new DomainValidationError(`${field}.basis`, 'Lime pricing must be "per-ton" or "bag".');
  }
}

/** Lime tons per acre, total tons over the acres, bags if bagged, and cost (per-ton cost rounds the line once, half up, on tons to 2 decimals). */
export function computeLime(input: LimeInput): LimeResult {
  const acres = requireNumber('acres', input.acres, { label: 'Acres', unit: 'acres', min: 0 });
  const tonsPerAcre = limeTonsPerAcre(input.recommendation);
  validateLimePricing(input.pricing);
  const limeTons = tonsPerAcre * acres;
  const limeLb = limeTons * LB_PER_TON;
  const base = { tonsPerAcre, lbPer1000SqFt: tonsPerAcreToLbPer1000SqFt(tonsPerAcre), limeTons, limeLb };
  if (input.pricing.basis === 'per-ton') {
    const billedTons = roundHalfUp(limeTons, LINE_QUANTITY_DECIMALS);
    return { ...base, bags: null, leftoverLb: null, costCents: lineAmountCents(billedTons, input.pricing.pricePerTonCents) };
  }
  const { packages, leftover } = packagesFor(limeLb, input.pricing.bagSizeLb);
  return { ...base, bags: packages, leftoverLb: leftover, costCents: packages * input.pricing.bagPriceCents };
}
