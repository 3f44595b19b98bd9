/**
 * Invoice money rules, exact in integer cents: the totals of an invoice, the deposit credit on a
 * progress invoice, the final invoice's remainder, partial payments, invoice status, receivables
 * ageing and overdue reminders. Rounding only happens in ./money (round half up).
 *
 * How a proposal is billed (the invariant the rules keep): the amounts billed from a proposal —
 * deposit, progress (task lines less deposit credit) and final — add up, over the invoices that
 * are not void, to exactly the proposal's total. Manual lines are extras on top of that.
 */
import { DomainValidationError } from './errors';
import { assertCents, percentOfCents, toScaledDecimal } from './money';
import { invoiceTotals } from './proposal-totals';
import { addDays, daysBetween } from './planting-windows';

/** Where an invoice line comes from: billed from the proposal, or typed by the consultant. */
export type InvoiceLineSource = 'deposit' | 'task' | 'deposit-credit' | 'final' | 'manual';
export const INVOICE_KINDS = ['deposit', 'progress', 'final'] as const;
export type InvoiceKind = (typeof INVOICE_KINDS)[number];
export const INVOICE_STATUSES = ['draft', 'open', 'paid', 'void'] as const;
export type InvoiceStatus = (typeof INVOICE_STATUSES)[number];

/** The smallest card payment the hosted payments service takes in USD: 50 cents (from memory). */
export const MIN_CARD_PAYMENT_CENTS = 50;
/** Days between overdue reminders of one invoice (common practice, no source). */
export const REMINDER_INTERVAL_DAYS = 7;
/** Net days to pay when the firm sets nothing: the proposal's standard terms say 30. */
export const DEFAULT_TERMS_DAYS = 30;

/** A line as stored: billed lines carry their amount; manual lines a quantity and unit price. */
export interface InvoiceLineMoney {
  id: string;
  source: InvoiceLineSource;
  /** Decimal string or number, at most 4 places (manual lines). */
  quantity: number | string;
  unitPriceCents: number;
  /** Billed lines (deposit, task, credit, final): the amount as billed; may be negative for a credit. */
  amountCents?: number;
  taxable: boolean;
}

export interface InvoiceAmounts {
  /** Sum of the lines billed from the proposal (tax already inside the proposal's total). */
  billedCents: number;
  /** Manual lines before tax. */
  manualSubtotalCents: number;
  /** Sales tax on taxable manual lines at the invoice's rate. */
  taxCents: number;
  /** billed + manual subtotal: every line before the manual lines' tax. */
  subtotalCents: number;
  totalCents: number;
  /** Each line's amount by id (manual lines priced by the shared rule). */
  lineAmounts: Map<string, number>;
}

/**
 * An invoice's totals. Lines billed from a proposal count as billed (the proposal's tax is inside
 * them); manual lines are priced and taxed by `invoiceTotals`, the proposal rule.
 */
export function invoiceAmounts(lines: readonly InvoiceLineMoney[], taxRatePct: number | string): InvoiceAmounts {
  const lineAmounts = new Map<string, number>();
  let billedCents = 0;
  const manual = lines.filter((l) => l.source === 'manual');
  for (const line of lines) {
    if (line.source === 'manual') continue;
    assertCents(line.amountCents, `lines.${line.id}.amountCents`, { allowNegative: line.source === 'deposit-credit' });
    lineAmounts.set(line.id, line.amountCents);
    billedCents += line.amountCents;
  }
  const manualTotals = invoiceTotals(
    manual.map((l) => ({ id: l.id, quantity: l.quantity, unitPriceCents: l.unitPriceCents, taxable: l.taxable, category: 'fees' })),
    taxRatePct,
  );
  for (const l of manualTotals.lines) lineAmounts.set(l.id, l.amountCents);
  const subtotalCents = billedCents + manualTotals.subtotalCents;
  return {
    billedCents,
    manualSubtotalCents: manualTotals.subtotalCents,
    taxCents: manualTotals.taxCents,
    subtotalCents,
    totalCents: subtotalCents + manualTotals.taxCents,
    lineAmounts,
  };
}

