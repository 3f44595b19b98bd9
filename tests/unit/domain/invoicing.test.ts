import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import {
  ageReceivables,
  ageingBucket,
  checkoutAmountCents,
  dueDate,
  finalInvoiceCents,
  invoiceAmounts,
  paymentStanding,
  progressInvoicePlan,
  reminderDue,
} from '../../../shared/domain/invoicing';

describe('invoice totals', () => {
  it('adds billed lines as they are and prices and taxes manual lines by the proposal rule', () => {
    const amounts = invoiceAmounts(
      [
        { id: 'a', source: 'deposit', quantity: 1, unitPriceCents: 48_000, amountCents: 48_000, taxable: false },
        // 2.5 h × $65.00 = $162.50, taxable at 5.5 % → 893.75 → 894 cents, round half up (arithmetic, no source)
        { id: 'b', source: 'manual', quantity: '2.5', unitPriceCents: 6_500, taxable: true },
        { id: 'c', source: 'manual', quantity: 1, unitPriceCents: 1_999, taxable: false },
      ],
      5.5,
    );
    expect(amounts.billedCents).toBe(48_000);
    expect(amounts.lineAmounts.get('b')).toBe(16_250); // 2.5 × 6500 (arithmetic, no source)
    expect(amounts.manualSubtotalCents).toBe(18_249); // 16250 + 1999 (arithmetic, no source)
    expect(amounts.taxCents).toBe(894); // 16250 × 5.5 % = 893.75 → 894 (round half up, arithmetic)
    expect(amounts.totalCents).toBe(48_000 + 18_249 + 894);
  });

  it('accepts a negative deposit credit but refuses a negative billed task line', () => {
    expect(invoiceAmounts([{ id: 't', source: 'task', quantity: 1, unitPriceCents: 100, amountCents: 100, taxable: false }, { id: 'c', source: 'deposit-credit', quantity: 1, unitPriceCents: -30, amountCents: -30, taxable: false }], 0).totalCents).toBe(70);
    expect(() => invoiceAmounts([{ id: 't', source: 'task', quantity: 1, unitPriceCents: -1, amountCents: -1, taxable: false }], 0)).toThrow(DomainValidationError);
  });
});

describe('billing a proposal: deposit, progress, final', () => {
  it('credits the deposit pro rata on progress invoices and the final bills exactly the rest', () => {
    // Proposal total $10,000.00 with a 30 % deposit of $3,000.00 (invented demo figures, arithmetic checks).
    const total = 1_000_000;
    const deposit = 300_000;
    const p1 = progressInvoicePlan({ tasks: [{ id: 1, description: 'Disk and seed', costCents: 200_000 }], depositPct: 30, depositUncreditedCents: deposit, remainingCents: total - deposit });
    expect(p1.creditCents).toBe(60_000); // 30 % of 2000.00 (arithmetic, no source)
    expect(p1.netCents).toBe(140_000);
    const final = finalInvoiceCents(total, [deposit, p1.netCents]);
    expect(final).toBe(560_000); // 10000 − 3000 − 1400 (arithmetic, no source)
    expect(deposit + p1.netCents + final).toBe(total);
  });

  it('never lets progress invoices bill past the proposal total', () => {
    const plan = progressInvoicePlan({ tasks: [{ id: 1, description: 'All the work', costCents: 900_000 }], depositPct: 0, depositUncreditedCents: 0, remainingCents: 700_000 });
    expect(plan.netCents).toBe(700_000);
    expect(plan.creditCents).toBe(200_000);
  });

  it('keeps the sum of invoices equal to the proposal total for any split (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 50_000_000 }),
        fc.integer({ min: 0, max: 100 }),
        fc.array(fc.integer({ min: 0, max: 5_000_000 }), { minLength: 1, maxLength: 6 }),
        (total, depositPct, costs) => {
          const deposit = Math.round((total * depositPct) / 100);
          const billed: number[] = [deposit];
          let uncredited = deposit;
          for (const [i, cost] of costs.entries()) {
            const remaining = total - billed.reduce((a, b) => a + b, 0);
            if (remaining <= 0) break;
            const plan = progressInvoicePlan({ tasks: [{ id: i, description: 't', costCents: cost }], depositPct, depositUncreditedCents: uncredited, remainingCents: remaining });
            uncredited = Math.max(0, uncredited - plan.creditCents);
            billed.push(plan.netCents);
          }
          const rest = total - billed.reduce((a, b) => a + b, 0);
          if (rest > 0) billed.push(finalInvoiceCents(total, billed));
          expect(billed.reduce((a, b) => a + b, 0)).toBe(total);
          for (const b of billed) expect(b).toBeGreaterThanOrEqual(0);
        },
      ),
    );
  });

  it('refuses a final invoice when nothing is left and a progress invoice without tasks', () => {
    expect(() => finalInvoiceCents(1000, [1000])).toThrow(/Nothing is left/);
    expect(() => progressInvoicePlan({ tasks: [], depositPct: 30, depositUncreditedCents: 0, remainingCents: 10 })).toThrow(/No done tasks/);
  });
});

