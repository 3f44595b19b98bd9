import { describe, expect, it } from 'vitest';
import { proposalTotals } from '../../../../../shared/domain/proposal-totals';
import { ProposalUpdateSchema } from '../../../../../shared/schemas/proposal';
import type { ProposalDto, ProposalLineDto } from '../../../../../shared/schemas/proposal-dto';
import {
  centsToDollarsText,
  checkDraft,
  draftFormFrom,
  groupDraftLines,
  insertIntoGroup,
  lineField,
  newDraftLine,
  serverFieldErrors,
  trimDecimal,
  type DraftForm,
  type DraftLine,
} from '../../../../../src/features/proposals/utils/draft-form';
import { totalsWithOptions } from '../../../../../src/features/proposals/utils/client-totals';

const line = (over: Partial<DraftLine> & { key: string }): DraftLine => ({
  groupLabel: 'Ridge plot',
  unitId: 1,
  prescriptionId: null,
  category: 'labor',
  description: 'Work',
  quantity: '1',
  unit: 'each',
  unitPrice: '10.00',
  taxable: false,
  optional: false,
  ...over,
});

const form = (over: Partial<DraftForm> = {}): DraftForm => ({
  title: 'Habitat plan',
  introduction: '',
  expiresOn: '2027-01-31',
  terms: 'Net 30.',
  taxRatePct: '5.5',
  depositPct: '30',
  discountKind: 'none',
  discountPercent: '',
  discountDollars: '',
  lines: [],
  ...over,
});

const dtoLine = (over: Partial<ProposalLineDto> & { id: number }): ProposalLineDto => ({
  position: 0,
  unitId: 1,
  prescriptionId: null,
  groupLabel: 'Ridge plot',
  category: 'labor',
  description: 'Work',
  quantity: '1.0000',
  unit: 'each',
  unitPriceCents: 1000,
  taxable: false,
  optional: false,
  selected: true,
  included: true,
  amountCents: 0,
  discountCents: 0,
  ...over,
});

const dto = (over: Partial<ProposalDto>): ProposalDto => ({
  id: 1, seriesId: 1, number: 'P-2026-001', version: 1, status: 'draft', propertyId: 1, propertyName: 'Kettle Hollow Farm', clientId: 1, clientName: 'Okonkwo-Larsen Family',
  title: 'Habitat plan', introduction: null, terms: 'Net 30.', currency: 'USD', discount: { kind: 'none' }, taxRatePct: 5.5, depositPct: 30, expiresOn: '2027-01-31',
  lines: [], subtotalCents: 0, discountCents: 0, taxableCents: 0, taxCents: 0, totalCents: 0, depositCents: 0, balanceCents: 0, groups: [], cautions: [],
  sentAt: null, firstViewedAt: null, decidedAt: null, declineReason: null, approval: null, createdAt: '2026-12-01T00:00:00Z', updatedAt: '2026-12-01T00:00:00Z',
  ...over,
});

describe('dollars and decimals in the builder’s inputs', () => {
  it('writes cents as dollar text exactly', () => {
    // 100 cents to the dollar (definition of the US dollar's cent).
    expect(centsToDollarsText(4800)).toBe('48.00');
    expect(centsToDollarsText(123456)).toBe('1234.56');
    expect(centsToDollarsText(5)).toBe('0.05');
    expect(centsToDollarsText(0)).toBe('0.00');
  });

  it('drops trailing zeros of the stored four-decimal quantities', () => {
    // Stored as NUMERIC(14,4) (server migration 0004); "13.8800" is 13.88.
    expect(trimDecimal('13.8800')).toBe('13.88');
    expect(trimDecimal('1.0000')).toBe('1');
    expect(trimDecimal('0.0500')).toBe('0.05');
    expect(trimDecimal('250')).toBe('250');
  });

  it('reads a saved draft into the form and back into the same PATCH body', () => {
    const p = dto({
      discount: { kind: 'fixed', amountCents: 2550 },
      lines: [dtoLine({ id: 41, quantity: '2.3700', unitPriceCents: 4550, taxable: true, unit: 'acre' }), dtoLine({ id: 42, optional: true, selected: false, included: false })],
    });
    const f = draftFormFrom(p);
    expect(f.lines.map((l) => [l.quantity, l.unitPrice])).toEqual([['2.37', '45.50'], ['1', '10.00']]);
    expect(f.discountDollars).toBe('25.50');
    const { input, errors } = checkDraft(f);
    expect(errors).toEqual({});
    // The body passes the API's own schema (shared/schemas/proposal.ts).
    const parsed = ProposalUpdateSchema.parse(input);
    expect(parsed.lines?.map((l) => [l.quantity, l.unitPriceCents, l.taxable, l.optional])).toEqual([['2.37', 4550, true, false], ['1', 1000, false, true]]);
    expect(parsed.discount).toEqual({ kind: 'fixed', amountCents: 2550 });
    expect(parsed.taxRatePct).toBe(5.5);
  });
});