/** Cents of a proposal not yet billed: its total less what non-void invoices billed from it. */
export function remainingToBillCents(proposalTotalCents: number, billedBeforeCents: readonly number[]): number {
  assertCents(proposalTotalCents, 'proposalTotalCents');
  const billed = billedBeforeCents.reduce((sum, c) => {
    assertCents(c, 'billedBeforeCents', { allowNegative: true });
    return sum + c;
  }, 0);
  return proposalTotalCents - billed;
}

/**
 * The final invoice's amount: whatever of the proposal's total is not billed yet, so that the
 * invoices of a proposal add up to its total exactly. Refused when nothing is left.
 */
export function finalInvoiceCents(proposalTotalCents: number, billedBeforeCents: readonly number[]): number {
  const rest = remainingToBillCents(proposalTotalCents, billedBeforeCents);
  if (rest <= 0) {
    throw new DomainValidationError('kind', `Nothing is left to bill on this proposal: its invoices already come to its total${rest < 0 ? ` and ${-rest} cents more` : ''}.`);
  }
  return rest;
}

export interface ProgressTask {
  id: number;
  description: string;
  costCents: number;
}

export interface ProgressInvoicePlan {
  taskLines: { taskId: number; description: string; amountCents: number }[];
  /** The deposit credited on this invoice (a negative line), 0 when none. */
  creditCents: number;
  /** taskLines' sum less the credit: what the invoice bills from the proposal. */
  netCents: number;
}

/**
 * A progress invoice for done tasks: each at its cost, less a share of the deposit. The share is
 * the proposal's deposit percent of the tasks' cost, never more than the deposit not yet
 * credited; and the credit grows when needed so the invoice never bills past the proposal's total
 * (the final invoice then has nothing or little left). Deposit applied pro rata: common practice,
 * no source.
 */
export function progressInvoicePlan(input: {
  tasks: readonly ProgressTask[];
  depositPct: number | string;
  depositUncreditedCents: number;
  remainingCents: number;
}): ProgressInvoicePlan {
  if (input.tasks.length === 0) throw new DomainValidationError('taskIds', 'No done tasks are waiting to be billed on this proposal. Mark tasks done first, or bill the rest with a final invoice.');
  assertCents(input.depositUncreditedCents, 'depositUncreditedCents');
  const taskLines = input.tasks.map((t) => {
    assertCents(t.costCents, `tasks.${t.id}.costCents`);
    return { taskId: t.id, description: t.description, amountCents: t.costCents };
  });
  const taskCents = taskLines.reduce((s, l) => s + l.amountCents, 0);
  if (input.remainingCents <= 0) throw new DomainValidationError('kind', 'Nothing is left to bill on this proposal: its invoices already come to its total.');
  const proRata = Number(percentOfCents(BigInt(taskCents), toScaledDecimal(input.depositPct, 'depositPct', 'Deposit percent')));
  let creditCents = Math.min(proRata, input.depositUncreditedCents);
  if (taskCents - creditCents > input.remainingCents) creditCents = taskCents - input.remainingCents;
  return { taskLines, creditCents, netCents: taskCents - creditCents };
}

/**
 * The amount of one card payment: the whole balance, or a part of it the client chose. A part must
 * be at least the service's minimum and never more than the balance.
 */
export function checkoutAmountCents(balanceCents: number, requestedCents?: number | null): number {
  assertCents(balanceCents, 'balanceCents');
  if (balanceCents <= 0) throw new DomainValidationError('amountCents', 'This invoice has nothing left to pay.');
  if (requestedCents === undefined || requestedCents === null) return balanceCents;
  assertCents(requestedCents, 'amountCents');
  if (requestedCents > balanceCents) throw new DomainValidationError('amountCents', `You can pay at most the balance of ${balanceCents} cents.`);
  if (requestedCents < Math.min(MIN_CARD_PAYMENT_CENTS, balanceCents)) {
    throw new DomainValidationError('amountCents', `A card payment must be at least ${MIN_CARD_PAYMENT_CENTS} cents.`);
  }
  return requestedCents;
}

