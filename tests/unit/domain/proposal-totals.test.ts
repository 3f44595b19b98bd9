import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';
import {
  canonicalProposalContent,
  invoiceTotals,
  proposalTotals,
  type OrderDiscount,
  type PlanSnapshot,
  type ProposalContentInput,
  type ProposalLineInput,
  type ProposalPricingInput,
} from '../../../shared/domain/proposal-totals';

const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

/** Catches the error a call throws, so tests can check its class and field. */
function thrown(fn: () => unknown): unknown {
  try {
    fn();
  } catch (error) {
    return error;
  }
  throw new Error('expected the call to throw');
}

function expectField(fn: () => unknown, field: string): void {
  const error = thrown(fn);
  expect(error).toBeInstanceOf(DomainValidationError);
  expect((error as DomainValidationError).field).toBe(field);
  expect((error as DomainValidationError).message.length).toBeGreaterThan(10);
}

// ---------------------------------------------------------------------------------------------
// Generators (invented data; the properties are the check, not the values).

const scaledToDecimal = (scaled: number): string => `${Math.floor(scaled / 10_000)}.${String(scaled % 10_000).padStart(4, '0')}`;

const quantityArb = fc.integer({ min: 0, max: 100_000_000 }).chain((scaled) =>
  fc.constantFrom<number | string>(scaled / 10_000, scaledToDecimal(scaled)),
);

const lineArb = (id: string): fc.Arbitrary<ProposalLineInput> =>
  fc.record({
    id: fc.constant(id),
    quantity: quantityArb,
    unitPriceCents: fc.integer({ min: 0, max: 10_000_000 }),
    taxable: fc.boolean(),
    optional: fc.boolean(),
    selected: fc.option(fc.boolean(), { nil: undefined }),
    category: fc.constantFrom('labor', 'seed', 'lime', 'equipment'),
  });

const linesArb: fc.Arbitrary<ProposalLineInput[]> = fc
  .integer({ min: 0, max: 12 })
  .chain((count) => fc.tuple(...Array.from({ length: count }, (_, i) => lineArb(`line-${i}`))))
  .map((lines) => [...lines]);

const percentArb = (maxPct: number): fc.Arbitrary<string> =>
  fc.integer({ min: 0, max: maxPct * 10_000 }).map(scaledToDecimal);

/** Discount kinds; a fixed discount is drawn as a per-mille share of the subtotal so it is valid. */
const discountSpecArb = fc.oneof(
  fc.constant({ kind: 'none' as const }),
  fc.record({ kind: fc.constant('percent' as const), percent: percentArb(100) }),
  fc.record({ kind: fc.constant('fixed' as const), perMille: fc.integer({ min: 0, max: 1000 }) }),
);

type DiscountSpec = { kind: 'none' } | { kind: 'percent'; percent: string } | { kind: 'fixed'; perMille: number };

function buildInput(lines: ProposalLineInput[], spec: DiscountSpec, taxRatePct: string, depositPct: string): ProposalPricingInput {
  let discount: OrderDiscount = spec.kind === 'fixed' ? { kind: 'none' } : spec;
  if (spec.kind === 'fixed') {
    const subtotal = proposalTotals({ lines, taxRatePct: 0 }).subtotalCents;
    discount = { kind: 'fixed', amountCents: Math.floor((subtotal * spec.perMille) / 1000) };
  }
  return { lines, discount, taxRatePct, depositPct };
}

const pricingArb: fc.Arbitrary<ProposalPricingInput> = fc
  .tuple(linesArb, discountSpecArb, percentArb(30), percentArb(100))
  .map(([lines, spec, tax, deposit]) => buildInput(lines, spec, tax, deposit));

const RUNS = { numRuns: 300 };

// ---------------------------------------------------------------------------------------------

