/**
 * Spraying: sprayer calibration (gallons per acre), product per acre from a label rate, tank
 * loads over a unit's acres, and product totals and cost.
 *
 * - GPA = 5,940 × GPM ÷ (mph × nozzle spacing in) (Albany County Weed & Pest, Wyoming:
 *   3.75 GPM, 5 mph, 222 in → 20.07 GPA).
 * - "Ounces equal gallons" (LSU AgCenter): catch one nozzle for the time it takes to drive a
 *   course covering 1/128 acre (≈ 340 ft²) of nozzle spacing; ounces caught = gallons per acre.
 * - Product from an active-ingredient rate (Univ. of Missouri): 1.5 lb a.i./acre of a
 *   4 lb a.i./gal product = 0.375 gal (3 pt) per acre; a 500-gal tank at 20 GPA covers 25 acres
 *   and takes 9.375 gal of product.
 */
import { DomainValidationError } from './errors';
import { LINE_QUANTITY_DECIMALS, ceilWhole, lineAmountCents, packagesFor, roundHalfUp } from './rounding';
import { requireCents, requireNumber, requireText } from './validation';

/** The sprayer constant: 60 min/h × 43,560 ft²/acre × 12 in/ft ÷ 5,280 ft/mi = 5,940 exactly. */
export const GPA_CONSTANT = 5940;
/** Area of the "ounces equal gallons" course: 1/128 acre, rounded to 340 ft² as LSU AgCenter prints it. */
export const OUNCES_EQUAL_GALLONS_COURSE_SQ_FT = 340;
export const FL_OZ_PER_GAL = 128;
export const PT_PER_GAL = 8;
export const QT_PER_GAL = 4;

export const MAX_GPA = 400;
export const MAX_TANK_GAL = 10000;

export type LiquidUnit = 'gal' | 'qt' | 'pt' | 'fl-oz';
const PER_GAL: Record<LiquidUnit, number> = { gal: 1, qt: QT_PER_GAL, pt: PT_PER_GAL, 'fl-oz': FL_OZ_PER_GAL };

export interface SprayerCalibration {
  /** Output per nozzle (boom) or for the whole boomless swath, gallons per minute. */
  gpm: number;
  mph: number;
  /** Nozzle spacing, or the effective swath width for a boomless nozzle, in inches. */
  nozzleSpacingIn: number;
}

/** Gallons of spray per acre from nozzle output, ground speed and spacing: 5,940 × GPM ÷ (mph × in). */
export function gallonsPerAcre(calibration: SprayerCalibration): number {
  const gpm = requireNumber('gpm', calibration.gpm, { label: 'Nozzle output', unit: 'GPM', min: 0, minExclusive: true, max: 100 });
  const mph = requireNumber('mph', calibration.mph, { label: 'Ground speed', unit: 'mph', min: 0, minExclusive: true, max: 30 });
  const spacingIn = requireNozzleSpacing(calibration.nozzleSpacingIn);
  return (GPA_CONSTANT * gpm) / (mph * spacingIn);
}

function requireNozzleSpacing(value: number): number {
  return requireNumber('nozzleSpacingIn', value, { label: 'Nozzle spacing', unit: 'in', min: 0, minExclusive: true, max: 1200 });
}

/** Course length in feet for the "ounces equal gallons" method: 340 ft² ÷ (spacing in ÷ 12). */
export function ouncesEqualGallonsCourseFt(nozzleSpacingIn: number): number {
  return OUNCES_EQUAL_GALLONS_COURSE_SQ_FT / (requireNozzleSpacing(nozzleSpacingIn) / 12);
}

/** Convert a liquid amount to gallons. */
export function toGallons(amount: number, unit: LiquidUnit, field = 'unit'): number {
  const perGal = PER_GAL[unit];
  if (perGal === undefined) {
    throw new DomainValidationError(field, `Liquid unit must be one of gal, qt, pt, fl-oz (got ${JSON.stringify(unit)}).`);
  }
  return amount / perGal;
}

/**
 * A label rate: product volume per acre; pounds of active ingredient (or acid equivalent) per acre
 * with the product's concentration; or a percent solution (volume of product per volume of spray).
 */
export type SprayRate =
  | { kind: 'product'; amountPerAcre: number; unit: LiquidUnit }
  | { kind: 'active'; lbAiPerAcre: number; lbAiPerGal?: number }
  | { kind: 'solution'; pctOfSpray: number };

