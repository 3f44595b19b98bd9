/** What the proposal PDF is drawn from: plain data the server assembles from the proposal. */
import type { Geometry, MultiPolygon, Polygon } from 'geojson';
import type { UnitKind } from '../../shared/domain/unit-kinds';
import type { LetterheadFirm } from './firm-block';
import type { PlanMapOverlay } from './kit/map-svg';
import type { LineCategory } from '../../shared/schemas/proposal';
import type { ProposalTotalsFigures } from '../../shared/schemas/proposal-dto';

export interface ProposalDocumentLine {
  id: number;
  groupLabel: string;
  category: LineCategory;
  description: string;
  /** Decimal string with up to 4 places, e.g. "2.3700". */
  quantity: string;
  unit: string;
  unitPriceCents: number;
  /** Computed by shared/domain/proposal-totals.ts — print as given, never recompute. */
  amountCents: number;
  taxable: boolean;
  optional: boolean;
  /** Counted in the totals (required lines, and chosen options). */
  included: boolean;
}

export interface ProposalDocumentInput {
  firm: LetterheadFirm;
  client: { name: string };
  property: { name: string; acres: number; boundary: Polygon | MultiPolygon; locality?: string };
  proposal: {
    number: string;
    version: number;
    title: string;
    introduction?: string | null;
    /** YYYY-MM-DD */
    preparedOn: string;
    /** YYYY-MM-DD */
    expiresOn?: string | null;
    status: 'draft' | 'sent' | 'approved' | 'declined' | 'withdrawn' | 'expired';
    terms: string;
    currency: string;
  };
  units: { name: string; kind: UnitKind; geometry: Geometry; acres?: number | null; lengthFt?: number | null }[];
  /** Aerial photos printed under the plan in the map (downscaled data URLs with their corners). */
  overlays?: PlanMapOverlay[];
  /** One group per unit with work: its plain-language prescription summaries. */
  groups: { label: string; kind?: UnitKind | null; acres?: number | null; lengthFt?: number | null; summaries: string[] }[];
  lines: ProposalDocumentLine[];
  totals: ProposalTotalsFigures & {
    taxRatePct: number;
    depositPct: number;
    /** "10% discount" or "Discount" */
    discountLabel?: string;
  };
  /** Caution texts that apply to the work (titles then text). */
  cautions: { title: string; text: string }[];
  approval?: { signedName: string; signedAt: string; contentHash: string } | null;
  /** The firm's IANA time zone: times (the approval) are written in it, with its abbreviation. Default UTC. */
  timeZone?: string;
}
