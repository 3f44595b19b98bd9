/**
 * The proposal answers of the API. The server's presenter is typed against these
 * (server/presenters/proposal.ts), and the client reads them, so the two cannot drift apart.
 */
import type { OrderDiscount } from '../domain/proposal-totals';
import type { ProposalDisplayStatus } from './proposal';

export type ProposalStatus = ProposalDisplayStatus;
export type LineCategory = 'materials' | 'labor' | 'equipment' | 'fees';

/** One priced line of a proposal. `quantity` is a four-decimal string ("13.8800"). */
export interface ProposalLineDto {
  id: number;
  position: number;
  unitId: number | null;
  prescriptionId: number | null;
  groupLabel: string;
  category: LineCategory;
  description: string;
  quantity: string;
  unit: string;
  unitPriceCents: number;
  taxable: boolean;
  optional: boolean;
  selected: boolean;
  included: boolean;
  amountCents: number;
  discountCents: number;
}

/** One unit of the plan the proposal prices, with plain summaries of its prescriptions. */
export interface ProposalGroupDto {
  unitId: number | null;
  label: string;
  kind: string | null;
  acres: number | null;
  lengthFt: number | null;
  summaries: string[];
}

/** The approval record: who typed their name, when, and the SHA-256 of what they approved. */
export interface ProposalApprovalDto {
  signedName: string;
  signedAt: string;
  contentHash: string;
  ip: string | null;
  userAgent: string | null;
  selectedOptionIds: number[];
}

/** A proposal with lines, totals, context and its decision. */
export interface ProposalDto {
  id: number;
  seriesId: number;
  number: string;
  version: number;
  status: ProposalStatus;
  propertyId: number;
  propertyName: string;
  clientId: number;
  clientName: string;
  title: string;
  introduction: string | null;
  terms: string;
  currency: string;
  discount: OrderDiscount;
  taxRatePct: number;
  depositPct: number;
  expiresOn: string | null;
  lines: ProposalLineDto[];
  subtotalCents: number;
  discountCents: number;
  taxableCents: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  balanceCents: number;
  groups: ProposalGroupDto[];
  cautions: { id: string; title: string; text: string }[];
  sentAt: string | null;
  firstViewedAt: string | null;
  decidedAt: string | null;
  declineReason: string | null;
  approval: ProposalApprovalDto | null;
  createdAt: string;
  updatedAt: string;
}

/** A row of a proposal list: numbers and totals without lines. */
export interface ProposalRowDto {
  id: number;
  seriesId: number;
  number: string;
  version: number;
  status: ProposalStatus;
  title: string;
  propertyId: number;
  propertyName: string;
  clientId: number;
  clientName: string;
  totalCents: number;
  depositCents: number;
  expiresOn: string | null;
  sentAt: string | null;
  firstViewedAt: string | null;
  decidedAt: string | null;
  updatedAt: string;
}

/** "P-2026-001 v2": how a proposal is named everywhere. */
export const proposalLabel = (p: { number: string; version: number }): string => `${p.number} v${p.version}`;

/** Where the proposal's PDF is served (opens in a new tab). */
export const proposalPdfUrl = (id: number): string => `/api/proposals/${id}/pdf`;