describe('proposalTotals — worked examples', () => {
  const plotLines: ProposalLineInput[] = [
    { id: 'prep', quantity: 2.37, unitPriceCents: 18_500, taxable: false, optional: false, category: 'labor' },
    { id: 'seed', quantity: 3, unitPriceCents: 6_499, taxable: true, optional: false, category: 'seed' },
    { id: 'lime', quantity: '1.5', unitPriceCents: 6_733, taxable: true, optional: false, category: 'lime' },
    { id: 'mineral', quantity: 1, unitPriceCents: 25_000, taxable: true, optional: true, selected: false, category: 'equipment' },
  ];

  it('prices lines, 7.25 % tax and a 30 % deposit', () => {
    // Worked by hand:
    //   prep 2.37 × 18,500 = 43,845.0 → 43,845 (not taxable)
    //   seed 3 × 6,499     = 19,497
    //   lime 1.5 × 6,733   = 10,099.5 → 10,100 (half cent rounds up)
    //   mineral is optional and not selected: priced (25,000) but not counted
    //   subtotal = 73,442; taxable = 19,497 + 10,100 = 29,597
    //   tax = 29,597 × 0.0725 = 2,145.7825 → 2,146; total = 75,588
    //   deposit = 75,588 × 0.30 = 22,676.4 → 22,676; balance = 52,912
    const totals = proposalTotals({ lines: plotLines, taxRatePct: 7.25, depositPct: 30 });
    expect(totals.lines.map((l) => l.amountCents)).toEqual([43_845, 19_497, 10_100, 25_000]);
    expect(totals.lines.map((l) => l.included)).toEqual([true, true, true, false]);
    expect(totals).toMatchObject({
      subtotalCents: 73_442,
      discountCents: 0,
      taxableCents: 29_597,
      taxCents: 2_146,
      totalCents: 75_588,
      depositCents: 22_676,
      balanceCents: 52_912,
    });
  });

  it('counts an optional line once it is selected', () => {
    // Worked by hand: subtotal 73,442 + 25,000 = 98,442; taxable 29,597 + 25,000 = 54,597;
    // tax = 54,597 × 0.0725 = 3,958.2825 → 3,958; total = 102,400.
    const lines = plotLines.map((l) => (l.id === 'mineral' ? { ...l, selected: true } : l));
    const totals = proposalTotals({ lines, taxRatePct: '7.25' });
    expect(totals).toMatchObject({ subtotalCents: 98_442, taxableCents: 54_597, taxCents: 3_958, totalCents: 102_400, depositCents: 0, balanceCents: 102_400 });
  });

  it('allocates a 5 % discount pro rata and taxes the discounted base', () => {
    // Worked by hand:
    //   discount = 73,442 × 0.05 = 3,672.1 → 3,672
    //   exact shares 3,672 × amount ÷ 73,442:
    //     prep 160,998,840 ÷ 73,442 = 2,192 r 13,976
    //     seed  71,592,984 ÷ 73,442 =   974 r 60,476
    //     lime  37,087,200 ÷ 73,442 =   504 r 72,432
    //   floors sum to 3,670; the 2 cents left go to lime and seed (largest remainders)
    //   → 2,192 / 975 / 505
    //   taxable = (19,497 − 975) + (10,100 − 505) = 28,117; tax = 2,038.4825 → 2,038
    //   total = 73,442 − 3,672 + 2,038 = 71,808; deposit 30 % = 21,542.4 → 21,542; balance 50,266
    const totals = proposalTotals({ lines: plotLines, discount: { kind: 'percent', percent: 5 }, taxRatePct: 7.25, depositPct: 30 });
    expect(totals.lines.map((l) => l.discountCents)).toEqual([2_192, 975, 505, 0]);
    expect(totals.lines.map((l) => l.netCents)).toEqual([41_653, 18_522, 9_595, 25_000]);
    expect(totals).toMatchObject({
      subtotalCents: 73_442,
      discountCents: 3_672,
      taxableCents: 28_117,
      taxCents: 2_038,
      totalCents: 71_808,
      depositCents: 21_542,
      balanceCents: 50_266,
    });
  });

  it('rounds a half-cent tax and a half-cent deposit up', () => {
    // Worked by hand: fixed $10.00 off 3,333 / 3,333 / 3,334 → 333 / 333 / 334;
    // taxable = (3,333 − 333) + (3,334 − 334) = 6,000; tax 7.25 % = 435.0;
    // total = 10,000 − 1,000 + 435 = 9,435; deposit 50 % = 4,717.5 → 4,718; balance 4,717.
    const lines: ProposalLineInput[] = [
      { id: 'a', quantity: 1, unitPriceCents: 3_333, taxable: true, optional: false, category: 'seed' },
      { id: 'b', quantity: 1, unitPriceCents: 3_333, taxable: false, optional: false, category: 'labor' },
      { id: 'c', quantity: 1, unitPriceCents: 3_334, taxable: true, optional: false, category: 'seed' },
    ];
    const totals = proposalTotals({ lines, discount: { kind: 'fixed', amountCents: 1_000 }, taxRatePct: 7.25, depositPct: 50 });
    expect(totals.lines.map((l) => l.discountCents)).toEqual([333, 333, 334]);
    expect(totals).toMatchObject({ taxableCents: 6_000, taxCents: 435, totalCents: 9_435, depositCents: 4_718, balanceCents: 4_717 });

    // Worked by hand: $102.00 taxable at 7.25 % = 739.5 cents → 740.
    const single = proposalTotals({ lines: [{ ...lines[0], unitPriceCents: 10_200 }], taxRatePct: 7.25 });
    expect(single.taxCents).toBe(740);
    expect(single.totalCents).toBe(10_940);
  });

  it('gives an invoice the same totals as the proposal it bills', () => {
    // Same lines, discount and rate as the 5 % example above (worked by hand there).
    const included = plotLines.filter((l) => !l.optional).map(({ optional: _o, selected: _s, ...rest }) => rest);
    const invoice = invoiceTotals(included, 7.25, { kind: 'percent', percent: 5 });
    expect(invoice).toMatchObject({ subtotalCents: 73_442, discountCents: 3_672, taxCents: 2_038, totalCents: 71_808 });
    expect(invoice).not.toHaveProperty('depositCents');
    // Worked by hand: 2 × $12.34 = $24.68, no tax.
    expect(invoiceTotals([{ id: 'x', quantity: 2, unitPriceCents: 1_234, taxable: false, category: 'labor' }], 0).totalCents).toBe(2_468);
  });
});

