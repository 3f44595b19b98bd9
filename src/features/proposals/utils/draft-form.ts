/**
 * The proposal builder's form: a draft as people type it (dollars, decimal text), its checks, the
 * PATCH body it becomes, and its live totals by the same rule the server prices with
 * (shared/domain/proposal-totals.ts). Pure: no React, no fetching.
 */
import { LINE_CATEGORIES } from '../../../../shared/schemas/proposal';
import { DomainValidationError } from '../../../../shared/domain/errors';
import { parseDollarsToCents } from '../../../../shared/domain/money';
import { MAX_TAX_RATE_PCT, lineAmountCents, proposalTotals, type OrderDiscount, type ProposalLineInput, type ProposalTotals } from '../../../../shared/domain/proposal-totals';
import type { ProposalUpdateInput } from '../../../../shared/schemas/proposal';
import type { LineCategory, ProposalDto, ProposalLineDto } from '../../../../shared/schemas/proposal-dto';

export type DiscountKind = OrderDiscount['kind'];

export { LINE_CATEGORIES };
export const CATEGORY_LABELS: Record<LineCategory, string> = { materials: 'Materials', labor: 'Labor', equipment: 'Equipment', fees: 'Fees' };

/** Text limits of a line, as in ProposalLineInputSchema (shared/schemas/proposal.ts). */
export const LINE_LIMITS = { descriptionMax: 300, unitMax: 40, groupLabelMax: 120 } as const;

/** Largest unit price the API takes, in cents ($1,000,000.00). */
export const MAX_UNIT_PRICE_CENTS = 100_000_000;

/** One line as typed: the quantity as decimal text, the unit price in dollars. */
export interface DraftLine {
  /** Stable key for the page; not sent. */
  key: string;
  groupLabel: string;
  unitId: number | null;
  prescriptionId: number | null;
  category: LineCategory;
  description: string;
  quantity: string;
  unit: string;
  /** Dollars as typed ("48.00", "$1,250"). */
  unitPrice: string;
  taxable: boolean;
  optional: boolean;
}

/** The whole draft as typed. */
export interface DraftForm {
  title: string;
  introduction: string;
  /** YYYY-MM-DD or empty (no expiry). */
  expiresOn: string;
  terms: string;
  taxRatePct: string;
  depositPct: string;
  discountKind: DiscountKind;
  discountPercent: string;
  /** Dollars as typed. */
  discountDollars: string;
  lines: DraftLine[];
}

/** Problems by field: `title`, `taxRatePct`, `discount`, … and `lines.<key>.<field>` for a line's inputs. */
export type FieldErrors = Record<string, string>;

/** The error key of one input of one line. */
export const lineField = (key: string, field: keyof DraftLine | 'line'): string => `lines.${key}.${field}`;

/** Cents as dollar text for an input: 4800 → "48.00", 123456 → "1234.56" (exact, no float division). */
export function centsToDollarsText(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}

/** A stored four-decimal figure without its trailing zeros: "13.8800" → "13.88", "1.0000" → "1". */
export function trimDecimal(text: string): string {
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}

/** A percentage for an input: 5.5 → "5.5", 30 → "30". */
export const percentText = (pct: number): string => trimDecimal(pct.toFixed(4));

/** The form of a line of the API. */
export function draftLineFrom(line: ProposalLineDto): DraftLine {
  return {
    key: `id-${line.id}`,
    groupLabel: line.groupLabel,
    unitId: line.unitId,
    prescriptionId: line.prescriptionId,
    category: line.category,
    description: line.description,
    quantity: trimDecimal(line.quantity),
    unit: line.unit,
    unitPrice: centsToDollarsText(line.unitPriceCents),
    taxable: line.taxable,
    optional: line.optional,
  };
}

/** The form of a saved draft. */
export function draftFormFrom(p: ProposalDto): DraftForm {
  return {
    title: p.title,
    introduction: p.introduction ?? '',
    expiresOn: p.expiresOn ?? '',
    terms: p.terms,
    taxRatePct: percentText(p.taxRatePct),
    depositPct: percentText(p.depositPct),
    discountKind: p.discount.kind,
    discountPercent: p.discount.kind === 'percent' ? trimDecimal(String(p.discount.percent)) : '',
    discountDollars: p.discount.kind === 'fixed' ? centsToDollarsText(p.discount.amountCents) : '',
    lines: p.lines.map(draftLineFrom),
  };
}

/** A new manual line of a group: one of something, price still to fill in. */
export function newDraftLine(key: string, groupLabel: string, unitId: number | null = null): DraftLine {
  return { key, groupLabel, unitId, prescriptionId: null, category: 'labor', description: '', quantity: '1', unit: 'each', unitPrice: '', taxable: false, optional: false };
}

