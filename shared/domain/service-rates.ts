/**
 * Labor, equipment and fee rates: how a rate turns a unit's size into a priced line.
 *
 * Bases: per acre, per hour (hours from a productivity such as hours per acre), per each, and per
 * 100 ft (for line units, or an area's perimeter). A rate may carry a minimum charge. Amounts are
 * rounded once per line, half up (see rounding.ts), on the line quantity rounded to 2 decimals.
 */
import { DomainValidationError } from './errors';
import { lineAmountCents, roundLineQuantity } from './rounding';
import { requireCents, requireNumber, requireText } from './validation';

export type RateBasis = 'per-acre' | 'per-hour' | 'per-each' | 'per-100-ft';
export const RATE_BASES: readonly RateBasis[] = ['per-acre', 'per-hour', 'per-each', 'per-100-ft'];
/** The line categories a service rate may have (a subset of LINE_CATEGORIES: materials are priced as materials). */
export const RATE_CATEGORIES = ['labor', 'equipment', 'fees'] as const;
export type RateCategory = (typeof RATE_CATEGORIES)[number];
export type LineCategory = 'materials' | RateCategory;

/** A firm's rate for labor, equipment or a fee. */
export interface ServiceRate {
  key: string;
  name: string;
  category: RateCategory;
  basis: RateBasis;
  unitPriceCents: number;
  /** Smallest amount charged for the line, if any. */
  minimumCents?: number;
}

/** How long the work takes; one of these is used, in this order of precedence. */
export interface Productivity {
  hoursPerAcre?: number;
  hoursPer100Ft?: number;
  hoursPerEach?: number;
  /** A set number of hours regardless of size. */
  fixedHours?: number;
}

/** The size of the thing the work is done on. */
export interface WorkMeasures {
  acres?: number;
  /** Length of a line unit, or the perimeter of an area where the work follows its edge. */
  lengthFt?: number;
  /** Number of items (points, structures); default 1. */
  count?: number;
}

export interface ServiceLineInput {
  rate: ServiceRate;
  measures: WorkMeasures;
  productivity?: Productivity;
  /** Overrides the quantity the basis would take from the measures (e.g. one mobilization). */
  quantity?: number;
}

export interface ServiceLineResult {
  rateKey: string;
  name: string;
  category: RateCategory;
  basis: RateBasis;
  /** Line quantity before rounding (acres, hours, count, hundreds of feet). */
  rawQuantity: number;
  quantity: number;
  unit: string;
  unitPriceCents: number;
  /** Hours of work from the productivity; null when no productivity is known. */
  hours: number | null;
  /** Quantity × price, rounded once, before any minimum. */
  calculatedCents: number;
  minimumApplied: boolean;
  amountCents: number;
}

export const BASIS_UNITS: Record<RateBasis, string> = {
  'per-acre': 'acre',
  'per-hour': 'hour',
  'per-each': 'each',
  'per-100-ft': '100 ft',
};

/** Validate a rate definition; throws DomainValidationError naming the field. */
export function validateServiceRate(rate: ServiceRate, field = 'rate'): void {
  requireText(`${field}.key`, rate.key, 'Rate key');
  requireText(`${field}.name`, rate.name, 'Rate name');
  if (!(RATE_CATEGORIES as readonly string[]).includes(rate.category)) {
    throw new DomainValidationError(`${field}.category`, `Rate category must be labor, equipment or fees (got ${JSON.stringify(rate.category)}).`);
  }
  if (!RATE_BASES.includes(rate.basis)) {
    throw new DomainValidationError(`${field}.basis`, `Rate basis must be one of ${RATE_BASES.join(', ')} (got ${JSON.stringify(rate.basis)}).`);
  }
  requireCents(`${field}.unitPriceCents`, rate.unitPriceCents, `Price of ${rate.name}`);
  if (rate.minimumCents !== undefined) requireCents(`${field}.minimumCents`, rate.minimumCents, `Minimum charge of ${rate.name}`);
}