describe('proposalTotals — validation', () => {
  const line: ProposalLineInput = { id: 'a', quantity: 1, unitPriceCents: 1_000, taxable: true, optional: false, category: 'seed' };

  it('refuses bad quantities, prices and ids with the field named', () => {
    expectField(() => proposalTotals({ lines: [{ ...line, quantity: -1 }], taxRatePct: 0 }), 'lines[0].quantity');
    expectField(() => proposalTotals({ lines: [{ ...line, quantity: '-0.5' }], taxRatePct: 0 }), 'lines[0].quantity');
    expectField(() => proposalTotals({ lines: [{ ...line, quantity: 1.23456 }], taxRatePct: 0 }), 'lines[0].quantity');
    expectField(() => proposalTotals({ lines: [{ ...line, quantity: 'two' }], taxRatePct: 0 }), 'lines[0].quantity');
    expectField(() => proposalTotals({ lines: [{ ...line, quantity: Number.NaN }], taxRatePct: 0 }), 'lines[0].quantity');
    expectField(() => proposalTotals({ lines: [line, { ...line, id: 'b', unitPriceCents: 10.5 }], taxRatePct: 0 }), 'lines[1].unitPriceCents');
    expectField(() => proposalTotals({ lines: [{ ...line, unitPriceCents: -100 }], taxRatePct: 0 }), 'lines[0].unitPriceCents');
    expectField(() => proposalTotals({ lines: [line, line], taxRatePct: 0 }), 'lines[1].id');
    expectField(() => proposalTotals({ lines: [{ ...line, id: ' ' }], taxRatePct: 0 }), 'lines[0].id');
  });

  it('refuses a discount larger than the subtotal and rates out of range', () => {
    expectField(() => proposalTotals({ lines: [line], discount: { kind: 'fixed', amountCents: 1_001 }, taxRatePct: 0 }), 'discount.amountCents');
    expectField(() => proposalTotals({ lines: [line], discount: { kind: 'fixed', amountCents: 99.5 }, taxRatePct: 0 }), 'discount.amountCents');
    expectField(() => proposalTotals({ lines: [line], discount: { kind: 'percent', percent: 100.01 }, taxRatePct: 0 }), 'discount.percent');
    expectField(() => proposalTotals({ lines: [line], discount: { kind: 'percent', percent: -5 }, taxRatePct: 0 }), 'discount.percent');
    expectField(() => proposalTotals({ lines: [line], taxRatePct: -1 }), 'taxRatePct');
    expectField(() => proposalTotals({ lines: [line], taxRatePct: 72.5 }), 'taxRatePct'); // typo guard, common practice, no source
    expectField(() => proposalTotals({ lines: [line], taxRatePct: 7.25, depositPct: 101 }), 'depositPct');
    // A fixed discount on a proposal whose only line is an unselected option exceeds the 0 subtotal.
    expectField(
      () => proposalTotals({ lines: [{ ...line, optional: true }], discount: { kind: 'fixed', amountCents: 1 }, taxRatePct: 0 }),
      'discount.amountCents',
    );
  });

  it('accepts a discount equal to the subtotal and an empty proposal', () => {
    // Worked by hand: 100 % off leaves 0 to tax and pay.
    const free = proposalTotals({ lines: [line], discount: { kind: 'percent', percent: 100 }, taxRatePct: 7.25, depositPct: 50 });
    expect(free).toMatchObject({ discountCents: 1_000, taxCents: 0, totalCents: 0, depositCents: 0 });
    expect(proposalTotals({ lines: [], taxRatePct: 7.25 }).totalCents).toBe(0);
  });
});