/** The lines with `line` placed after the last line of its group (or at the end for a new group), so groups stay together. */
export function insertIntoGroup(lines: readonly DraftLine[], line: DraftLine): DraftLine[] {
  let last = -1;
  lines.forEach((l, i) => {
    if (l.groupLabel === line.groupLabel) last = i;
  });
  if (last < 0) return [...lines, line];
  return [...lines.slice(0, last + 1), line, ...lines.slice(last + 1)];
}

/** Lines grouped by their group label, groups in order of first appearance; each keeps its index in the form. */
export function groupDraftLines(lines: readonly DraftLine[]): { label: string; unitId: number | null; items: { line: DraftLine; index: number }[] }[] {
  const groups = new Map<string, { label: string; unitId: number | null; items: { line: DraftLine; index: number }[] }>();
  lines.forEach((line, index) => {
    const group = groups.get(line.groupLabel) ?? { label: line.groupLabel, unitId: line.unitId, items: [] };
    group.items.push({ line, index });
    groups.set(line.groupLabel, group);
  });
  return [...groups.values()];
}

const DECIMAL = /^\d+(\.\d{1,4})?$/;

/** A quantity or percentage as text, or an error a person can act on. */
function decimalError(text: string, label: string, max?: number): string | null {
  const t = text.trim();
  if (t === '') return `${label} is missing.`;
  if (!DECIMAL.test(t)) return `${label} must be a number like 2.5, with at most 4 decimals and no sign.`;
  if (t.split('.')[0].replace(/^0+/, '').length > 10) return `${label} is too large.`;
  if (max !== undefined && Number(t) > max) return `${label} cannot be more than ${max} %.`;
  return null;
}

/** Dollar text as cents, or an error message. */
function dollarsOf(text: string, label: string): { cents: number } | { error: string } {
  if (text.trim() === '') return { error: `${label} is missing.` };
  try {
    const cents = parseDollarsToCents(text);
    if (cents < 0) return { error: `${label} cannot be negative; use the discount for credits.` };
    if (cents > MAX_UNIT_PRICE_CENTS) return { error: `${label} is too large.` };
    return { cents };
  } catch (e) {
    if (e instanceof DomainValidationError) return { error: e.message };
    throw e;
  }
}

/** The line shape the domain prices; ids follow the lines' order exactly as the server's ids will after saving. */
export type PreviewLine = ProposalLineInput & { key: string };

/** What the builder shows and sends. */
export interface DraftCheck {
  /** Field problems found in the browser (empty when the draft can be saved). */
  errors: FieldErrors;
  /** The PATCH body, when there are no problems. */
  input: ProposalUpdateInput | null;
  /** Live totals, whenever every figure parses (text problems elsewhere do not hide them). */
  totals: ProposalTotals<PreviewLine> | null;
  /** Each line's amount in cents by line key, for every line whose quantity and price parse. */
  lineAmounts: Map<string, number>;
}

/**
 * Checks the form, builds the PATCH body and prices it with proposalTotals. Optional lines are
 * offered, not chosen (the server saves them unselected), so they count in no total here either.
 * Line ids for the allocation of a discount are the positions, zero-padded: after saving, the
 * server's ids rise in the same order, so the largest-remainder tie-break picks the same lines.
 */
