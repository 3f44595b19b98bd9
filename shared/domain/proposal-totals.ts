/**
 * Proposal and invoice totals, exact in integer cents, and the canonical content of a proposal
 * that its approval record hashes.
 *
 * The rule, each step computed in exactly one place (rounding: `roundHalfUpDiv` in ./money):
 * 1. line amount   = round-half-up(quantity × unitPriceCents); quantity has at most 4 decimals and
 *                    is held as an integer of ten-thousandths, so 2.37 acres is 23,700.
 * 2. subtotal      = sum of the included lines' amounts; an optional line is included only when
 *                    `selected` is true. Excluded lines are still priced (to show the option) but
 *                    count nowhere.
 * 3. discount      = the fixed cents, or round-half-up(subtotal × percent); it may not exceed the
 *                    subtotal. It is allocated over the included lines in proportion to their
 *                    amounts by largest remainder, so the line discounts add up exactly to it.
 * 4. taxable base  = sum over taxable included lines of (amount − allocated discount).
 * 5. tax           = round-half-up(taxable base × tax rate).
 * 6. total         = subtotal − discount + tax.
 * 7. deposit       = round-half-up(total × deposit percent); balance = total − deposit.
 */
import type { ProposalTotalsFigures } from '../schemas/proposal-dto';
import { DomainValidationError } from './errors';
import {
  DECIMAL_SCALE,
  allocateByLargestRemainder,
  assertCents,
  centsToNumber,
  formatScaledDecimal,
  percentOfCents,
  roundHalfUpDiv,
  toScaledDecimal,
} from './money';

/** Highest sales-tax rate accepted, in percent: a guard against typing 725 or 72.5 for 7.25 (common practice, no source). */
export const MAX_TAX_RATE_PCT = 30;

/** One priced line of a proposal. `quantity` may be decimal (2.37 acres), at most 4 places. */
export interface ProposalLineInput {
  id: string;
  quantity: number | string;
  unitPriceCents: number;
  taxable: boolean;
  optional: boolean;
  /** Only read for optional lines: the client chose this option. */
  selected?: boolean;
  category: string;
  /** What the line sells, as the client reads it; part of the approved content. */
  description?: string;
  /** The unit the quantity is counted in ("acre", "bag", "hour"); part of the approved content. */
  unit?: string;
}

/** An order-level discount: none, a percentage of the subtotal, or a fixed number of cents. */
export type OrderDiscount =
  | { kind: 'none' }
  | { kind: 'percent'; percent: number | string }
  | { kind: 'fixed'; amountCents: number };

/** What the totals are computed from. Percentages may have up to 4 decimals ("8.875"). */
export interface ProposalPricingInput<L extends ProposalLineInput = ProposalLineInput> {
  lines: readonly L[];
  discount?: OrderDiscount | null;
  /** Sales tax rate in percent, e.g. 7.25. */
  taxRatePct: number | string;
  /** Deposit due on approval, in percent of the total; 0 when omitted. */
  depositPct?: number | string;
}

/** A line with its computed money. `netCents` = amountCents − discountCents. */
export type PricedLine<L extends ProposalLineInput = ProposalLineInput> = L & {
  included: boolean;
  quantityTenThousandths: number;
  amountCents: number;
  discountCents: number;
  netCents: number;
};

/** The totals of a proposal; lines come back in the order given. */
export interface ProposalTotals<L extends ProposalLineInput = ProposalLineInput> extends ProposalTotalsFigures {
  lines: PricedLine<L>[];
}

/** Step 1, the one place a line amount is computed: round-half-up(quantity × unit price) on integers. */
function amountCentsOf(quantityScaled: bigint, unitPriceCents: number, field: string): number {
  return centsToNumber(roundHalfUpDiv(quantityScaled * BigInt(unitPriceCents), DECIMAL_SCALE), field);
}

function quantityOf(quantity: number | string, field: string, label: string): bigint {
  const scaled = toScaledDecimal(quantity, field, label);
  if (scaled > BigInt(Number.MAX_SAFE_INTEGER)) throw new DomainValidationError(field, `${label} is too large.`);
  return scaled;
}

/** Amount of one line in cents: round-half-up(quantity × unit price), computed on integers. */
export function lineAmountCents(quantity: number | string, unitPriceCents: number, field = 'line'): number {
  const quantityScaled = quantityOf(quantity, `${field}.quantity`, 'Quantity');
  assertCents(unitPriceCents, `${field}.unitPriceCents`);
  return amountCentsOf(quantityScaled, unitPriceCents, field);
}

