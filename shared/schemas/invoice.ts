/** Invoices: what the API takes (zod) and answers (types shared by the server's presenter and the client). */
import { z } from 'zod';
import { IdSchema, RecordIdSchema } from './common';
import { parseDollarsToCents } from '../domain/money';
import { PageLimitSchema, PageQuerySchema, type PageDto } from './common';
import { INVOICE_KINDS, INVOICE_STATUSES, type AgeingBucketKey, type InvoiceLineSource } from '../domain/invoicing';

const id = RecordIdSchema;

export const InvoiceCreateSchema = z
  .object({
    proposalId: id,
    kind: z.enum(INVOICE_KINDS, { message: 'kind must be deposit, progress or final' }),
    taskIds: z.array(id).min(1, { message: 'choose at least one done task' }).max(500).optional(),
  })
  .refine((v) => v.kind === 'progress' || v.taskIds === undefined, { message: 'taskIds are only for progress invoices', path: ['taskIds'] });
export type InvoiceCreateInput = z.infer<typeof InvoiceCreateSchema>;

/**
 * The invoice list's page when the address does not say: the 50 newest, so the list answers in about
 * the same time however many invoices the firm holds; `page.total` and `summary` cover every match.
 */
export const INVOICE_PAGE = { defaultLimit: 50 } as const;

export const InvoiceListQuerySchema = z.object({
  clientId: IdSchema.optional(),
  propertyId: IdSchema.optional(),
  proposalId: IdSchema.optional(),
  status: z.enum(INVOICE_STATUSES, { message: 'status must be draft, open, paid or void' }).optional(),
}).extend({ ...PageQuerySchema.shape, limit: PageLimitSchema.default(INVOICE_PAGE.defaultLimit) });
export type InvoiceListQuery = z.infer<typeof InvoiceListQuerySchema>;

export const InvoiceUpdateSchema = z.object({
  termsDays: z.number({ message: 'terms must be a number of days' }).int({ message: 'terms are whole days' }).min(0, { message: 'terms cannot be negative' }).max(365, { message: 'terms are at most 365 days' }).optional(),
  notes: z.string().trim().max(2000, { message: 'notes are at most 2,000 characters' }).nullish(),
});
export type InvoiceUpdateInput = z.infer<typeof InvoiceUpdateSchema>;

export const ManualLineSchema = z.object({
  description: z.string().trim().min(1, { message: 'describe the line' }).max(300, { message: 'at most 300 characters' }),
  quantity: z
    .union([z.number(), z.string()])
    .transform((v) => String(v).trim())
    .refine((v) => /^\d+(\.\d{1,4})?$/.test(v) && Number(v) > 0, { message: 'quantity must be a positive number with at most 4 decimals' }),
  unit: z.string().trim().min(1).max(40).default('each'),
  unitPriceCents: z.number({ message: 'the price must be a number of cents' }).int({ message: 'prices are whole cents' }).min(0, { message: 'a price cannot be negative' }).max(100_000_000, { message: 'that price is too large' }),
  taxable: z.boolean().default(false),
});
export type ManualLineInput = z.infer<typeof ManualLineSchema>;

export const LineParamsSchema = z.object({ id: IdSchema, lineId: IdSchema });

export const CheckoutSchema = z.object({
  amountCents: z.number({ message: 'the amount must be a number of cents' }).int({ message: 'the amount is whole cents' }).positive({ message: 'the amount must be more than zero' }).optional(),
});
export type CheckoutInput = z.infer<typeof CheckoutSchema>;

export const VoidSchema = z.object({
  reason: z.string().trim().min(3, { message: 'say briefly why the invoice is void' }).max(500),
});

export const RefundSchema = z.object({
  /**
   * One key per refund the owner means to make, made when the form is filled and sent again with
   * every retry of that same refund: the payments service then refunds once, whatever is lost.
   */
  requestKey: z.string({ message: 'the refund request needs its key; reload the page and try again' }).trim().min(8, { message: 'must be at least 8 characters' }).max(200).regex(/^[A-Za-z0-9_.:-]+$/, { message: 'may hold letters, digits and - _ . : only' }),
  paymentId: id,
  amountCents: z.number({ message: 'the amount must be a number of cents' }).int({ message: 'the amount is whole cents' }).positive({ message: 'the amount must be more than zero' }),
  reason: z.string().trim().max(500).optional(),
});
export type RefundInput = z.infer<typeof RefundSchema>;

const cents = z.number().int();
const nullableString = z.string().nullable();