/** What the client owes and the invoice's status after the payments so far. Refunds are the firm's choice and do not reopen an invoice. */
export function paymentStanding(input: { status: InvoiceStatus; totalCents: number; paymentsCents: readonly number[] }): {
  amountPaidCents: number;
  balanceCents: number;
  overpaidCents: number;
  status: InvoiceStatus;
} {
  assertCents(input.totalCents, 'totalCents');
  const amountPaidCents = input.paymentsCents.reduce((s, c) => {
    assertCents(c, 'paymentsCents');
    return s + c;
  }, 0);
  const balanceCents = Math.max(0, input.totalCents - amountPaidCents);
  const overpaidCents = Math.max(0, amountPaidCents - input.totalCents);
  let status = input.status;
  if (status === 'open' && balanceCents === 0) status = 'paid';
  return { amountPaidCents, balanceCents, overpaidCents, status };
}

export const AGEING_BUCKETS = [
  { key: 'current', label: 'Current' },
  { key: 'days1to30', label: '1–30 days' },
  { key: 'days31to60', label: '31–60 days' },
  { key: 'days61to90', label: '61–90 days' },
  { key: 'over90', label: 'Over 90 days' },
] as const;
export type AgeingBucketKey = (typeof AGEING_BUCKETS)[number]['key'];

/** Days past the due date on a day (0 or less: not overdue). */
export function daysPastDue(dueOn: string, today: string): number {
  return daysBetween(dueOn, today);
}

/** The ageing bucket of an amount due on `dueOn`, seen on `today`: current (not past due), 1–30, 31–60, 61–90, over 90 days. */
export function ageingBucket(dueOn: string, today: string): AgeingBucketKey {
  const days = daysPastDue(dueOn, today);
  if (days <= 0) return 'current';
  if (days <= 30) return 'days1to30';
  if (days <= 60) return 'days31to60';
  if (days <= 90) return 'days61to90';
  return 'over90';
}

/** Outstanding balances summed by ageing bucket, every bucket present (zero when empty). */
export function ageReceivables(items: readonly { dueOn: string; balanceCents: number }[], today: string): { key: AgeingBucketKey; label: string; amountCents: number; count: number }[] {
  const sums = new Map<AgeingBucketKey, { amountCents: number; count: number }>(AGEING_BUCKETS.map((b) => [b.key, { amountCents: 0, count: 0 }]));
  for (const item of items) {
    assertCents(item.balanceCents, 'balanceCents');
    if (item.balanceCents === 0) continue;
    const s = sums.get(ageingBucket(item.dueOn, today))!;
    s.amountCents += item.balanceCents;
    s.count += 1;
  }
  return AGEING_BUCKETS.map((b) => ({ key: b.key, label: b.label, ...sums.get(b.key)! }));
}

/** The due date of an invoice issued on a day with net terms in days. */
export function dueDate(issuedOn: string, termsDays: number): string {
  if (!Number.isInteger(termsDays) || termsDays < 0 || termsDays > 365) throw new DomainValidationError('termsDays', 'Payment terms must be a whole number of days from 0 (due on receipt) to 365.');
  return addDays(issuedOn, termsDays);
}

/** Whether an overdue reminder is due today: past due, and none sent within the interval. */
export function reminderDue(input: { dueOn: string; today: string; lastReminderOn: string | null; intervalDays?: number }): boolean {
  if (daysPastDue(input.dueOn, input.today) <= 0) return false;
  if (!input.lastReminderOn) return true;
  return daysBetween(input.lastReminderOn, input.today) >= (input.intervalDays ?? REMINDER_INTERVAL_DAYS);
}