function scaledPercent(value: number | string, field: string, label: string, maxPct: number): bigint {
  const scaled = toScaledDecimal(value, field, label);
  if (scaled > BigInt(maxPct) * DECIMAL_SCALE) {
    throw new DomainValidationError(field, `${label} must be between 0 and ${maxPct} % (got ${value}).`);
  }
  return scaled;
}

function isIncluded(line: ProposalLineInput): boolean {
  return line.optional ? line.selected === true : true;
}

function validateLineShape(line: ProposalLineInput, field: string): void {
  if (line === null || typeof line !== 'object') throw new DomainValidationError(field, 'Each line must be an object.');
  if (typeof line.id !== 'string' || line.id.trim() === '') {
    throw new DomainValidationError(`${field}.id`, 'Each line needs a non-empty id.');
  }
  for (const flag of ['taxable', 'optional'] as const) {
    if (typeof line[flag] !== 'boolean') throw new DomainValidationError(`${field}.${flag}`, `Line "${line.id}": ${flag} must be true or false.`);
  }
  if (line.selected !== undefined && typeof line.selected !== 'boolean') {
    throw new DomainValidationError(`${field}.selected`, `Line "${line.id}": selected must be true or false when given.`);
  }
  if (typeof line.category !== 'string') throw new DomainValidationError(`${field}.category`, `Line "${line.id}": category must be text.`);
  for (const text of ['description', 'unit'] as const) {
    if (line[text] !== undefined && typeof line[text] !== 'string') {
      throw new DomainValidationError(`${field}.${text}`, `Line "${line.id}": ${text} must be text when given.`);
    }
  }
}

/** Subtotal, discount, tax, total, deposit and balance of a proposal, exact in cents (rule in the file header). */
export function proposalTotals<L extends ProposalLineInput>(input: ProposalPricingInput<L>): ProposalTotals<L> {
  if (!input || !Array.isArray(input.lines)) throw new DomainValidationError('lines', 'A proposal needs a list of lines (it may be empty).');
  const taxScaled = scaledPercent(input.taxRatePct, 'taxRatePct', 'Tax rate', MAX_TAX_RATE_PCT);
  const depositScaled = scaledPercent(input.depositPct ?? 0, 'depositPct', 'Deposit', 100);

  // 1. Line amounts; 2. subtotal.
  const seenIds = new Set<string>();
  const priced = input.lines.map((line, index) => {
    const field = `lines[${index}]`;
    validateLineShape(line, field);
    if (seenIds.has(line.id)) throw new DomainValidationError(`${field}.id`, `Line id "${line.id}" appears more than once; ids must be unique.`);
    seenIds.add(line.id);
    const quantityScaled = quantityOf(line.quantity, `${field}.quantity`, `Quantity of line "${line.id}"`);
    assertCents(line.unitPriceCents, `${field}.unitPriceCents`);
    const amountCents = amountCentsOf(quantityScaled, line.unitPriceCents, field);
    return { line, included: isIncluded(line), quantityScaled, amountCents };
  });
  const subtotal = priced.reduce((sum, p) => (p.included ? sum + BigInt(p.amountCents) : sum), 0n);
  const subtotalCents = centsToNumber(subtotal, 'lines');

  // 3. Discount and its allocation.
  const discount = input.discount ?? { kind: 'none' as const };
  let discountCents: number;
  switch (discount.kind) {
    case 'none':
      discountCents = 0;
      break;
    case 'percent':
      discountCents = Number(percentOfCents(subtotal, scaledPercent(discount.percent, 'discount.percent', 'Discount', 100)));
      break;
    case 'fixed':
      assertCents(discount.amountCents, 'discount.amountCents');
      discountCents = discount.amountCents;
      break;
    default:
      throw new DomainValidationError('discount.kind', 'Discount kind must be "none", "percent" or "fixed".');
  }
  if (discountCents > subtotalCents) {
    throw new DomainValidationError(
      'discount.amountCents',
      `The discount (${discountCents} cents) is larger than the subtotal of the included lines (${subtotalCents} cents).`,
    );
  }
  const allocation = allocateByLargestRemainder(
    discountCents,
    priced.filter((p) => p.included).map((p) => ({ key: p.line.id, weight: p.amountCents })),
  );

  // 4. Taxable base; 5. tax; 6. total; 7. deposit and balance.
  const lines = priced.map((p): PricedLine<L> => {
    const lineDiscountCents = p.included ? (allocation.get(p.line.id) ?? 0) : 0;
    return {
      ...p.line,
      included: p.included,
      quantityTenThousandths: Number(p.quantityScaled),
      amountCents: p.amountCents,
      discountCents: lineDiscountCents,
      netCents: p.amountCents - lineDiscountCents,
    };
  });
  const taxable = lines.reduce((sum, l) => (l.included && l.taxable ? sum + BigInt(l.netCents) : sum), 0n);
  const tax = percentOfCents(taxable, taxScaled);
  const total = subtotal - BigInt(discountCents) + tax;
  const deposit = percentOfCents(total, depositScaled);
  return {
    lines,
    subtotalCents,
    discountCents,
    taxableCents: centsToNumber(taxable, 'lines'),
    taxCents: centsToNumber(tax, 'taxRatePct'),
    totalCents: centsToNumber(total, 'lines'),
    depositCents: centsToNumber(deposit, 'depositPct'),
    balanceCents: centsToNumber(total - deposit, 'depositPct'),
  };
}