export function checkDraft(form: DraftForm): DraftCheck {
  const errors: FieldErrors = {};
  let moneyOk = true;
  if (form.title.trim() === '') errors.title = 'Give the proposal a title.';
  if (form.expiresOn && !/^\d{4}-\d{2}-\d{2}$/.test(form.expiresOn)) errors.expiresOn = 'Enter the whole date: month, day and year.';
  const taxError = decimalError(form.taxRatePct, 'Sales tax', MAX_TAX_RATE_PCT);
  if (taxError) errors.taxRatePct = taxError;
  const depositError = decimalError(form.depositPct, 'Deposit', 100);
  if (depositError) errors.depositPct = depositError;
  if (taxError || depositError) moneyOk = false;

  let discount: OrderDiscount = { kind: 'none' };
  if (form.discountKind === 'percent') {
    const e = decimalError(form.discountPercent, 'Discount', 100);
    if (e) {
      errors.discount = e;
      moneyOk = false;
    } else discount = { kind: 'percent', percent: form.discountPercent.trim() };
  } else if (form.discountKind === 'fixed') {
    const d = dollarsOf(form.discountDollars, 'The discount');
    if ('error' in d) {
      errors.discount = d.error;
      moneyOk = false;
    } else discount = { kind: 'fixed', amountCents: d.cents };
  }

  const preview: PreviewLine[] = [];
  const lineAmounts = new Map<string, number>();
  form.lines.forEach((line, index) => {
    const description = line.description.trim();
    if (description === '') errors[lineField(line.key, 'description')] = 'Describe the line.';
    else if (description.length > LINE_LIMITS.descriptionMax) errors[lineField(line.key, 'description')] = `Keep the description to ${LINE_LIMITS.descriptionMax} characters (it has ${description.length}).`;
    const unit = line.unit.trim();
    if (unit === '') errors[lineField(line.key, 'unit')] = 'Give the unit (acre, hour, each…).';
    else if (unit.length > LINE_LIMITS.unitMax) errors[lineField(line.key, 'unit')] = `Keep the unit to ${LINE_LIMITS.unitMax} characters, e.g. “2.5-gal container”.`;
    if (line.groupLabel.trim() === '') errors[lineField(line.key, 'line')] = 'The line’s group has no name.';
    const qError = decimalError(line.quantity, 'Quantity');
    if (qError) errors[lineField(line.key, 'quantity')] = qError;
    const price = dollarsOf(line.unitPrice, 'Unit price');
    if ('error' in price) errors[lineField(line.key, 'unitPrice')] = price.error;
    if (qError || 'error' in price) {
      moneyOk = false;
      return;
    }
    lineAmounts.set(line.key, lineAmountCents(line.quantity.trim(), price.cents));
    preview.push({
      key: line.key,
      id: `line-${String(index).padStart(9, '0')}`,
      quantity: line.quantity.trim(),
      unitPriceCents: price.cents,
      taxable: line.taxable,
      optional: line.optional,
      selected: !line.optional,
      category: line.category,
      description: line.description.trim(),
      unit: line.unit.trim(),
    });
  });

  let totals: ProposalTotals<PreviewLine> | null = null;
  if (moneyOk) {
    try {
      totals = proposalTotals({ lines: preview, discount, taxRatePct: form.taxRatePct.trim(), depositPct: form.depositPct.trim() });
    } catch (e) {
      if (!(e instanceof DomainValidationError)) throw e;
      errors[e.field.startsWith('discount') ? 'discount' : e.field] = e.message;
    }
  }

  const ok = Object.keys(errors).length === 0;
  const input: ProposalUpdateInput | null = ok
    ? {
        title: form.title.trim(),
        introduction: form.introduction.trim() === '' ? null : form.introduction.trim(),
        terms: form.terms.trim(),
        expiresOn: form.expiresOn === '' ? null : form.expiresOn,
        taxRatePct: Number(form.taxRatePct.trim()),
        depositPct: Number(form.depositPct.trim()),
        discount: discount.kind === 'percent' ? { kind: 'percent', percent: Number(discount.percent) } : discount,
        lines: form.lines.map((l, i) => ({
          groupLabel: l.groupLabel.trim(),
          unitId: l.unitId,
          prescriptionId: l.prescriptionId,
          category: l.category,
          description: l.description.trim(),
          quantity: l.quantity.trim(),
          unit: l.unit.trim(),
          unitPriceCents: preview[i].unitPriceCents,
          taxable: l.taxable,
          optional: l.optional,
        })),
      }
    : null;
  return { errors, input, totals, lineAmounts };
}

/** The line inputs that show their own error; problems with anything else of a line show under the whole line. */
const LINE_FIELDS: Record<string, keyof DraftLine> = {
  unitPriceCents: 'unitPrice',
  quantity: 'quantity',
  description: 'description',
  unit: 'unit',
};

/**
 * The API's 422 answer as errors beside the form's inputs. `details` carries zod paths such as
 * `lines.3.unitPriceCents`; the index is that of the lines as sent, which are the form's lines.
 * Without details, a leading "field:" of the message names the input.
 */
export function serverFieldErrors(form: DraftForm, message: string, details: unknown): FieldErrors {
  const errors: FieldErrors = {};
  const put = (path: string, text: string) => {
    const parts = path.split('.');
    if (parts[0] === 'lines' && parts.length >= 2 && /^\d+$/.test(parts[1])) {
      const line = form.lines[Number(parts[1])];
      if (line) {
        const field = LINE_FIELDS[parts[2] ?? ''] ?? 'line';
        errors[lineField(line.key, field)] = text;
        return;
      }
    }
    const top = parts[0] === 'discount' ? 'discount' : parts[0] || 'form';
    errors[top] = text;
  };
  if (Array.isArray(details) && details.length > 0) {
    for (const d of details as { path?: unknown; message?: unknown }[]) {
      if (typeof d?.message === 'string') put(typeof d.path === 'string' ? d.path : '', d.message);
    }
    return errors;
  }
  const m = /^([A-Za-z][\w.]*): (.+)$/s.exec(message);
  if (m) put(m[1], m[2]);
  return errors;
}
