/** Small guards shared by the agronomy computations; each throws a DomainValidationError a person can act on. */
import { DomainValidationError } from './errors';

export interface NumberRule {
  /** Human name of the value, e.g. "Purity". */
  label: string;
  /** Unit shown after limits, e.g. "%" or "lb/acre". */
  unit?: string;
  min?: number;
  /** When true the value must be strictly greater than `min`. */
  minExclusive?: boolean;
  max?: number;
  integer?: boolean;
}

function withUnit(value: number, unit?: string): string {
  return unit ? `${value} ${unit}` : String(value);
}

function describeRange(rule: NumberRule): string {
  const { min, max, unit } = rule;
  if (min !== undefined && max !== undefined) {
    return rule.minExclusive
      ? `greater than ${min} and at most ${withUnit(max, unit)}`
      : `between ${min} and ${withUnit(max, unit)}`;
  }
  if (min !== undefined) return rule.minExclusive ? `greater than ${withUnit(min, unit)}` : `at least ${withUnit(min, unit)}`;
  return `at most ${withUnit(max as number, unit)}`;
}

/** Check that `value` is a finite number within the rule's limits and return it; throw a DomainValidationError otherwise. */
export function requireNumber(field: string, value: unknown, rule: NumberRule): number {
  const { label, unit } = rule;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    const shown = typeof value === 'number' ? String(value) : value === undefined ? 'nothing' : JSON.stringify(value);
    throw new DomainValidationError(field, `${label} must be a number (got ${shown}).`);
  }
  if (rule.integer && !Number.isInteger(value)) {
    throw new DomainValidationError(field, `${label} must be a whole number (got ${value}).`);
  }
  const belowMin = rule.min !== undefined && (rule.minExclusive ? value <= rule.min : value < rule.min);
  const aboveMax = rule.max !== undefined && value > rule.max;
  if (belowMin || aboveMax) {
    throw new DomainValidationError(field, `${label} must be ${describeRange(rule)} (got ${withUnit(value, unit)}).`);
  }
  return value;
}

/** Check an amount of money in integer cents (0 up to $10,000,000). */
export function requireCents(field: string, value: unknown, label: string): number {
  return requireNumber(field, value, { label: `${label} (in cents)`, min: 0, max: 1_000_000_000, integer: true });
}

/** Check a non-empty text value and return it trimmed. */
export function requireText(field: string, value: unknown, label: string): string {
  if (typeof value !== 'string' || value.trim() === '') {
    throw new DomainValidationError(field, `${label} must not be empty.`);
  }
  return value.trim();
}