/** One line of an invoice; priced like a proposal line that is always included. */
export type InvoiceLineInput = Omit<ProposalLineInput, 'optional' | 'selected'>;

/** Totals of an invoice: those of a proposal without deposit and balance. */
export type InvoiceTotals<L extends InvoiceLineInput = InvoiceLineInput> = Omit<
  ProposalTotals<L & { optional: false }>,
  'depositCents' | 'balanceCents'
>;

/** Totals of an invoice (no options, no deposit) by the same rule and code as proposals. */
export function invoiceTotals<L extends InvoiceLineInput>(
  lines: readonly L[],
  taxRatePct: number | string,
  discount: OrderDiscount | null = null,
): InvoiceTotals<L> {
  if (!Array.isArray(lines)) throw new DomainValidationError('lines', 'An invoice needs a list of lines (it may be empty).');
  const totals = proposalTotals({
    lines: lines.map((line) => ({ ...line, optional: false as const })),
    discount,
    taxRatePct,
    depositPct: 0,
  });
  return {
    lines: totals.lines,
    subtotalCents: totals.subtotalCents,
    discountCents: totals.discountCents,
    taxableCents: totals.taxableCents,
    taxCents: totals.taxCents,
    totalCents: totals.totalCents,
  };
}

/** A GeoJSON geometry as the plan stores it (any type; coordinates in degrees, WGS84). */
export interface PlanGeometry {
  type: string;
  coordinates?: unknown;
  geometries?: PlanGeometry[];
}

/**
 * The plan a proposal was sent with: the property's boundary and every unit, frozen with the
 * version so its document reads the same forever (units drawn later are not part of it).
 */
export interface PlanSnapshot {
  property: { name: string; acres: number | null; boundary: PlanGeometry | null; locality?: string | null };
  units: { id: number; name: string; kind: string; geometry: PlanGeometry; acres: number | null; lengthFt: number | null }[];
  /** What the document showed beside the plan when sent: names, unit groups with their summaries, cautions. Not hashed (the lines and plan are). */
  context?: {
    clientName: string;
    groups: { unitId: number | null; label: string; kind: string | null; acres: number | null; lengthFt: number | null; summaries: string[] }[];
    cautions: { id: string; title: string; text: string }[];
  };
  /** The firm's profile as printed when sent (name, contact lines, licence numbers, logo's storage key). Not hashed. */
  firm?: { name: string; phone?: string | null; email?: string | null; address?: string | null; website?: string | null; licenceNumbers?: string | null; logoKey?: string | null };
  /** Aerial photos marked "print under the plan" when sent: a print-size copy kept under its own storage key. Not hashed. */
  overlays?: { name: string; corners: [number, number][]; opacity: number; printKey: string }[];
}

/** The proposal fields the approval record covers. */
export interface ProposalContentInput extends ProposalPricingInput {
  /** The terms and conditions the client approves, as shown. */
  terms: string;
  /** ISO 4217 code; "USD" when omitted. */
  currency?: string;
  /** The plan's geometry as sent; when given, the content (format version 2) covers it too. */
  plan?: PlanSnapshot | null;
}

/** Version of the canonical content format; bump it when the format changes. Version 1 is the same content without the plan. */
export const CANONICAL_PROPOSAL_CONTENT_VERSION = 2;

type CanonicalValue = string | number | boolean | null | CanonicalValue[] | { [key: string]: CanonicalValue };

function canonicalJson(value: CanonicalValue): string {
  if (value === null || typeof value === 'boolean' || typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') {
    if (!Number.isSafeInteger(value)) throw new RangeError(`canonical content holds only safe integers, got ${value}`);
    return String(value);
  }
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const keys = Object.keys(value).sort();
  return `{${keys.map((key) => `${JSON.stringify(key)}:${canonicalJson(value[key])}`).join(',')}}`;
}

function canonicalText(text: string): string {
  return text.replace(/\r\n?/g, '\n').normalize('NFC');
}

