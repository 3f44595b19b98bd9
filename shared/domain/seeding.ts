/**
 * Seed quantities: pure live seed (PLS), bulk pounds, broadcast vs drilled rates, and the
 * packages to buy for a mix of species over a unit's acres.
 *
 * PLS fraction = purity × germination (TxDOT "Pure live seed"; LSU AgCenter); where a seed lab
 * reports dormant or hard seed, it counts as live: purity × (germination + dormant) (Allamakee
 * SWCD, Iowa). Bulk lb = PLS lb ÷ PLS fraction.
 */
import { DomainValidationError } from './errors';
import { packagesFor } from './rounding';
import { requireCents, requireNumber, requireText } from './validation';

/** A seed lot's tag values, in percent (0–100). */
export interface SeedLot {
  purityPct: number;
  germinationPct: number;
  /** Dormant or hard seed, counted as live (optional, default 0). */
  dormantPct?: number;
}

export type SeedRateBasis = 'bulk' | 'pls';
export type SeedingMethod = 'broadcast' | 'drilled';

/** UGA Extension: broadcasting needs about 25–30 % more seed than drilling. */
export const UGA_BROADCAST_EXTRA_SEED_PCT = { min: 25, max: 30 } as const;
/** Broadcast ÷ drilled seed ratio used when a rate must be converted and no factor is given (UGA lower end). */
export const DEFAULT_BROADCAST_FACTOR = 1 + UGA_BROADCAST_EXTRA_SEED_PCT.min / 100;
/** Highest seeding rate accepted, lb/acre; above this the value is almost surely a typo. */
export const MAX_SEED_RATE_LB_PER_ACRE = 400;

/** Validate a seed lot's purity, germination and dormant seed; throws DomainValidationError. */
export function validateSeedLot(lot: SeedLot, field = 'seedLot'): void {
  requireNumber(`${field}.purityPct`, lot.purityPct, { label: 'Purity', unit: '%', min: 0, max: 100 });
  requireNumber(`${field}.germinationPct`, lot.germinationPct, { label: 'Germination', unit: '%', min: 0, max: 100 });
  const dormantPct = lot.dormantPct ?? 0;
  requireNumber(`${field}.dormantPct`, dormantPct, { label: 'Dormant (hard) seed', unit: '%', min: 0, max: 100 });
  if (lot.germinationPct + dormantPct > 100) {
    throw new DomainValidationError(
      `${field}.dormantPct`,
      `Germination plus dormant seed cannot exceed 100 % (got ${lot.germinationPct} + ${dormantPct}). Check the seed tag.`,
    );
  }
}

/** PLS fraction (0–1) of a seed lot: purity × (germination + dormant seed). */
export function plsFraction(lot: SeedLot, field = 'seedLot'): number {
  validateSeedLot(lot, field);
  return (lot.purityPct / 100) * ((lot.germinationPct + (lot.dormantPct ?? 0)) / 100);
}

/** PLS as a percent (0–100) of a seed lot. */
export function plsPercent(lot: SeedLot, field = 'seedLot'): number {
  return plsFraction(lot, field) * 100;
}

function requireLiveSeed(lot: SeedLot, field: string): number {
  const fraction = plsFraction(lot, field);
  if (fraction === 0) {
    throw new DomainValidationError(
      field,
      'This seed lot has no live seed (purity or germination is 0 %), so no amount of it meets a PLS rate.',
    );
  }
  return fraction;
}

/** Bulk pounds needed per pound of PLS: 1 ÷ PLS fraction. */
export function bulkLbPerPlsLb(lot: SeedLot, field = 'seedLot'): number {
  return 1 / requireLiveSeed(lot, field);
}

/** Bulk pounds that carry `plsLb` pounds of pure live seed. */
export function bulkLbFromPlsLb(plsLb: number, lot: SeedLot, field = 'seedLot'): number {
  requireNumber('plsLb', plsLb, { label: 'PLS pounds', unit: 'lb', min: 0 });
  return plsLb / requireLiveSeed(lot, field);
}

/** Pounds of pure live seed in `bulkLb` pounds of a seed lot. */
export function plsLbFromBulkLb(bulkLb: number, lot: SeedLot, field = 'seedLot'): number {
  requireNumber('bulkLb', bulkLb, { label: 'Bulk pounds', unit: 'lb', min: 0 });
  return bulkLb * plsFraction(lot, field);
}

/** Broadcast ÷ drilled factor from the extra seed broadcasting needs, in percent (UGA: 25–30). */
export function broadcastFactorFromExtraPct(extraPct: number): number {
  requireNumber('broadcastExtraPct', extraPct, { label: 'Extra seed for broadcasting', unit: '%', min: 0, max: 100 });
  return 1 + extraPct / 100;
}

/**
 * Multiplier turning a rate written for `rateMethod` into a rate for `method`:
 * 1 when they match; × factor from drilled to broadcast; ÷ factor from broadcast to drilled.
 */
export function methodRateMultiplier(method: SeedingMethod, rateMethod: SeedingMethod, broadcastFactor?: number): number {
  if (method === rateMethod) return 1;
  const factor = broadcastFactor ?? DEFAULT_BROADCAST_FACTOR;
  requireNumber('broadcastFactor', factor, { label: 'Broadcast factor', min: 1, max: 2 });
  return method === 'broadcast' ? factor : 1 / factor;
}

export interface SeedMixComponentInput {
  species: string;
  /** Seeding rate per acre, in bulk lb or lb PLS according to `rateBasis`. */
  rateLbPerAcre: number;
  rateBasis: SeedRateBasis;
  /** Required for a PLS rate; optional for a bulk rate (then PLS pounds are reported too). */
  seedLot?: SeedLot;
  packageSizeLb: number;
  packagePriceCents: number;
}