describe('proposalTotals — properties', () => {
  it('line amounts of the included lines add up to the subtotal', () => {
    fc.assert(
      fc.property(pricingArb, (input) => {
        const t = proposalTotals(input);
        expect(t.lines.filter((l) => l.included).reduce((s, l) => s + l.amountCents, 0)).toBe(t.subtotalCents);
      }),
      RUNS,
    );
  });

  it('line amounts are within half a cent of quantity × price, halves rounded up', () => {
    fc.assert(
      fc.property(pricingArb, (input) => {
        for (const l of proposalTotals(input).lines) {
          const exactTimes10k = BigInt(l.quantityTenThousandths) * BigInt(l.unitPriceCents);
          const diff = BigInt(l.amountCents) * 10_000n - exactTimes10k; // in 1/10,000 cent
          expect(diff > -5_000n && diff <= 5_000n).toBe(true);
        }
      }),
      RUNS,
    );
  });

  it('allocated discounts add up exactly to the discount, none negative, none above its line', () => {
    fc.assert(
      fc.property(pricingArb, (input) => {
        const t = proposalTotals(input);
        expect(t.lines.reduce((s, l) => s + l.discountCents, 0)).toBe(t.discountCents);
        for (const l of t.lines) {
          expect(l.discountCents).toBeGreaterThanOrEqual(0);
          expect(l.discountCents).toBeLessThanOrEqual(l.amountCents);
          if (!l.included) expect(l.discountCents).toBe(0);
          // Pro rata: within one cent of the exact share.
          if (l.included && t.subtotalCents > 0) {
            const exact = (t.discountCents * l.amountCents) / t.subtotalCents;
            expect(Math.abs(l.discountCents - exact)).toBeLessThan(1 + 1e-9);
          }
        }
      }),
      RUNS,
    );
  });

  it('total = subtotal − discount + tax, deposit + balance = total, all integer cents', () => {
    fc.assert(
      fc.property(pricingArb, (input) => {
        const t = proposalTotals(input);
        expect(t.totalCents).toBe(t.subtotalCents - t.discountCents + t.taxCents);
        expect(t.depositCents + t.balanceCents).toBe(t.totalCents);
        const values = [t.subtotalCents, t.discountCents, t.taxableCents, t.taxCents, t.totalCents, t.depositCents, t.balanceCents];
        for (const l of t.lines) values.push(l.amountCents, l.discountCents, l.netCents);
        for (const v of values) expect(Number.isSafeInteger(v) && !Object.is(v, -0)).toBe(true);
        expect(t.balanceCents).toBeGreaterThanOrEqual(0);
      }),
      RUNS,
    );
  });

  it('tax is within half a cent of taxable base × rate, and zero when no line is taxable', () => {
    fc.assert(
      fc.property(pricingArb, fc.boolean(), (input, stripTax) => {
        const lines = stripTax ? input.lines.map((l) => ({ ...l, taxable: false })) : input.lines;
        const t = proposalTotals({ ...input, lines });
        const rateScaled = BigInt(Math.round(Number(input.taxRatePct) * 10_000)); // generator uses 4 decimals
        const diff = BigInt(t.taxCents) * 1_000_000n - BigInt(t.taxableCents) * rateScaled;
        expect(diff > -500_000n && diff <= 500_000n).toBe(true);
        if (stripTax) {
          expect(t.taxableCents).toBe(0);
          expect(t.taxCents).toBe(0);
        }
      }),
      RUNS,
    );
  });

  it('gives the same totals and line results in any line order', () => {
    const arb = pricingArb.chain((input) =>
      fc.tuple(fc.constant(input), fc.shuffledSubarray([...input.lines], { minLength: input.lines.length, maxLength: input.lines.length })),
    );
    fc.assert(
      fc.property(arb, ([input, shuffled]) => {
        const a = proposalTotals(input);
        const b = proposalTotals({ ...input, lines: shuffled });
        const { lines: linesA, ...totalsA } = a;
        const { lines: linesB, ...totalsB } = b;
        expect(totalsB).toEqual(totalsA);
        const byId = (ls: typeof linesA) => Object.fromEntries(ls.map((l) => [l.id, [l.amountCents, l.discountCents]]));
        expect(byId(linesB)).toEqual(byId(linesA));
      }),
      RUNS,
    );
  });
});