/** Product gallons per acre of a rate; `lbAiPerGal` and `gpa` fill in what the rate itself lacks. */
export function productGalPerAcre(rate: SprayRate, context: { lbAiPerGal?: number; gpa?: number } = {}, field = 'rate'): number {
  if (rate.kind === 'product') {
    const amount = requireNumber(`${field}.amountPerAcre`, rate.amountPerAcre, { label: 'Product rate', unit: `${rate.unit}/acre`, min: 0, minExclusive: true });
    const gal = toGallons(amount, rate.unit, `${field}.unit`);
    return requireNumber(`${field}.amountPerAcre`, gal, { label: 'Product rate', unit: 'gal/acre', max: 20 });
  }
  if (rate.kind === 'active') {
    const lbAi = requireNumber(`${field}.lbAiPerAcre`, rate.lbAiPerAcre, { label: 'Active ingredient rate', unit: 'lb a.i./acre', min: 0, minExclusive: true, max: 20 });
    const concentration = rate.lbAiPerGal ?? context.lbAiPerGal;
    if (concentration === undefined) {
      throw new DomainValidationError(`${field}.lbAiPerGal`, 'A rate in lb of active ingredient per acre needs the product concentration (lb a.i. per gallon) from the label.');
    }
    requireNumber(`${field}.lbAiPerGal`, concentration, { label: 'Product concentration', unit: 'lb a.i./gal', min: 0, minExclusive: true, max: 12 });
    return lbAi / concentration;
  }
  if (rate.kind === 'solution') {
    const pct = requireNumber(`${field}.pctOfSpray`, rate.pctOfSpray, { label: 'Solution strength', unit: '%', min: 0, minExclusive: true, max: 100 });
    if (context.gpa === undefined) {
      throw new DomainValidationError(`${field}.pctOfSpray`, 'A percent-solution rate needs the spray volume (gallons per acre) to work out product per acre.');
    }
    return (context.gpa * pct) / 100;
  }
  throw new DomainValidationError(`${field}.kind`, 'A spray rate must be "product", "active" or "solution".');
}

export interface TankPlanInput {
  acres: number;
  tankGal: number;
  gpa: number;
  /** Product gallons per acre of each product in the tank mix. */
  productGalPerAcre: number[];
}

export interface TankPlan {
  acresPerTank: number;
  tankLoads: number;
  fullLoads: number;
  /** Acres sprayed by the last load (equal to acresPerTank when it is full). */
  lastLoadAcres: number;
  /** Spray volume (water + product) to mix for the last load. */
  lastLoadFillGal: number;
  /** Product gallons per full tank, per product. */
  productGalPerFullTank: number[];
  /** Product gallons in the last load, per product. */
  lastLoadProductGal: number[];
  sprayGal: number;
}

/** Validate a tank size and spray volume; throws DomainValidationError for zero or absurd values. */
export function validateTank(tankGal: number, gpa: number): void {
  requireNumber('tankGal', tankGal, { label: 'Tank size', unit: 'gal', min: 0, minExclusive: true, max: MAX_TANK_GAL });
  requireNumber('gpa', gpa, { label: 'Spray volume', unit: 'gal/acre', min: 0, minExclusive: true, max: MAX_GPA });
}

/** Acres one tank covers: tank gallons ÷ gallons per acre. */
export function acresPerTank(tankGal: number, gpa: number): number {
  validateTank(tankGal, gpa);
  return tankGal / gpa;
}

/** Tank loads over the acres (rounded up), the last partial load's fill, and product per tank. */
export function planTankLoads(input: TankPlanInput): TankPlan {
  const acres = requireNumber('acres', input.acres, { label: 'Acres to spray', unit: 'acres', min: 0 });
  const perTank = acresPerTank(input.tankGal, input.gpa);
  const tankLoads = acres === 0 ? 0 : ceilWhole(acres / perTank);
  const lastLoadAcres = tankLoads === 0 ? 0 : acres - (tankLoads - 1) * perTank;
  const fullLoads = tankLoads === 0 ? 0 : Math.abs(lastLoadAcres - perTank) < 1e-9 ? tankLoads : tankLoads - 1;
  return {
    acresPerTank: perTank,
    tankLoads,
    fullLoads,
    lastLoadAcres,
    lastLoadFillGal: lastLoadAcres * input.gpa,
    productGalPerFullTank: input.productGalPerAcre.map((gal) => gal * perTank),
    lastLoadProductGal: input.productGalPerAcre.map((gal) => gal * lastLoadAcres),
    sprayGal: acres * input.gpa,
  };
}

/** How a spray product is bought: by the gallon, or in containers of a set size. */
export type SprayProductPricing =
  | { basis: 'per-gal'; pricePerGalCents: number }
  | { basis: 'container'; containerSizeGal: number; containerPriceCents: number };

export interface SprayProductInput {
  name: string;
  rate: SprayRate;
  /** Product concentration from the label, for rates in lb a.i./acre. */
  lbAiPerGal?: number;
  pricing: SprayProductPricing;
}