describe('paying', () => {
  it('charges the whole balance unless a smaller part is asked for', () => {
    expect(checkoutAmountCents(56_250)).toBe(56_250);
    expect(checkoutAmountCents(56_250, 20_000)).toBe(20_000);
    expect(() => checkoutAmountCents(56_250, 56_251)).toThrow(/at most the balance/);
    // The hosted service's USD minimum charge of $0.50 (from memory).
    expect(() => checkoutAmountCents(56_250, 49)).toThrow(/at least 50 cents/);
    expect(checkoutAmountCents(30, 30)).toBe(30); // a balance under the minimum can still be settled
    expect(() => checkoutAmountCents(0)).toThrow(/nothing left/);
    expect(() => checkoutAmountCents(100, 10.5)).toThrow(DomainValidationError);
  });

  it('turns an open invoice paid when payments reach the total, and reports an overpayment', () => {
    expect(paymentStanding({ status: 'open', totalCents: 10_000, paymentsCents: [4_000] })).toEqual({ amountPaidCents: 4_000, balanceCents: 6_000, overpaidCents: 0, status: 'open' });
    expect(paymentStanding({ status: 'open', totalCents: 10_000, paymentsCents: [4_000, 6_000] }).status).toBe('paid');
    expect(paymentStanding({ status: 'open', totalCents: 10_000, paymentsCents: [10_000, 10_000] }).overpaidCents).toBe(10_000);
    expect(paymentStanding({ status: 'void', totalCents: 10_000, paymentsCents: [10_000] }).status).toBe('void');
  });
});

describe('receivables', () => {
  // Ageing buckets current / 1–30 / 31–60 / 61–90 / over 90 days past due: common practice, no source.
  it('puts balances in the bucket of their days past due, edges included', () => {
    const today = '2026-06-30';
    expect(ageingBucket('2026-06-30', today)).toBe('current');
    expect(ageingBucket('2026-06-29', today)).toBe('days1to30');
    expect(ageingBucket('2026-05-31', today)).toBe('days1to30'); // 30 days
    expect(ageingBucket('2026-05-30', today)).toBe('days31to60'); // 31 days
    expect(ageingBucket('2026-04-01', today)).toBe('days61to90'); // 90 days
    expect(ageingBucket('2026-03-31', today)).toBe('over90'); // 91 days
  });

  it('sums by bucket, every bucket present, paid invoices left out', () => {
    const rows = ageReceivables(
      [
        { dueOn: '2026-07-15', balanceCents: 100 },
        { dueOn: '2026-06-01', balanceCents: 250 },
        { dueOn: '2026-06-02', balanceCents: 50 },
        { dueOn: '2026-01-01', balanceCents: 0 },
      ],
      '2026-06-30',
    );
    expect(rows.map((r) => r.key)).toEqual(['current', 'days1to30', 'days31to60', 'days61to90', 'over90']);
    expect(rows[0]).toMatchObject({ amountCents: 100, count: 1 });
    expect(rows[1]).toMatchObject({ amountCents: 300, count: 2 });
    expect(rows[4]).toMatchObject({ amountCents: 0, count: 0 });
  });

  it('sets due dates from net terms and reminds at most once a week once past due', () => {
    expect(dueDate('2026-01-15', 30)).toBe('2026-02-14'); // net 30 (calendar arithmetic)
    expect(dueDate('2024-02-15', 14)).toBe('2024-02-29'); // leap year (calendar arithmetic)
    expect(() => dueDate('2026-01-15', -1)).toThrow(/whole number of days/);
    expect(reminderDue({ dueOn: '2026-02-14', today: '2026-02-14', lastReminderOn: null })).toBe(false);
    expect(reminderDue({ dueOn: '2026-02-14', today: '2026-02-15', lastReminderOn: null })).toBe(true);
    expect(reminderDue({ dueOn: '2026-02-14', today: '2026-02-20', lastReminderOn: '2026-02-15' })).toBe(false);
    expect(reminderDue({ dueOn: '2026-02-14', today: '2026-02-22', lastReminderOn: '2026-02-15' })).toBe(true);
  });
});
