/**
 * The proposal document's input check: the zod schema, and totals that must agree with the lines and with one another.
 */
import { isTimeZone } from '../../../shared/domain/clock';
import { DomainValidationError } from '../../../shared/domain/errors';
import { formatCents } from '../../../shared/domain/money';
import { UNIT_KINDS } from '../../../shared/domain/unit-kinds';
import { LineCategorySchema } from '../../../shared/schemas/proposal';
import { ProposalTotalsFiguresSchema } from '../../../shared/schemas/proposal-dto';
import { PlanMapOverlaysSchema } from '../kit/map-svg';
import type { ProposalDocumentInput } from '../proposal-input';
import { z } from 'zod';
import { GeometrySchema, AreaGeometrySchema } from '../kit/geometry-schemas';

const text = (max: number) => z.string().trim().min(1, { message: 'must not be empty' }).max(max, { message: `must be at most ${max} characters` });
const optionalText = (max: number) => z.string().max(max, { message: `must be at most ${max} characters` }).nullish();
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be a date written YYYY-MM-DD' });
const measure = z.number().finite().nonnegative({ message: 'must be zero or more' });
const cents = z.number().int({ message: 'must be a whole number of cents' }).nonnegative({ message: 'must be zero or more cents' });
const percent = (max: number) => z.number().finite().min(0, { message: 'must be zero or more' }).max(max, { message: `must be at most ${max}` });
const kind = z.enum(UNIT_KINDS, { message: `must be one of ${UNIT_KINDS.join(', ')}` });

const LineSchema = z
  .object({
    id: z.number().int(),
    groupLabel: z.string().max(120),
    category: LineCategorySchema,
    description: text(500),
    quantity: z.string().regex(/^\d{1,12}(\.\d{1,4})?$/, { message: 'must be a decimal such as "2.3700" (at most 4 places)' }),
    unit: z.string().max(40),
    unitPriceCents: cents,
    amountCents: cents,
    taxable: z.boolean(),
    optional: z.boolean(),
    included: z.boolean(),
  })
  .refine((line) => line.optional || line.included, { message: 'is a required line, so it must be included', path: ['included'] });

const ProposalDocumentInputSchema = z.object({
  firm: z.object({ name: text(120), phone: optionalText(40), email: optionalText(254), address: optionalText(300), website: optionalText(200), licenceNumbers: optionalText(300), logo: z.string().startsWith('data:image/').nullish(), areaUnit: z.enum(['acres', 'hectares']).nullish(), lengthUnit: z.enum(['feet', 'metres']).nullish() }),
  client: z.object({ name: text(120) }),
  property: z.object({
    name: text(120),
    acres: z.number().finite().positive({ message: 'must be more than zero' }),
    boundary: AreaGeometrySchema,
    locality: z.string().max(160).optional(),
  }),
  proposal: z.object({
    number: text(40),
    version: z.number().int().min(1, { message: 'must be 1 or more' }),
    title: text(200),
    introduction: optionalText(4000),
    preparedOn: isoDate,
    expiresOn: isoDate.nullish(),
    status: z.enum(['draft', 'sent', 'approved', 'declined', 'withdrawn', 'expired'], {
      message: 'must be draft, sent, approved, declined, withdrawn or expired',
    }),
    terms: z.string().max(20_000, { message: 'must be at most 20,000 characters' }),
    currency: z.string().regex(/^[A-Z]{3}$/, { message: 'must be a three-letter ISO 4217 code such as USD' }),
  }),
  units: z
    .array(z.object({ name: text(120), kind, geometry: GeometrySchema, acres: measure.nullish(), lengthFt: measure.nullish() }))
    .max(500, { message: 'a proposal map shows at most 500 units' }),
  overlays: PlanMapOverlaysSchema.optional(),
  groups: z
    .array(
      z.object({
        label: text(120),
        kind: kind.nullish(),
        acres: measure.nullish(),
        lengthFt: measure.nullish(),
        summaries: z.array(text(600)).max(30, { message: 'at most 30 summaries per unit' }),
      }),
    )
    .max(200, { message: 'at most 200 groups' }),
  lines: z.array(LineSchema).max(1000, { message: 'a proposal has at most 1,000 lines' }),
  totals: ProposalTotalsFiguresSchema.extend({
    taxRatePct: percent(30),
    depositPct: percent(100),
    discountLabel: z.string().trim().max(60).optional(),
  }),
  cautions: z.array(z.object({ title: text(120), text: text(1000) })).max(30, { message: 'at most 30 cautions' }),
  approval: z
    .object({
      signedName: text(120),
      signedAt: z.string().regex(/^\d{4}-\d{2}-\d{2}([T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?)?$/, {
        message: 'must be an ISO 8601 date or date-time such as 2027-03-14T15:42:00Z',
      }),
      contentHash: z.string().regex(/^[0-9a-f]{64}$/i, { message: 'must be a SHA-256 hash written as 64 hexadecimal digits' }),
    })
    .nullish(),
  timeZone: z.string().refine(isTimeZone, { message: 'must be an IANA time zone such as America/Chicago' }).default('UTC'),
});

export type DocData = z.output<typeof ProposalDocumentInputSchema>;
export type DocLine = DocData['lines'][number];
export type DocGroup = DocData['groups'][number];
export type Status = DocData['proposal']['status'];

/** Refuses the input with the field at fault and a sentence a person can act on. */
export function fail(field: string, message: string): never {
  throw new DomainValidationError(field, `Proposal document: ${field} ${message}.`);
}

/** Validated input whose totals agree with its lines and with one another. */
export function parseInput(input: ProposalDocumentInput): DocData {
  const result = ProposalDocumentInputSchema.safeParse(input);
  if (!result.success) {
    const issue = result.error.issues[0];
    fail(issue.path.join('.') || 'input', issue.message);
  }
  const data = result.data;
  const { totals } = data;
  const money = (c: number) => formatCents(c, data.proposal.currency);
  const includedCents = data.lines.filter((l) => l.included).reduce((sum, l) => sum + l.amountCents, 0);
  const advice = 'compute the totals with proposalTotals (shared/domain/proposal-totals.ts) and pass them unchanged';
  if (includedCents !== totals.subtotalCents) {
    fail('totals.subtotalCents', `is ${money(totals.subtotalCents)} but the included lines add up to ${money(includedCents)}; ${advice}`);
  }
  if (totals.discountCents > totals.subtotalCents) fail('totals.discountCents', `is more than the subtotal; ${advice}`);
  if (totals.totalCents !== totals.subtotalCents - totals.discountCents + totals.taxCents) {
    fail('totals.totalCents', `is not subtotal − discount + tax; ${advice}`);
  }
  if (totals.balanceCents !== totals.totalCents - totals.depositCents) fail('totals.balanceCents', `is not total − deposit; ${advice}`);
  if (data.proposal.status === 'approved' && !data.approval) {
    fail('approval', 'is missing: an approved proposal prints its approval record (signed name, time and content hash)');
  }
  if (data.approval && data.proposal.status !== 'approved') {
    fail('approval', `was given for a proposal whose status is "${data.proposal.status}"; only an approved proposal has an approval record`);
  }
  return data;
}