describe('live totals while editing a draft', () => {
  it('prices a worked example: half-up line, percent discount by largest remainder, tax on the taxable net, deposit', () => {
    // Worked example, computed by hand with the rule in shared/domain/proposal-totals.ts:
    // 2.37 acre × $45.50 = $107.835 → 10,784 ¢ (half up); 3 h × $48.00 = 14,400 ¢; subtotal 25,184 ¢.
    // 10 % discount = 2,518.4 → 2,518 ¢; shares 1,078.23 and 1,439.77 → 1,078 and 1,440 (largest remainder).
    // Taxable net 10,784 − 1,078 = 9,706 ¢; 5.5 % = 533.83 → 534 ¢. Total 25,184 − 2,518 + 534 = 23,200 ¢.
    // Deposit 30 % = 6,960 ¢; balance 16,240 ¢. The optional $250 line is offered, not counted.
    const { totals, errors } = checkDraft(
      form({
        discountKind: 'percent',
        discountPercent: '10',
        lines: [
          line({ key: 'a', quantity: '2.37', unitPrice: '45.50', taxable: true, unit: 'acre' }),
          line({ key: 'b', quantity: '3', unitPrice: '$48', unit: 'hour' }),
          line({ key: 'c', unitPrice: '250', optional: true }),
        ],
      }),
    );
    expect(errors).toEqual({});
    expect(totals?.lines.map((l) => l.amountCents)).toEqual([10784, 14400, 25000]);
    expect(totals?.lines.map((l) => l.included)).toEqual([true, true, false]);
    expect(totals?.lines.map((l) => l.discountCents)).toEqual([1078, 1440, 0]);
    expect(totals).toMatchObject({ subtotalCents: 25184, discountCents: 2518, taxableCents: 9706, taxCents: 534, totalCents: 23200, depositCents: 6960, balanceCents: 16240 });
  });

  it('gives the discount’s odd cent to the same line the server will after saving', () => {
    // Two equal lines and a 1 ¢ fixed discount: the cent goes to the lower id (tie-break of
    // allocateByLargestRemainder, shared/domain/money.ts). Only the first line is taxable, so the
    // tax base shows which line got it. After saving, the server's ids rise in line order.
    const f = form({ discountKind: 'fixed', discountDollars: '0.01', taxRatePct: '10', lines: [line({ key: 'new-7', unitPrice: '5.00', taxable: true }), line({ key: 'id-3', unitPrice: '5.00' })] });
    const browser = checkDraft(f).totals;
    const server = proposalTotals({
      lines: f.lines.map((l, i) => ({ id: `line-${String(900 + i).padStart(9, '0')}`, quantity: l.quantity, unitPriceCents: 500, taxable: l.taxable, optional: false, selected: true, category: l.category })),
      discount: { kind: 'fixed', amountCents: 1 },
      taxRatePct: '10.0000',
    });
    expect(browser?.taxableCents).toBe(499);
    expect(browser?.taxableCents).toBe(server.taxableCents);
    expect(browser?.totalCents).toBe(server.totalCents);
  });

  it('keeps showing totals while a description is empty, and names the line’s problem', () => {
    const { totals, errors, input } = checkDraft(form({ lines: [line({ key: 'x', description: '  ' })] }));
    expect(errors).toEqual({ [lineField('x', 'description')]: 'Describe the line.' });
    expect(input).toBeNull();
    expect(totals?.subtotalCents).toBe(1000);
  });

  it('refuses prices and quantities it cannot price exactly, saying what to change', () => {
    const { totals, errors } = checkDraft(form({ lines: [line({ key: 'p', unitPrice: '12.345' }), line({ key: 'q', quantity: '-2' }), line({ key: 'r', quantity: '1.23456' })] }));
    expect(totals).toBeNull();
    expect(errors[lineField('p', 'unitPrice')]).toMatch(/more than two decimal places/);
    expect(errors[lineField('q', 'quantity')]).toMatch(/no sign/);
    expect(errors[lineField('r', 'quantity')]).toMatch(/at most 4 decimals/);
  });

  it('still prices the lines that parse when another line blocks the totals', () => {
    // 2 × $10.00 = 2,000 ¢ (by hand); the other line's price is missing.
    const { totals, lineAmounts, errors } = checkDraft(form({ lines: [line({ key: 'ok', quantity: '2' }), line({ key: 'no', unitPrice: '' })] }));
    expect(totals).toBeNull();
    expect(lineAmounts.get('ok')).toBe(2000);
    expect(lineAmounts.has('no')).toBe(false);
    expect(errors[lineField('no', 'unitPrice')]).toBe('Unit price is missing.');
  });

  it('holds text to the API schema’s limits before sending', () => {
    // Limits of ProposalLineInputSchema (shared/schemas/proposal.ts): unit ≤ 40, description ≤ 300 characters.
    const { errors } = checkDraft(form({ lines: [line({ key: 'u', unit: 'x'.repeat(41), description: 'd'.repeat(301) })] }));
    expect(errors[lineField('u', 'unit')]).toMatch(/40 characters/);
    expect(errors[lineField('u', 'description')]).toMatch(/300 characters \(it has 301\)/);
    expect(checkDraft(form({ lines: [line({ key: 'u', unit: 'x'.repeat(40) })] })).errors).toEqual({});
  });

  it('refuses a tax rate above the domain’s guard and a fixed discount above the subtotal', () => {
    // MAX_TAX_RATE_PCT = 30 (shared/domain/proposal-totals.ts, common practice, no source).
    expect(checkDraft(form({ taxRatePct: '72.5' })).errors.taxRatePct).toMatch(/more than 30 %/);
    const { errors } = checkDraft(form({ discountKind: 'fixed', discountDollars: '20', lines: [line({ key: 'a' })] }));
    expect(errors.discount).toMatch(/larger than the subtotal/);
  });
});