function measure(field: string, value: number | undefined, label: string, unit: string): number {
  if (value === undefined) {
    throw new DomainValidationError(field, `This rate needs the unit's ${label}; draw or enter it first.`);
  }
  return requireNumber(field, value, { label, unit, min: 0 });
}

/** Hours of work from a productivity and the unit's size; null when no productivity is given. */
export function workHours(productivity: Productivity | undefined, measures: WorkMeasures, field = 'productivity'): number | null {
  if (!productivity) return null;
  const rule = { min: 0, max: 1000 };
  if (productivity.hoursPerAcre !== undefined) {
    requireNumber(`${field}.hoursPerAcre`, productivity.hoursPerAcre, { label: 'Hours per acre', unit: 'h/acre', ...rule });
    return productivity.hoursPerAcre * measure('unit.acres', measures.acres, 'acreage', 'acres');
  }
  if (productivity.hoursPer100Ft !== undefined) {
    requireNumber(`${field}.hoursPer100Ft`, productivity.hoursPer100Ft, { label: 'Hours per 100 ft', unit: 'h/100 ft', ...rule });
    return (productivity.hoursPer100Ft * measure('unit.lengthFt', measures.lengthFt, 'length in feet', 'ft')) / 100;
  }
  if (productivity.hoursPerEach !== undefined) {
    requireNumber(`${field}.hoursPerEach`, productivity.hoursPerEach, { label: 'Hours each', unit: 'h', ...rule });
    return productivity.hoursPerEach * requireCount(measures.count);
  }
  if (productivity.fixedHours !== undefined) {
    return requireNumber(`${field}.fixedHours`, productivity.fixedHours, { label: 'Hours', unit: 'h', ...rule });
  }
  return null;
}

function requireCount(count: number | undefined): number {
  return requireNumber('unit.count', count ?? 1, { label: 'Count', min: 0, max: 100000, integer: true });
}

/** Price one labor, equipment or fee line: quantity by basis, hours, minimum charge and amount in cents. */
export function computeServiceLine(input: ServiceLineInput, field = 'service'): ServiceLineResult {
  const { rate, measures } = input;
  validateServiceRate(rate, `${field}.rate`);
  const hours = workHours(input.productivity, measures, `${field}.productivity`);
  let rawQuantity: number;
  if (input.quantity !== undefined) {
    rawQuantity = requireNumber(`${field}.quantity`, input.quantity, { label: `Quantity of ${rate.name}`, min: 0, max: 1_000_000 });
  } else if (rate.basis === 'per-acre') {
    rawQuantity = measure('unit.acres', measures.acres, 'acreage', 'acres');
  } else if (rate.basis === 'per-100-ft') {
    rawQuantity = measure('unit.lengthFt', measures.lengthFt, 'length in feet', 'ft') / 100;
  } else if (rate.basis === 'per-each') {
    rawQuantity = requireCount(measures.count);
  } else {
    if (hours === null) {
      throw new DomainValidationError(
        `${field}.productivity`,
        `${rate.name} is charged by the hour; give its productivity (hours per acre, per 100 ft, each, or a fixed number of hours).`,
      );
    }
    rawQuantity = hours;
  }
  const quantity = roundLineQuantity(rawQuantity);
  const calculatedCents = lineAmountCents(quantity, rate.unitPriceCents);
  const minimumApplied = rate.minimumCents !== undefined && quantity > 0 && calculatedCents < rate.minimumCents;
  return {
    rateKey: rate.key,
    name: rate.name,
    category: rate.category,
    basis: rate.basis,
    rawQuantity,
    quantity,
    unit: BASIS_UNITS[rate.basis],
    unitPriceCents: rate.unitPriceCents,
    hours,
    calculatedCents,
    minimumApplied,
    amountCents: minimumApplied ? (rate.minimumCents as number) : calculatedCents,
  };
}
