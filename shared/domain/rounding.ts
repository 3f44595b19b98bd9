/**
 * Rounding rules for quantities and money.
 *
 * The one money rule: a line's amount is computed from its (already rounded) quantity and unit
 * price, then rounded ONCE, half up (halves go away from zero), to whole cents. Every sum after
 * that adds integer cents, so totals are exact and the same everywhere they are shown.
 * Before rounding, values are snapped to 6 decimal places so binary noise (49.49999999999 for
 * 49.5) does not flip a half.
 */

/** Decimal places kept on a proposal line's quantity (acres, hours, tons, gallons). */
export const LINE_QUANTITY_DECIMALS = 2;

function snap(value: number): number {
  return Number(value.toFixed(6));
}

/** Round half up (away from zero) to the given number of decimals. */
export function roundHalfUp(value: number, decimals = 0): number {
  if (!Number.isFinite(value)) throw new RangeError(`Cannot round ${value}.`);
  const factor = 10 ** decimals;
  const scaled = snap(Math.abs(value) * factor);
  const rounded = Math.floor(scaled + 0.5) / factor;
  return value < 0 ? -rounded : rounded;
}

/** Round a cent amount half up to whole cents: the single rounding applied to each line amount. */
export function roundHalfUpCents(amountCents: number): number {
  return roundHalfUp(amountCents, 0);
}

/** Round a line quantity to LINE_QUANTITY_DECIMALS places, half up. */
export function roundLineQuantity(quantity: number): number {
  return roundHalfUp(quantity, LINE_QUANTITY_DECIMALS);
}

/** Line amount in cents: quantity × unit price, rounded once, half up. */
export function lineAmountCents(quantity: number, unitPriceCents: number): number {
  return roundHalfUpCents(quantity * unitPriceCents);
}

/** Smallest whole number ≥ value, ignoring float noise (3.0000000000004 → 3). */
export function ceilWhole(value: number): number {
  return Math.ceil(snap(value));
}

/** Sum integer cents exactly; throws if a value is not an integer. */
export function sumCents(amountsCents: readonly number[]): number {
  let total = 0;
  for (const amount of amountsCents) {
    if (!Number.isInteger(amount)) throw new RangeError(`Cent amounts must be integers (got ${amount}).`);
    total += amount;
  }
  return total;
}

/** How many packages of `packageSize` cover `needed`, and what is left over. */
export function packagesFor(needed: number, packageSize: number): { packages: number; leftover: number } {
  const packages = needed <= 0 ? 0 : ceilWhole(needed / packageSize);
  const leftover = snap(packages * packageSize - needed);
  return { packages, leftover: leftover < 0 ? 0 : leftover };
}