describe('editing the lines of a group', () => {
  it('adds a line after the last line of its group, and groups keep their order', () => {
    const lines = [line({ key: 'a', groupLabel: 'Ridge plot' }), line({ key: 'b', groupLabel: 'Hollow plot' }), line({ key: 'c', groupLabel: 'Ridge plot' }), line({ key: 'd', groupLabel: 'Hollow plot' })];
    const next = insertIntoGroup(lines, newDraftLine('n', 'Ridge plot', 1));
    expect(next.map((l) => l.key)).toEqual(['a', 'b', 'c', 'n', 'd']);
    expect(insertIntoGroup(lines, newDraftLine('z', 'Fencing')).map((l) => l.key)).toEqual(['a', 'b', 'c', 'd', 'z']);
    expect(groupDraftLines(next).map((g) => [g.label, g.items.map((i) => i.index)])).toEqual([
      ['Ridge plot', [0, 2, 3]],
      ['Hollow plot', [1, 4]],
    ]);
  });
});

describe('the API’s 422 answers beside the inputs', () => {
  const f = form({ lines: [line({ key: 'id-1' }), line({ key: 'id-2' })] });
  it('maps zod paths of lines to the line’s input', () => {
    const errors = serverFieldErrors(f, 'Please correct the form — …', [
      { path: 'lines.1.unitPriceCents', message: 'prices are whole cents' },
      { path: 'discount.percent', message: 'Discount cannot be more than 100 %' },
      { path: 'title', message: 'Too small' },
    ]);
    expect(errors).toEqual({ [lineField('id-2', 'unitPrice')]: 'prices are whole cents', discount: 'Discount cannot be more than 100 %', title: 'Too small' });
  });
  it('reads the field from the message when there are no details', () => {
    expect(serverFieldErrors(f, 'expiresOn: the valid-until date has passed. Set a later date, then send.', undefined)).toEqual({
      expiresOn: 'the valid-until date has passed. Set a later date, then send.',
    });
    expect(serverFieldErrors(f, 'Add at least one line before sending the proposal.', undefined)).toEqual({});
  });
});

describe('the landowner’s options', () => {
  it('adds a ticked option to the totals, by the same rule the server applies on approval', () => {
    // Worked example by hand: 4 × $25.00 taxable = 10,000 ¢; tax 5.5 % = 550 ¢; total 10,550 ¢;
    // deposit 30 % = 3,165 ¢. With the $250 taxable option: 35,000 ¢; tax 1,925 ¢; total 36,925 ¢;
    // deposit 11,077.5 → 11,078 ¢ (round half up, shared/domain/money.ts).
    const p = dto({
      status: 'sent',
      lines: [dtoLine({ id: 7, quantity: '4.0000', unitPriceCents: 2500, taxable: true }), dtoLine({ id: 9, unitPriceCents: 25000, taxable: true, optional: true, selected: false, included: false })],
    });
    expect(totalsWithOptions(p, new Set())).toMatchObject({ subtotalCents: 10000, taxCents: 550, totalCents: 10550, depositCents: 3165, balanceCents: 7385 });
    expect(totalsWithOptions(p, new Set([9]))).toMatchObject({ subtotalCents: 35000, taxCents: 1925, totalCents: 36925, depositCents: 11078, balanceCents: 25847 });
  });
});