/** Coordinates as fixed seven-decimal strings (about 1 cm; canonical JSON holds no fractions). */
function canonicalCoordinates(value: unknown, field: string): CanonicalValue {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new DomainValidationError(field, 'A plan coordinate is not a finite number.');
    const fixed = value.toFixed(7);
    return fixed === '-0.0000000' ? '0.0000000' : fixed;
  }
  if (Array.isArray(value)) return value.map((v) => canonicalCoordinates(v, field));
  throw new DomainValidationError(field, 'A plan geometry has coordinates that are not numbers.');
}

function canonicalGeometry(geometry: PlanGeometry | null, field: string): CanonicalValue {
  if (geometry === null) return null;
  if (geometry.type === 'GeometryCollection') return { type: geometry.type, geometries: (geometry.geometries ?? []).map((g) => canonicalGeometry(g, field)) };
  return { type: geometry.type, coordinates: canonicalCoordinates(geometry.coordinates, field) };
}

/** The canonical form of a plan snapshot: boundary and every unit (by id) with name, kind and shape. */
export function canonicalPlan(plan: PlanSnapshot): CanonicalValue {
  return {
    boundary: canonicalGeometry(plan.property.boundary, 'plan.property.boundary'),
    units: [...plan.units]
      .sort((a, b) => a.id - b.id)
      .map((u) => ({ id: u.id, name: canonicalText(u.name), kind: u.kind, geometry: canonicalGeometry(u.geometry, `plan.units.${u.id}.geometry`) })),
  };
}

/**
 * The canonical JSON of everything a client approves: every priced field of every line, the
 * discount, tax rate, deposit, currency, terms, the computed totals and — from version 2 — the
 * plan's geometry as sent (boundary and units, coordinates to seven decimals). Keys are sorted; integers
 * are plain JSON integers; quantities and percentages are fixed four-decimal strings ("2.3700");
 * text is NFC with LF line ends. Line order is NOT part of the content (lines are sorted by id):
 * reordering lines changes no amount. Hash it with SHA-256 (node:crypto on the server,
 * crypto.subtle in a browser) for the approval record.
 */
export function canonicalProposalContent(proposal: ProposalContentInput): string {
  if (!proposal || typeof proposal.terms !== 'string') {
    throw new DomainValidationError('terms', 'A proposal needs its terms as text (may be empty) before it can be approved.');
  }
  const currency = proposal.currency ?? 'USD';
  if (!/^[A-Z]{3}$/.test(currency)) throw new DomainValidationError('currency', `Currency must be a three-letter ISO 4217 code such as USD (got "${currency}").`);
  const totals = proposalTotals(proposal);
  const discount = proposal.discount ?? { kind: 'none' as const };
  const discountContent: CanonicalValue =
    discount.kind === 'percent'
      ? { kind: 'percent', percent: formatScaledDecimal(toScaledDecimal(discount.percent, 'discount.percent', 'Discount')) }
      : discount.kind === 'fixed'
        ? { kind: 'fixed', amountCents: discount.amountCents }
        : { kind: 'none' };
  const lines = [...totals.lines]
    .sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))
    .map(
      (line): CanonicalValue => ({
        id: line.id,
        quantity: formatScaledDecimal(BigInt(line.quantityTenThousandths)),
        unitPriceCents: line.unitPriceCents,
        taxable: line.taxable,
        optional: line.optional,
        selected: line.optional ? line.selected === true : null,
        category: canonicalText(line.category),
        description: line.description === undefined ? null : canonicalText(line.description),
        unit: line.unit === undefined ? null : canonicalText(line.unit),
        amountCents: line.amountCents,
        discountCents: line.discountCents,
      }),
    );
  return canonicalJson({
    version: proposal.plan ? CANONICAL_PROPOSAL_CONTENT_VERSION : 1,
    ...(proposal.plan ? { plan: canonicalPlan(proposal.plan) } : {}),
    currency,
    lines,
    discount: discountContent,
    taxRatePct: formatScaledDecimal(toScaledDecimal(proposal.taxRatePct, 'taxRatePct', 'Tax rate')),
    depositPct: formatScaledDecimal(toScaledDecimal(proposal.depositPct ?? 0, 'depositPct', 'Deposit')),
    terms: canonicalText(proposal.terms),
    totals: {
      subtotalCents: totals.subtotalCents,
      discountCents: totals.discountCents,
      taxableCents: totals.taxableCents,
      taxCents: totals.taxCents,
      totalCents: totals.totalCents,
      depositCents: totals.depositCents,
      balanceCents: totals.balanceCents,
    },
  });
}