export interface SeedMixInput {
  acres: number;
  /** How the seed goes in (default 'broadcast'). */
  method?: SeedingMethod;
  /** The method the rates are written for (default 'broadcast': the published food-plot rates are broadcast rates). */
  rateMethod?: SeedingMethod;
  /** Broadcast ÷ drilled seed ratio; used only when `method` differs from `rateMethod` (default 1.25, UGA). */
  broadcastFactor?: number;
  components: SeedMixComponentInput[];
}

export interface SeedMixComponentResult {
  species: string;
  rateBasis: SeedRateBasis;
  rateLbPerAcre: number;
  /** PLS lb/acre after the method adjustment; null when the lot's tag values are unknown. */
  plsLbPerAcre: number | null;
  bulkLbPerAcre: number;
  bulkSeedLb: number;
  plsSeedLb: number | null;
  packageSizeLb: number;
  packages: number;
  leftoverLb: number;
  packagePriceCents: number;
  costCents: number;
}

export interface SeedMixResult {
  acres: number;
  method: SeedingMethod;
  rateMethod: SeedingMethod;
  /** Multiplier applied to every rate for the seeding method (1 when none). */
  methodMultiplier: number;
  components: SeedMixComponentResult[];
  bulkLbPerAcre: number;
  bulkSeedLb: number;
  packages: number;
  costCents: number;
}

/** Validate one mix component's rate, lot and package; throws DomainValidationError. */
export function validateSeedMixComponent(component: SeedMixComponentInput, field = 'component'): void {
  requireText(`${field}.species`, component.species, 'Species');
  requireNumber(`${field}.rateLbPerAcre`, component.rateLbPerAcre, {
    label: `Seeding rate of ${component.species}`,
    unit: 'lb/acre',
    min: 0,
    minExclusive: true,
    max: MAX_SEED_RATE_LB_PER_ACRE,
  });
  if (component.rateBasis !== 'bulk' && component.rateBasis !== 'pls') {
    throw new DomainValidationError(`${field}.rateBasis`, `Rate basis must be "bulk" or "pls" (got ${JSON.stringify(component.rateBasis)}).`);
  }
  if (component.rateBasis === 'pls' && !component.seedLot) {
    throw new DomainValidationError(
      `${field}.seedLot`,
      `A PLS rate for ${component.species} needs the seed tag's purity and germination to work out bulk pounds.`,
    );
  }
  if (component.seedLot) validateSeedLot(component.seedLot, `${field}.seedLot`);
  requireNumber(`${field}.packageSizeLb`, component.packageSizeLb, {
    label: `Package size of ${component.species}`,
    unit: 'lb',
    min: 0,
    minExclusive: true,
    max: 5000,
  });
  requireCents(`${field}.packagePriceCents`, component.packagePriceCents, `Package price of ${component.species}`);
}

function requireMethod(field: string, value: string): SeedingMethod {
  if (value !== 'broadcast' && value !== 'drilled') {
    throw new DomainValidationError(field, `Seeding method must be "broadcast" or "drilled" (got ${JSON.stringify(value)}).`);
  }
  return value;
}

/** Bulk lb/acre, total pounds, packages, leftovers and cost of each species of a seed mix over `acres`. */
export function computeSeedMix(input: SeedMixInput): SeedMixResult {
  const acres = requireNumber('acres', input.acres, { label: 'Acres', unit: 'acres', min: 0 });
  const method = requireMethod('method', input.method ?? 'broadcast');
  const rateMethod = requireMethod('rateMethod', input.rateMethod ?? 'broadcast');
  const methodMultiplier = methodRateMultiplier(method, rateMethod, input.broadcastFactor);
  if (!Array.isArray(input.components) || input.components.length === 0) {
    throw new DomainValidationError('components', 'A seeding needs at least one species with a rate.');
  }
  const components = input.components.map((component, index): SeedMixComponentResult => {
    const field = `components[${index}]`;
    validateSeedMixComponent(component, field);
    const rateLbPerAcre = component.rateLbPerAcre * methodMultiplier;
    const lot = component.seedLot;
    const bulkLbPerAcre = component.rateBasis === 'pls' ? bulkLbFromPlsLb(rateLbPerAcre, lot as SeedLot, `${field}.seedLot`) : rateLbPerAcre;
    const plsLbPerAcre = component.rateBasis === 'pls' ? rateLbPerAcre : lot ? rateLbPerAcre * plsFraction(lot) : null;
    const bulkSeedLb = bulkLbPerAcre * acres;
    const { packages, leftover } = packagesFor(bulkSeedLb, component.packageSizeLb);
    return {
      species: component.species.trim(),
      rateBasis: component.rateBasis,
      rateLbPerAcre: component.rateLbPerAcre,
      plsLbPerAcre,
      bulkLbPerAcre,
      bulkSeedLb,
      plsSeedLb: plsLbPerAcre === null ? null : plsLbPerAcre * acres,
      packageSizeLb: component.packageSizeLb,
      packages,
      leftoverLb: leftover,
      packagePriceCents: component.packagePriceCents,
      costCents: packages * component.packagePriceCents,
    };
  });
  return {
    acres,
    method,
    rateMethod,
    methodMultiplier,
    components,
    bulkLbPerAcre: components.reduce((sum, c) => sum + c.bulkLbPerAcre, 0),
    bulkSeedLb: components.reduce((sum, c) => sum + c.bulkSeedLb, 0),
    packages: components.reduce((sum, c) => sum + c.packages, 0),
    costCents: components.reduce((sum, c) => sum + c.costCents, 0),
  };
}