export interface SprayApplicationInput {
  acres: number;
  /** Share of the acres actually sprayed (spot treatment), 0–1; default 1. */
  treatedFraction?: number;
  /** Spray volume; omit for undiluted direct application (cut-stump, hack-and-squirt) — then no tank loads. */
  gpa?: number;
  tankGal?: number;
  products: SprayProductInput[];
}

export interface SprayProductResult {
  name: string;
  productGalPerAcre: number;
  productGal: number;
  productFlOz: number;
  /** Containers to buy when priced by container, else null. */
  containers: number | null;
  leftoverGal: number | null;
  costCents: number;
}

export interface SprayApplicationResult {
  treatedAcres: number;
  gpa: number | null;
  tank: TankPlan | null;
  products: SprayProductResult[];
  productGal: number;
  costCents: number;
}

/** Validate how a spray product is priced; throws DomainValidationError. */
export function validateSprayPricing(pricing: SprayProductPricing, field = 'pricing'): void {
  if (pricing.basis === 'per-gal') {
    requireCents(`${field}.pricePerGalCents`, pricing.pricePerGalCents, 'Price per gallon');
  } else if (pricing.basis === 'container') {
    requireNumber(`${field}.containerSizeGal`, pricing.containerSizeGal, { label: 'Container size', unit: 'gal', min: 0, minExclusive: true, max: 500 });
    requireCents(`${field}.containerPriceCents`, pricing.containerPriceCents, 'Container price');
  } else {
    throw new DomainValidationError(`${field}.basis`, 'Spray product pricing must be "per-gal" or "container".');
  }
}

/** Product cost: gallons (to 2 decimals) × price per gallon rounded once, or whole containers. */
export function sprayProductCost(productGal: number, pricing: SprayProductPricing): { containers: number | null; leftoverGal: number | null; costCents: number } {
  validateSprayPricing(pricing);
  if (pricing.basis === 'per-gal') {
    return { containers: null, leftoverGal: null, costCents: lineAmountCents(roundHalfUp(productGal, LINE_QUANTITY_DECIMALS), pricing.pricePerGalCents) };
  }
  const { packages, leftover } = packagesFor(productGal, pricing.containerSizeGal);
  return { containers: packages, leftoverGal: leftover, costCents: packages * pricing.containerPriceCents };
}

/** Everything one spray application needs: treated acres, tank loads, product per acre and in total, and cost. */
export function computeSprayApplication(input: SprayApplicationInput): SprayApplicationResult {
  const acres = requireNumber('acres', input.acres, { label: 'Acres', unit: 'acres', min: 0 });
  const treatedFraction = requireNumber('treatedFraction', input.treatedFraction ?? 1, {
    label: 'Share of the area treated',
    min: 0,
    minExclusive: true,
    max: 1,
  });
  const treatedAcres = acres * treatedFraction;
  if (!Array.isArray(input.products) || input.products.length === 0) {
    throw new DomainValidationError('products', 'A spray application needs at least one product with a rate.');
  }
  const gpa = input.gpa ?? null;
  if (gpa !== null) requireNumber('gpa', gpa, { label: 'Spray volume', unit: 'gal/acre', min: 0, minExclusive: true, max: MAX_GPA });
  if (gpa === null && input.tankGal !== undefined) {
    throw new DomainValidationError('gpa', 'A tank size was given without a spray volume; give the gallons per acre from the sprayer calibration.');
  }
  const rates = input.products.map((product, index) => {
    requireText(`products[${index}].name`, product.name, 'Product name');
    if (product.rate.kind === 'solution' && gpa === null) {
      throw new DomainValidationError('gpa', `${product.name} is rated as a percent solution, so the application needs a spray volume in gallons per acre.`);
    }
    return productGalPerAcre(product.rate, { lbAiPerGal: product.lbAiPerGal, gpa: gpa ?? undefined }, `products[${index}].rate`);
  });
  const tank = gpa !== null && input.tankGal !== undefined
    ? planTankLoads({ acres: treatedAcres, tankGal: input.tankGal, gpa, productGalPerAcre: rates })
    : null;
  const products = input.products.map((product, index): SprayProductResult => {
    const productGal = rates[index] * treatedAcres;
    const cost = sprayProductCost(productGal, product.pricing);
    return {
      name: product.name.trim(),
      productGalPerAcre: rates[index],
      productGal,
      productFlOz: productGal * FL_OZ_PER_GAL,
      ...cost,
    };
  });
  return {
    treatedAcres,
    gpa,
    tank,
    products,
    productGal: products.reduce((sum, p) => sum + p.productGal, 0),
    costCents: products.reduce((sum, p) => sum + p.costCents, 0),
  };
}