describe('canonicalProposalContent', () => {
  const base: ProposalContentInput = {
    lines: [
      { id: 'seed', quantity: 3, unitPriceCents: 6_499, taxable: true, optional: false, category: 'seed', description: 'Clover blend', unit: 'bag' },
      { id: 'prep', quantity: '2.37', unitPriceCents: 18_500, taxable: false, optional: false, category: 'labor' },
      { id: 'gate', quantity: 1, unitPriceCents: 25_000, taxable: true, optional: true, selected: true, category: 'equipment' },
    ],
    discount: { kind: 'percent', percent: 5 },
    taxRatePct: 7.25,
    depositPct: 30,
    terms: 'Work weather permitting.\nDeposit due on approval.',
  };

  it('writes sorted keys, fixed-decimal strings and lines sorted by id', () => {
    const small: ProposalContentInput = {
      lines: [{ id: 'a', quantity: 1.5, unitPriceCents: 101, taxable: true, optional: false, category: 'seed' }],
      taxRatePct: 7.25,
      terms: 'Net 30',
    };
    // Worked by hand: 1.5 × 101 = 151.5 → 152; tax 152 × 0.0725 = 11.02 → 11; total 163.
    expect(canonicalProposalContent(small)).toBe(
      '{"currency":"USD","depositPct":"0.0000","discount":{"kind":"none"},' +
        '"lines":[{"amountCents":152,"category":"seed","description":null,"discountCents":0,"id":"a","optional":false,' +
        '"quantity":"1.5000","selected":null,"taxable":true,"unit":null,"unitPriceCents":101}],' +
        '"taxRatePct":"7.2500","terms":"Net 30",' +
        '"totals":{"balanceCents":163,"depositCents":0,"discountCents":0,"subtotalCents":152,"taxCents":11,"taxableCents":152,"totalCents":163},' +
        '"version":1}',
    );
    expect(() => JSON.parse(canonicalProposalContent(base))).not.toThrow();
  });

  it('does not change with line order, number spelling or line-end style (order is not priced)', () => {
    const reordered = { ...base, lines: [...base.lines].reverse() };
    const respelled = {
      ...base,
      taxRatePct: '7.2500',
      depositPct: '30',
      lines: base.lines.map((l) => (l.id === 'prep' ? { ...l, quantity: 2.37 } : l.id === 'seed' ? { ...l, quantity: '3.0' } : l)),
      terms: base.terms.replace(/\n/g, '\r\n'),
    };
    const hash = sha256(canonicalProposalContent(base));
    expect(sha256(canonicalProposalContent(reordered))).toBe(hash);
    expect(sha256(canonicalProposalContent(respelled))).toBe(hash);
  });

  it('changes when any priced field or the terms change', () => {
    const hash = sha256(canonicalProposalContent(base));
    const withLine = (id: string, patch: Partial<ProposalLineInput>): ProposalContentInput => ({
      ...base,
      lines: base.lines.map((l) => (l.id === id ? { ...l, ...patch } : l)),
    });
    const variants: Record<string, ProposalContentInput> = {
      quantity: withLine('prep', { quantity: '2.3701' }),
      unitPriceCents: withLine('seed', { unitPriceCents: 6_500 }),
      taxable: withLine('prep', { taxable: true }),
      optional: withLine('seed', { optional: true, selected: true }),
      selected: withLine('gate', { selected: false }),
      category: withLine('seed', { category: 'seed-mix' }),
      description: withLine('seed', { description: 'Clover blend, inoculated' }),
      unit: withLine('seed', { unit: 'lb' }),
      lineId: { ...base, lines: base.lines.map((l) => (l.id === 'gate' ? { ...l, id: 'gate-2' } : l)) },
      addedLine: { ...base, lines: [...base.lines, { id: 'z', quantity: 0, unitPriceCents: 0, taxable: false, optional: false, category: 'labor' }] },
      discountPercent: { ...base, discount: { kind: 'percent', percent: 5.0001 } },
      discountKind: { ...base, discount: { kind: 'fixed', amountCents: 3_672 } },
      taxRatePct: { ...base, taxRatePct: 7.2501 },
      depositPct: { ...base, depositPct: 25 },
      currency: { ...base, currency: 'CAD' },
      terms: { ...base, terms: `${base.terms} ` },
    };
    const hashes = new Set([hash]);
    for (const [name, variant] of Object.entries(variants)) {
      const variantHash = sha256(canonicalProposalContent(variant));
      expect(variantHash, name).not.toBe(hash);
      hashes.add(variantHash);
    }
    expect(hashes.size).toBe(Object.keys(variants).length + 1);
  });

  it('changes under a random change of one priced field (property)', () => {
    type Mutation = (p: ProposalContentInput) => ProposalContentInput | null;
    const onFirstLine = (patch: (l: ProposalLineInput) => Partial<ProposalLineInput> | null): Mutation => (p) => {
      if (p.lines.length === 0) return null;
      const change = patch(p.lines[0]);
      return change ? { ...p, lines: [{ ...p.lines[0], ...change }, ...p.lines.slice(1)] } : null;
    };
    const mutations: Mutation[] = [
      onFirstLine((l) => ({ quantity: scaledToDecimal(Math.round(Number(l.quantity) * 10_000) + 1) })),
      onFirstLine((l) => ({ unitPriceCents: l.unitPriceCents + 1 })),
      onFirstLine((l) => ({ taxable: !l.taxable })),
      onFirstLine((l) => (l.optional ? { selected: !(l.selected === true) } : null)),
      onFirstLine((l) => ({ category: `${l.category}-x` })),
      (p) => ({ ...p, taxRatePct: Number(p.taxRatePct) < 30 ? scaledToDecimal(Math.round(Number(p.taxRatePct) * 10_000) + 1) : '0' }),
      (p) => ({ ...p, depositPct: Number(p.depositPct ?? 0) < 100 ? scaledToDecimal(Math.round(Number(p.depositPct ?? 0) * 10_000) + 1) : '0' }),
      (p) => ({ ...p, terms: `${p.terms}.` }),
    ];
    const arb = fc.tuple(
      fc.tuple(linesArb, fc.oneof(fc.constant({ kind: 'none' as const }), fc.record({ kind: fc.constant('percent' as const), percent: percentArb(100) })), percentArb(30), percentArb(100)),
      fc.string(),
      fc.integer({ min: 0, max: mutations.length - 1 }),
    );
    fc.assert(
      fc.property(arb, ([[lines, discount, tax, deposit], terms, which]) => {
        const proposal: ProposalContentInput = { lines, discount, taxRatePct: tax, depositPct: deposit, terms };
        const mutated = mutations[which](proposal);
        fc.pre(mutated !== null);
        expect(sha256(canonicalProposalContent(mutated!))).not.toBe(sha256(canonicalProposalContent(proposal)));
      }),
      RUNS,
    );
  });

  it('refuses content that cannot be priced', () => {
    expectField(() => canonicalProposalContent({ ...base, terms: undefined as unknown as string }), 'terms');
    expectField(() => canonicalProposalContent({ ...base, currency: 'usd' }), 'currency');
    expectField(() => canonicalProposalContent({ ...base, taxRatePct: 'seven' }), 'taxRatePct');
  });
});

