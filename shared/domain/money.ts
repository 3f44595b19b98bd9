/**
 * Money helpers: integer cents, exact decimal scaling, the one rounding rule, pro-rata allocation
 * and display formatting.
 *
 * The rounding rule of Browseline: ROUND HALF UP to whole cents (a value exactly halfway between
 * two cents goes to the cent farther from zero; 1.5 → 2, 2.5 → 3). It lives in `roundHalfUpDiv`
 * and nothing else in the money code rounds. Every computation is done on integers (BigInt where a
 * product could pass 2^53), so binary floating point never touches an amount: 4.35 × 50 cents is
 * 217.5 → 218 here, where `Math.round(4.35 * 50)` gives 217.
 */
import { DomainValidationError } from './errors';

/** Decimal places allowed in a quantity or a percentage (quantities are held as ten-thousandths). */
export const DECIMAL_PLACES = 4;
/** 10^DECIMAL_PLACES: the scale of a quantity or percentage held as an integer. */
export const DECIMAL_SCALE = 10_000n;

const MAX_SAFE = BigInt(Number.MAX_SAFE_INTEGER);

/** Integer division rounded half up (halves away from zero): the only rounding rule for money. */
export function roundHalfUpDiv(numerator: bigint, denominator: bigint): bigint {
  if (denominator === 0n) throw new RangeError('roundHalfUpDiv: division by zero');
  const negative = numerator < 0n !== denominator < 0n;
  const n = numerator < 0n ? -numerator : numerator;
  const d = denominator < 0n ? -denominator : denominator;
  const quotient = (2n * n + d) / (2n * d); // floor((n / d) + 1/2) for n, d ≥ 0
  return negative ? -quotient : quotient;
}

/**
 * A non-negative decimal (number or string such as "2.37") as an integer scaled by 10^4, exactly.
 * More than four decimal places is refused rather than rounded, so a quantity is never silently
 * changed.
 */
export function toScaledDecimal(value: number | string, field: string, label = 'Value'): bigint {
  let text: string;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new DomainValidationError(field, `${label} must be a finite number.`);
    text = String(value);
    if (/e/i.test(text)) {
      // Exponent notation: numbers this small or large are never sensible quantities or rates.
      throw new DomainValidationError(field, `${label} ${text} is out of range; use a plain decimal with at most ${DECIMAL_PLACES} decimal places.`);
    }
  } else if (typeof value === 'string') {
    text = value.trim();
  } else {
    throw new DomainValidationError(field, `${label} must be a number.`);
  }
  const match = /^([+-])?(\d*)(?:\.(\d*))?$/.exec(text);
  if (!match || (match[2] === '' && (match[3] ?? '') === '')) {
    throw new DomainValidationError(field, `${label} "${text}" is not a decimal number.`);
  }
  const whole = match[2] === '' ? '0' : match[2];
  const fraction = (match[3] ?? '').replace(/0+$/, '');
  if (match[1] === '-' && /[1-9]/.test(whole + fraction)) {
    throw new DomainValidationError(field, `${label} cannot be negative (got ${text}).`);
  }
  if (fraction.length > DECIMAL_PLACES) {
    throw new DomainValidationError(field, `${label} ${text} has more than ${DECIMAL_PLACES} decimal places; round it to ${DECIMAL_PLACES} first.`);
  }
  return BigInt(whole) * DECIMAL_SCALE + BigInt(fraction.padEnd(DECIMAL_PLACES, '0'));
}

/** A value scaled by 10^4 written back as a fixed four-decimal string ("2.3700"). */
export function formatScaledDecimal(scaled: bigint): string {
  const negative = scaled < 0n;
  const abs = negative ? -scaled : scaled;
  const whole = abs / DECIMAL_SCALE;
  const fraction = (abs % DECIMAL_SCALE).toString().padStart(DECIMAL_PLACES, '0');
  return `${negative ? '-' : ''}${whole}.${fraction}`;
}

/** Throws unless the value is a whole number of cents within the safe integer range (and ≥ 0 unless allowed). */
export function assertCents(value: unknown, field: string, options: { allowNegative?: boolean } = {}): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new DomainValidationError(field, `Amount must be a number of cents (got ${String(value)}).`);
  }
  if (!Number.isInteger(value)) {
    throw new DomainValidationError(field, `Amount must be a whole number of cents (got ${value}); money is kept in integer cents.`);
  }
  if (!Number.isSafeInteger(value)) {
    throw new DomainValidationError(field, `Amount ${value} is too large.`);
  }
  if (!options.allowNegative && value < 0) {
    throw new DomainValidationError(field, `Amount cannot be negative (got ${value} cents).`);
  }
}

/** A BigInt cent amount as a number, or a validation error when it leaves the safe integer range. */
export function centsToNumber(cents: bigint, field: string): number {
  if (cents > MAX_SAFE || cents < -MAX_SAFE) {
    throw new DomainValidationError(field, `Amount is too large to be handled exactly (${cents} cents).`);
  }
  return Number(cents);
}

/**
 * A percentage (scaled by 10^4, so 7.25 % is 72,500n) of a cent amount, rounded half up once.
 * Used for tax, percent discounts and deposits alike.
 */
