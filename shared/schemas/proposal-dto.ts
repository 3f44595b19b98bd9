/**
 * The proposal answers of the API as zod schemas. The server's presenter is typed by them
 * (server/presenters/proposal.ts), the client reads them and the integration tests parse every
 * proposal answer with them, so the three cannot drift apart.
 */
import { z } from 'zod';
import { LineCategorySchema, type LineCategory, type ProposalDisplayStatus } from './proposal';

export type ProposalStatus = ProposalDisplayStatus;
export type { LineCategory };

const PROPOSAL_STATUSES = ['draft', 'sent', 'approved', 'declined', 'withdrawn', 'expired'] as const satisfies readonly ProposalStatus[];
const StatusSchema = z.enum(PROPOSAL_STATUSES);
const CentsSchema = z.number().int({ message: 'must be a whole number of cents' }).nonnegative({ message: 'must be zero or more cents' });
const nullableString = z.string().nullable();

/** The one shape of a proposal's totals (all integer cents), as shared/domain/proposal-totals.ts computes them. */
export const ProposalTotalsFiguresSchema = z.object({
  subtotalCents: CentsSchema,
  discountCents: CentsSchema,
  taxableCents: CentsSchema,
  taxCents: CentsSchema,
  totalCents: CentsSchema,
  depositCents: CentsSchema,
  balanceCents: CentsSchema,
});
export type ProposalTotalsFigures = z.infer<typeof ProposalTotalsFiguresSchema>;

/** One priced line of a proposal. `quantity` is a four-decimal string ("13.8800"). */
export const ProposalLineDtoSchema = z.object({
  id: z.number().int(),
  position: z.number().int(),
  unitId: z.number().int().nullable(),
  prescriptionId: z.number().int().nullable(),
  groupLabel: z.string(),
  category: LineCategorySchema,
  description: z.string(),
  quantity: z.string(),
  unit: z.string(),
  unitPriceCents: CentsSchema,
  taxable: z.boolean(),
  optional: z.boolean(),
  selected: z.boolean(),
  included: z.boolean(),
  amountCents: CentsSchema,
  discountCents: CentsSchema,
});
export type ProposalLineDto = z.infer<typeof ProposalLineDtoSchema>;

/** One unit of the plan the proposal prices, with plain summaries of its prescriptions. */
export const ProposalGroupDtoSchema = z.object({
  unitId: z.number().int().nullable(),
  label: z.string(),
  kind: nullableString,
  acres: z.number().nullable(),
  lengthFt: z.number().nullable(),
  summaries: z.array(z.string()),
});
export type ProposalGroupDto = z.infer<typeof ProposalGroupDtoSchema>;

/** The approval record: who typed their name, when, and the SHA-256 of what they approved. */
export const ProposalApprovalDtoSchema = z.object({
  signedName: z.string(),
  signedAt: z.string(),
  contentHash: z.string(),
  ip: nullableString,
  userAgent: nullableString,
  selectedOptionIds: z.array(z.number().int()),
});
export type ProposalApprovalDto = z.infer<typeof ProposalApprovalDtoSchema>;

/** The discount as stored and answered (the percentage may be a decimal string). */
export const OrderDiscountDtoSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('none') }),
  z.object({ kind: z.literal('percent'), percent: z.union([z.number(), z.string()]) }),
  z.object({ kind: z.literal('fixed'), amountCents: CentsSchema }),
]);

/** A proposal with lines, totals, context and its decision. */
export const ProposalDtoSchema = ProposalTotalsFiguresSchema.extend({
  id: z.number().int(),
  seriesId: z.number().int(),
  number: z.string(),
  version: z.number().int(),
  status: StatusSchema,
  propertyId: z.number().int(),
  propertyName: z.string(),
  clientId: z.number().int(),
  clientName: z.string(),
  title: z.string(),
  introduction: nullableString,
  terms: z.string(),
  currency: z.string(),
  discount: OrderDiscountDtoSchema,
  taxRatePct: z.number(),
  depositPct: z.number(),
  expiresOn: nullableString,
  lines: z.array(ProposalLineDtoSchema),
  groups: z.array(ProposalGroupDtoSchema),
  cautions: z.array(z.object({ id: z.string(), title: z.string(), text: z.string() })),
  sentAt: nullableString,
  firstViewedAt: nullableString,
  decidedAt: nullableString,
  declineReason: nullableString,
  approval: ProposalApprovalDtoSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ProposalDto = z.infer<typeof ProposalDtoSchema>;

/** A row of a proposal list: numbers and totals without lines. */
export const ProposalRowDtoSchema = z.object({
  id: z.number().int(),
  seriesId: z.number().int(),
  number: z.string(),
  version: z.number().int(),
  status: StatusSchema,
  title: z.string(),
  propertyId: z.number().int(),
  propertyName: z.string(),
  clientId: z.number().int(),
  clientName: z.string(),
  totalCents: CentsSchema,
  depositCents: CentsSchema,
  expiresOn: nullableString,
  sentAt: nullableString,
  firstViewedAt: nullableString,
  decidedAt: nullableString,
  updatedAt: z.string(),
});
export type ProposalRowDto = z.infer<typeof ProposalRowDtoSchema>;

/** "P-2026-001 v2": how a proposal is named everywhere. */
export const proposalLabel = (p: { number: string; version: number }): string => `${p.number} v${p.version}`;

/** Where the proposal's PDF is served (opens in a new tab). */
export const proposalPdfUrl = (id: number): string => `/api/proposals/${id}/pdf`;