describe('the plan in the approval fingerprint', () => {
  const content: ProposalContentInput = {
    lines: [{ id: 'a', quantity: 1.5, unitPriceCents: 101, taxable: true, optional: false, category: 'seed' }],
    taxRatePct: 7.25,
    terms: 'Net 30',
  };
  const square = (lon: number, lat: number, d: number) => ({ type: 'Polygon', coordinates: [[[lon, lat], [lon + d, lat], [lon + d, lat + d], [lon, lat + d], [lon, lat]]] });
  const plan: PlanSnapshot = {
    property: { name: 'Coulee Bend', acres: 120, boundary: square(-90.94, 43.26, 0.01) },
    units: [
      { id: 7, name: 'North plot', kind: 'food-plot', geometry: square(-90.938, 43.2655, 0.001), acres: 2.4, lengthFt: null },
      { id: 9, name: 'Oak slope', kind: 'timber', geometry: square(-90.936, 43.2655, 0.002), acres: 9.1, lengthFt: null },
    ],
  };

  it('covers the boundary and every unit’s shape, as version 2 with coordinates to seven decimals', () => {
    const text = canonicalProposalContent({ ...content, plan });
    const parsed = JSON.parse(text);
    expect(parsed.version).toBe(2);
    expect(parsed.plan.units.map((u: { id: number }) => u.id)).toEqual([7, 9]);
    expect(parsed.plan.units[0].geometry.coordinates[0][0]).toEqual(['-90.9380000', '43.2655000']);
    // Without a plan the content stays the version-1 text, so approvals made before plans were frozen still verify.
    expect(JSON.parse(canonicalProposalContent(content)).version).toBe(1);
  });

  it('changes when a unit is added or a corner moves by a few centimetres, not when units are listed in another order', () => {
    const hash = sha256(canonicalProposalContent({ ...content, plan }));
    const added: PlanSnapshot = { ...plan, units: [...plan.units, { id: 12, name: 'Stand 4', kind: 'stand-site', geometry: { type: 'Point', coordinates: [-90.935, 43.266] }, acres: null, lengthFt: null }] };
    expect(sha256(canonicalProposalContent({ ...content, plan: added }))).not.toBe(hash);
    // 1e-6° of longitude at 43°N is about 8 cm (111.32 km × cos 43° per degree; from memory).
    const moved: PlanSnapshot = { ...plan, units: [{ ...plan.units[0], geometry: square(-90.938001, 43.2655, 0.001) }, plan.units[1]] };
    expect(sha256(canonicalProposalContent({ ...content, plan: moved }))).not.toBe(hash);
    expect(sha256(canonicalProposalContent({ ...content, plan: { ...plan, units: [...plan.units].reverse() } }))).toBe(hash);
  });

  it('refuses a plan coordinate that is not a number', () => {
    const bad: PlanSnapshot = { ...plan, units: [{ ...plan.units[0], geometry: { type: 'Point', coordinates: ['x', 1] } }] };
    expect(() => canonicalProposalContent({ ...content, plan: bad })).toThrow(DomainValidationError);
  });
});