export function percentOfCents(cents: bigint, percentScaled: bigint): bigint {
  return roundHalfUpDiv(cents * percentScaled, 100n * DECIMAL_SCALE);
}

/**
 * Splits `totalCents` over the shares in proportion to their weights by the largest-remainder
 * method: every share gets the floor of its exact part, then the cents left over go one each to
 * the largest remainders (ties: larger weight first, then key in ascending code-unit order). The
 * parts are whole cents, never negative, and add up exactly to `totalCents`; the result does not
 * depend on the order of `shares`.
 */
export function allocateByLargestRemainder(totalCents: number, shares: ReadonlyArray<{ key: string; weight: number }>): Map<string, number> {
  assertCents(totalCents, 'totalCents');
  const result = new Map<string, number>();
  let weightSum = 0n;
  for (const share of shares) {
    if (!Number.isSafeInteger(share.weight) || share.weight < 0) {
      throw new DomainValidationError(share.key, `Allocation weight must be a non-negative whole number (got ${share.weight}).`);
    }
    if (result.has(share.key)) throw new DomainValidationError(share.key, `Allocation key "${share.key}" appears twice.`);
    result.set(share.key, 0);
    weightSum += BigInt(share.weight);
  }
  if (totalCents === 0) return result;
  if (weightSum === 0n) {
    throw new DomainValidationError('totalCents', `Cannot allocate ${totalCents} cents over shares that are all zero.`);
  }
  const total = BigInt(totalCents);
  let allocated = 0n;
  const remainders: Array<{ key: string; weight: number; remainder: bigint }> = [];
  for (const share of shares) {
    const exact = total * BigInt(share.weight);
    const floor = exact / weightSum;
    allocated += floor;
    result.set(share.key, Number(floor));
    remainders.push({ key: share.key, weight: share.weight, remainder: exact % weightSum });
  }
  remainders.sort((a, b) => {
    if (a.remainder !== b.remainder) return a.remainder > b.remainder ? -1 : 1;
    if (a.weight !== b.weight) return b.weight - a.weight;
    return a.key < b.key ? -1 : a.key > b.key ? 1 : 0;
  });
  let leftover = Number(total - allocated); // < shares.length, since each remainder < weightSum
  for (const entry of remainders) {
    if (leftover === 0) break;
    result.set(entry.key, (result.get(entry.key) ?? 0) + 1);
    leftover -= 1;
  }
  return result;
}

const currencyFormats = new Map<string, { format: Intl.NumberFormat; minorDigits: number }>();

/** One Intl formatter per locale and currency (making one costs far more than using it). */
function currencyFormat(locale: string, currency: string): { format: Intl.NumberFormat; minorDigits: number } {
  const key = `${locale}|${currency}`;
  let entry = currencyFormats.get(key);
  if (!entry) {
    const format = new Intl.NumberFormat(locale, { style: 'currency', currency });
    entry = { format, minorDigits: format.resolvedOptions().maximumFractionDigits ?? 2 };
    currencyFormats.set(key, entry);
  }
  return entry;
}

/** Cents as a currency string for display, e.g. 123456 → "$1,234.56" (exact, no float division). */
export function formatCents(cents: number, currency = 'USD', locale = 'en-US'): string {
  assertCents(cents, 'cents', { allowNegative: true });
  const { format, minorDigits } = currencyFormat(locale, currency);
  const abs = BigInt(Math.abs(cents));
  const scale = 10n ** BigInt(minorDigits);
  const decimal = minorDigits === 0 ? `${abs}` : `${abs / scale}.${(abs % scale).toString().padStart(minorDigits, '0')}`;
  // Intl formats decimal strings exactly (ECMA-402 NumberFormat v3, Node ≥ 19).
  return format.format(`${cents < 0 ? '-' : ''}${decimal}` as Intl.StringNumericLiteral);
}

/**
 * A typed dollar amount as integer cents: "1,234.56" → 123456, "$75" → 7500, "-0.5" → -50.
 * Commas must group thousands; more than two decimals is refused, not rounded.
 */
export function parseDollarsToCents(text: string, field = 'amount'): number {
  if (typeof text !== 'string') throw new DomainValidationError(field, 'Amount must be text such as "1,234.56".');
  const trimmed = text.trim();
  const match = /^(-)?\s*\$?\s*(\d{1,3}(?:,\d{3})+|\d*)(?:\.(\d*))?$/.exec(trimmed);
  if (!match || (match[2] === '' && (match[3] ?? '') === '')) {
    throw new DomainValidationError(field, `"${text}" is not a dollar amount; write it like 1,234.56.`);
  }
  const fraction = match[3] ?? '';
  if (fraction.length > 2) {
    throw new DomainValidationError(field, `"${text}" has more than two decimal places; amounts are in whole cents.`);
  }
  const whole = match[2] === '' ? '0' : match[2].replace(/,/g, '');
  const cents = BigInt(whole) * 100n + BigInt(fraction.padEnd(2, '0'));
  const value = centsToNumber(match[1] ? -cents : cents, field);
  return value === 0 ? 0 : value; // no -0
}
