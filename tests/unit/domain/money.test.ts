import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import {
  allocateByLargestRemainder,
  formatCents,
  parseDollarsToCents,
  roundHalfUpDiv,
  toScaledDecimal,
} from '../../../shared/domain/money';
import { lineAmountCents } from '../../../shared/domain/proposal-totals';

function expectField(fn: () => unknown, field: string): void {
  let error: unknown;
  try {
    fn();
  } catch (caught) {
    error = caught;
  }
  expect(error).toBeInstanceOf(DomainValidationError);
  expect((error as DomainValidationError).field).toBe(field);
  expect((error as DomainValidationError).message.length).toBeGreaterThan(10);
}

const RUNS = { numRuns: 300 };

describe('money helpers', () => {
  it('rounds halves up and everything else to the nearest cent', () => {
    // Round-half-up definition (common practice, no source): 2.5 → 3, 2.4999 → 2, -2.5 → -3.
    expect(roundHalfUpDiv(5n, 2n)).toBe(3n);
    expect(roundHalfUpDiv(24_999n, 10_000n)).toBe(2n);
    expect(roundHalfUpDiv(25_000n, 10_000n)).toBe(3n);
    expect(roundHalfUpDiv(-5n, 2n)).toBe(-3n);
  });

  it('computes line amounts without binary floating-point error', () => {
    // Worked by hand: 4.35 × 50 = 217.5 cents → 218; Math.round(4.35 * 50) gives 217 in IEEE 754.
    expect(Math.round(4.35 * 50)).toBe(217);
    expect(lineAmountCents(4.35, 50)).toBe(218);
    // Worked by hand: 1.005 × 100 = 100.5 → 101 (float gives 100.49999999999999).
    expect(lineAmountCents(1.005, 100)).toBe(101);
    // Worked by hand: 2.37 acres × $185.00 = $438.45 exactly.
    expect(lineAmountCents('2.37', 18_500)).toBe(43_845);
  });

  it('reads decimals exactly as ten-thousandths and refuses what it cannot read', () => {
    // Worked by hand: 2.37 → 23,700; "0.0001" → 1; "3." → 30,000; "-0" is zero.
    expect(toScaledDecimal(2.37, 'q')).toBe(23_700n);
    expect(toScaledDecimal('0.0001', 'q')).toBe(1n);
    expect(toScaledDecimal('3.', 'q')).toBe(30_000n);
    expect(toScaledDecimal('-0', 'q')).toBe(0n);
    expectField(() => toScaledDecimal(0.1 + 0.2, 'q'), 'q'); // 0.30000000000000004 has 17 decimals
    expectField(() => toScaledDecimal(1e-7, 'q'), 'q');
    expectField(() => toScaledDecimal('1e3', 'q'), 'q');
    expectField(() => toScaledDecimal(Number.POSITIVE_INFINITY, 'q'), 'q');
  });

  it('formats cents as US dollars', () => {
    // en-US currency format, Intl (ECMA-402): "$1,234.56".
    expect(formatCents(123_456)).toBe('$1,234.56');
    expect(formatCents(5)).toBe('$0.05');
    expect(formatCents(-250)).toBe('-$2.50');
    expect(formatCents(0)).toBe('$0.00');
    // Exact beyond float's cent precision: 2^53 − 1 cents (worked by hand from Number.MAX_SAFE_INTEGER).
    expect(formatCents(Number.MAX_SAFE_INTEGER)).toBe('$90,071,992,547,409.91');
    expectField(() => formatCents(12.5), 'cents');
  });

  it('parses typed dollar amounts into cents', () => {
    // Worked by hand.
    expect(parseDollarsToCents('1,234.56')).toBe(123_456);
    expect(parseDollarsToCents('$75')).toBe(7_500);
    expect(parseDollarsToCents(' 0.5 ')).toBe(50);
    expect(parseDollarsToCents('.07')).toBe(7);
    expect(parseDollarsToCents('-12.30')).toBe(-1_230);
    expect(parseDollarsToCents('1234567.89')).toBe(123_456_789);
    for (const bad of ['', 'abc', '1.234', '12,34.00', '1,2345', '$', '1.2.3']) {
      expectField(() => parseDollarsToCents(bad), 'amount');
    }
    expectField(() => parseDollarsToCents('9.999', 'unitPrice'), 'unitPrice');
  });

  it('parses back what it formats', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (cents) => {
        expect(parseDollarsToCents(formatCents(cents))).toBe(cents);
      }),
      RUNS,
    );
  });

  it('allocates by largest remainder and breaks ties by weight, then key', () => {
    // Worked by hand: 1000 over 3333/3333/3334 → exact 333.3/333.3/333.4 → floors 333 each, the
    // leftover cent to the largest remainder (3334).
    const split = allocateByLargestRemainder(1000, [
      { key: 'a', weight: 3333 },
      { key: 'b', weight: 3333 },
      { key: 'c', weight: 3334 },
    ]);
    expect([split.get('a'), split.get('b'), split.get('c')]).toEqual([333, 333, 334]);
    // Worked by hand: 1 cent over two equal weights goes to key "a" whatever the order.
    expect(allocateByLargestRemainder(1, [{ key: 'b', weight: 5 }, { key: 'a', weight: 5 }]).get('a')).toBe(1);
    expectField(() => allocateByLargestRemainder(5, [{ key: 'a', weight: 0 }]), 'totalCents');
  });
});