export const InvoiceLineDtoSchema = z.object({
  id: z.number().int(),
  position: z.number().int(),
  source: z.custom<InvoiceLineSource>((v) => typeof v === 'string'),
  taskId: z.number().int().nullable(),
  description: z.string(),
  quantity: z.string(),
  unit: z.string(),
  unitPriceCents: cents,
  amountCents: cents,
  taxable: z.boolean(),
});
export type InvoiceLineDto = z.infer<typeof InvoiceLineDtoSchema>;

export const InvoiceRefundDtoSchema = z.object({ id: z.number().int(), amountCents: cents, reason: nullableString, createdAt: z.string() });
export type InvoiceRefundDto = z.infer<typeof InvoiceRefundDtoSchema>;

export const InvoicePaymentDtoSchema = z.object({ id: z.number().int(), amountCents: cents, refundedCents: cents, receivedAt: z.string(), refunds: z.array(InvoiceRefundDtoSchema) });
export type InvoicePaymentDto = z.infer<typeof InvoicePaymentDtoSchema>;

/** A row of the invoice list. */
export const InvoiceRowDtoSchema = z.object({
  id: z.number().int(),
  number: z.string(),
  kind: z.enum(INVOICE_KINDS),
  status: z.enum(INVOICE_STATUSES),
  clientId: z.number().int(),
  clientName: z.string(),
  propertyId: z.number().int().nullable(),
  propertyName: z.string(),
  proposalId: z.number().int().nullable(),
  proposalNumber: nullableString,
  issuedOn: nullableString,
  dueOn: nullableString,
  totalCents: cents,
  amountPaidCents: cents,
  amountRefundedCents: cents,
  balanceCents: cents,
  /** Days past the due date while open (0 when not overdue). */
  daysOverdue: z.number().int(),
  updatedAt: z.string(),
});
export type InvoiceRowDto = z.infer<typeof InvoiceRowDtoSchema>;

/** Money of every invoice the list's filter matches (not only the page), summed in the database. */
export const InvoiceListSummarySchema = z.object({
  count: z.number().int().min(0),
  totalCents: z.number().int(),
  balanceCents: z.number().int().min(0),
});
export type InvoiceListSummaryDto = z.infer<typeof InvoiceListSummarySchema>;

/** GET /api/invoices: one page of rows, where it sits in the whole, and the whole's money. */
export interface InvoiceListDto {
  data: InvoiceRowDto[];
  page: PageDto;
  summary: InvoiceListSummaryDto;
}

/** An invoice with its lines and payments. */
export const InvoiceDtoSchema = InvoiceRowDtoSchema.extend({
  currency: z.string(),
  taxRatePct: z.number(),
  termsDays: z.number().int(),
  notes: nullableString,
  subtotalCents: cents,
  taxCents: cents,
  billedCents: cents,
  sentAt: nullableString,
  paidAt: nullableString,
  voidedAt: nullableString,
  voidReason: nullableString,
  lines: z.array(InvoiceLineDtoSchema),
  payments: z.array(InvoicePaymentDtoSchema),
});
export type InvoiceDto = z.infer<typeof InvoiceDtoSchema>;

/** What the firm is owed, by age. */
export const ReceivablesDtoSchema = z.object({
  asOf: z.string(),
  buckets: z.array(z.object({ key: z.custom<AgeingBucketKey>((v) => typeof v === 'string'), label: z.string(), amountCents: cents, count: z.number().int() })),
  outstandingCents: cents,
  overdueCents: cents,
  paidThisMonthCents: cents,
  draftCount: z.number().int(),
});
export type ReceivablesDto = z.infer<typeof ReceivablesDtoSchema>;

/** The manual-line form: the same rules as ManualLineSchema, with the price typed in dollars ("65.00"). */
export const ManualLineFormSchema = ManualLineSchema.omit({ unitPriceCents: true }).extend({
  unitPrice: z
    .string()
    .trim()
    .regex(/^\$?\d{1,7}(,\d{3})*(\.\d{1,2})?$/, { message: 'write the price like 65.00 (dollars and cents)' })
    .transform((v) => parseDollarsToCents(v, 'unitPrice')),
});
export type ManualLineFormInput = z.input<typeof ManualLineFormSchema>;

export const BillableTasksQuerySchema = z.object({ proposalId: IdSchema });

/** A done task not billed yet, offered for a progress invoice. */
export interface BillableTaskDto {
  id: number;
  name: string;
  unitName: string;
  doneOn: string | null;
  costCents: number;
}
