import { z } from 'zod';
import { IsoDateSchema, RecordIdSchema, IdSchema } from './common';
import { LIMITS } from '../limits';
import { PageQuerySchema } from './common';

const isoDate = IsoDateSchema;
const pct = (label: string, max: number) =>
  z.number({ message: `${label} must be a number` }).min(0, { message: `${label} cannot be negative` }).max(max, { message: `${label} cannot be more than ${max} %` });
const decimalQuantity = z
  .union([z.number(), z.string()])
  .transform((v) => String(v).trim())
  .refine((v) => /^\d+(\.\d{1,4})?$/.test(v), { message: 'quantity must be a positive number with at most 4 decimals' });

/** What a proposal or invoice line prices: the one list of line categories. */
export const LINE_CATEGORIES = ['materials', 'labor', 'equipment', 'fees'] as const;
export const LineCategorySchema = z.enum(LINE_CATEGORIES, { message: 'must be materials, labor, equipment or fees' });
export type LineCategory = z.infer<typeof LineCategorySchema>;

export const DiscountSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('none') }),
  z.object({ kind: z.literal('percent'), percent: pct('Discount', 100) }),
  z.object({ kind: z.literal('fixed'), amountCents: z.number().int().min(0, { message: 'the discount cannot be negative' }) }),
]);

export const ProposalLineInputSchema = z.object({
  id: RecordIdSchema.optional(),
  groupLabel: z.string().trim().min(1).max(120),
  unitId: RecordIdSchema.nullish(),
  prescriptionId: RecordIdSchema.nullish(),
  category: LineCategorySchema,
  description: z.string().trim().min(1, { message: 'describe the line' }).max(300),
  quantity: decimalQuantity,
  unit: z.string().trim().min(1).max(40),
  unitPriceCents: z.number().int({ message: 'prices are whole cents' }).min(0, { message: 'a price cannot be negative; use the discount for credits' }).max(100_000_000),
  taxable: z.boolean().default(false),
  optional: z.boolean().default(false),
});
export type ProposalLineInput = z.infer<typeof ProposalLineInputSchema>;

export const ProposalCreateSchema = z.object({
  prescriptionIds: z.array(RecordIdSchema).max(500).optional(),
  title: z.string().trim().min(1).max(160).optional(),
  introduction: z.string().trim().max(LIMITS.textMax).nullish(),
  terms: z.string().trim().max(LIMITS.textMax).optional(),
  expiresOn: isoDate.optional(),
  taxRatePct: pct('Sales tax', 30).optional(),
  depositPct: pct('Deposit', 100).optional(),
  discount: DiscountSchema.optional(),
});
export type ProposalCreateInput = z.infer<typeof ProposalCreateSchema>;

export const ProposalUpdateSchema = ProposalCreateSchema.omit({ prescriptionIds: true }).extend({
  expiresOn: isoDate.nullish(),
  lines: z.array(ProposalLineInputSchema).max(500).optional(),
});
export type ProposalUpdateInput = z.infer<typeof ProposalUpdateSchema>;

export const ApproveSchema = z.object({
  signedName: z.string().trim().min(3, { message: 'type your full name to approve' }).max(120),
  optionIds: z.array(RecordIdSchema).max(200).optional(),
});
export type ApproveInput = z.infer<typeof ApproveSchema>;

export const DeclineSchema = z.object({
  reason: z.string().trim().min(3, { message: 'tell your consultant briefly why' }).max(2000),
});

export const PROPOSAL_STATES = ['draft', 'sent', 'approved', 'declined', 'withdrawn', 'expired'] as const;
export type ProposalDisplayStatus = (typeof PROPOSAL_STATES)[number];

export const ProposalListQuerySchema = z
  .object({
    status: z.enum(PROPOSAL_STATES).optional(),
    propertyId: IdSchema.optional(),
  })
  .extend(PageQuerySchema.shape);
