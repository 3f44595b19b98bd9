/**
 * An invented proposal for document tests and benchmarks: work on three units of Coulee Bend (the
 * property of document-fixtures.ts) — the Clover Plot, North Ridge Timber and the Ridge access —
 * with twelve lines, one option chosen and one not, a 10 % discount, 5.5 % sales tax and a 30 %
 * deposit. Totals come from proposalTotals, the one rule, and are passed in unchanged.
 */
import { createHash } from 'node:crypto';
import { measureArea } from '../../shared/domain/geometry';
import { canonicalProposalContent, proposalTotals, type OrderDiscount, type ProposalLineInput } from '../../shared/domain/proposal-totals';
import type { ProposalDocumentInput, ProposalDocumentLine } from '../../templates/documents/proposal-input';
import { BOUNDARY, measured, UNITS } from './document-fixtures';

/** A line as the consultant prices it: everything but the computed amount. */
export type FixtureLine = Omit<ProposalDocumentLine, 'amountCents' | 'included'> & { selected?: boolean };

export const DISCOUNT: OrderDiscount = { kind: 'percent', percent: '10' };
export const TAX_RATE_PCT = 5.5;
export const DEPOSIT_PCT = 30;

const CLOVER = 'Clover Plot';
const TIMBER = 'North Ridge Timber';
const ACCESS = 'Ridge access';

/** The description with an ampersand and a less-than sign (escaping check). */
export const ESCAPED_DESCRIPTION = 'Ladino & red clover mix <inoculated>, 8 lb/acre';
/** The option the client chose (counted). */
export const CHOSEN_OPTION = 'Temporary exclusion fence around the plot';
/** The option the client did not choose (priced, not counted). */
export const SKIPPED_OPTION = 'Second chainsaw crew to finish in one week';

export const FIXTURE_LINES: FixtureLine[] = [
  { id: 101, groupLabel: CLOVER, category: 'fees', description: 'Soil sample and lab analysis', quantity: '1.0000', unit: 'each', unitPriceCents: 3500, taxable: false, optional: false },
  { id: 102, groupLabel: CLOVER, category: 'materials', description: 'Pelletized lime, 40-lb bags (2 t/acre)', quantity: '95.0000', unit: 'bag', unitPriceCents: 749, taxable: true, optional: false },
  { id: 103, groupLabel: CLOVER, category: 'materials', description: ESCAPED_DESCRIPTION, quantity: '19.0000', unit: 'lb', unitPriceCents: 685, taxable: true, optional: false },
  { id: 104, groupLabel: CLOVER, category: 'labor', description: 'Disk, seed and cultipack the seedbed', quantity: '2.3700', unit: 'acre', unitPriceCents: 8735, taxable: false, optional: false },
  { id: 105, groupLabel: CLOVER, category: 'equipment', description: 'Tractor with disk and cultipacker', quantity: '3.5000', unit: 'hour', unitPriceCents: 6500, taxable: false, optional: false },
  { id: 106, groupLabel: CLOVER, category: 'materials', description: CHOSEN_OPTION, quantity: '600.0000', unit: 'ft', unitPriceCents: 115, taxable: true, optional: true, selected: true },
  { id: 201, groupLabel: TIMBER, category: 'labor', description: 'Hinge-cut and release marked trees', quantity: '4.5000', unit: 'acre', unitPriceCents: 42000, taxable: false, optional: false },
  { id: 202, groupLabel: TIMBER, category: 'labor', description: SKIPPED_OPTION, quantity: '16.0000', unit: 'hour', unitPriceCents: 5825, taxable: false, optional: true, selected: false },
  { id: 203, groupLabel: TIMBER, category: 'materials', description: 'Flagging tape and tree-marking paint', quantity: '3.0000', unit: 'each', unitPriceCents: 1240, taxable: true, optional: false },
  { id: 301, groupLabel: ACCESS, category: 'labor', description: 'Clear and grade the trail', quantity: '1240.0000', unit: 'ft', unitPriceCents: 95, taxable: false, optional: false },
  { id: 302, groupLabel: ACCESS, category: 'materials', description: 'Crushed gravel for the creek crossing', quantity: '14.2500', unit: 'ton', unitPriceCents: 3850, taxable: true, optional: false },
  { id: 303, groupLabel: ACCESS, category: 'equipment', description: 'Mini excavator with operator', quantity: '1.0000', unit: 'day', unitPriceCents: 42500, taxable: false, optional: false },
];

export const FIXTURE_TERMS = [
  'Work is scheduled in the planting and cutting windows shown above; weather may move a date by up to two weeks.',
  'Materials are bought after approval and stay on site until used.',
  '',
  'Payment: the deposit is due on approval. Progress invoices follow as each unit is finished,',
  'and the final invoice when the last unit is done. Invoices are due in 30 days.',
].join('\n');

function toPricingLine(line: FixtureLine): ProposalLineInput {
  return {
    id: String(line.id),
    quantity: line.quantity,
    unitPriceCents: line.unitPriceCents,
    taxable: line.taxable,
    optional: line.optional,
    selected: line.selected,
    category: line.category,
    description: line.description,
    unit: line.unit,
  };
}

/** The pricing input of the fixture's lines, for proposalTotals and the content hash. */
export function pricingOf(lines: readonly FixtureLine[]) {
  return { lines: lines.map(toPricingLine), discount: DISCOUNT, taxRatePct: TAX_RATE_PCT, depositPct: DEPOSIT_PCT };
}

const unitByName = new Map(UNITS.map((u) => [u.name, { ...u, ...measured(u) }]));

function groupOf(label: string, summaries: string[]) {
  const unit = unitByName.get(label);
  return { label, kind: unit?.kind ?? null, acres: unit?.acres ?? null, lengthFt: unit?.lengthFt ?? null, summaries };
}

export const FIXTURE_GROUPS = [
  groupOf(CLOVER, [
    'Test the soil first, then spread pelletized lime to bring the pH up to about 6.5 before seeding.',
    'Disk, seed ladino and red clover at 8 lb per acre, and cultipack, between August 15 and September 10.',
    'A temporary fence keeps deer off the young clover until it is established.',
  ]),
  groupOf(TIMBER, [
    'Hinge-cut marked trees along the ridge in late winter to thicken bedding cover close to the ground.',
    'Mark the trees to keep (oaks and other mast producers) before any cutting.',
  ]),
  groupOf(ACCESS, [
    'Clear and grade the trail from the gate to the ridge so stands can be reached quietly.',
    'Crushed gravel and a shaped crossing where the trail meets the creek.',
  ]),
];

export const FIXTURE_CAUTIONS = [
  {
    title: 'Herbicide and lime',
    text: 'Follow the product label, which is the law. Restricted-use products need a certified applicator; mind drift, water setbacks and protective equipment.',
  },
  {
    title: 'Chainsaw and hinge-cutting',
    text: 'Hinge-cutting carries a real risk of injury: trained operators, protective gear, never alone.',
  },
  { title: 'Work near the creek', text: 'Work in wetlands or streams may need permits; the crossing is checked with the county before any gravel is placed.' },
];

export interface ProposalFixtureOptions {
  lines?: FixtureLine[];
  status?: ProposalDocumentInput['proposal']['status'];
  approved?: { signedName: string; signedAt: string };
  introduction?: string | null;
  extraUnits?: ProposalDocumentInput['units'];
  groups?: ProposalDocumentInput['groups'];
}

/** The proposal document input for Coulee Bend with its totals from proposalTotals. */
export function couleeBendProposal(options: ProposalFixtureOptions = {}): ProposalDocumentInput {
  const lines = options.lines ?? FIXTURE_LINES;
  const pricing = pricingOf(lines);
  const totals = proposalTotals(pricing);
  const status = options.status ?? (options.approved ? 'approved' : 'sent');
  const approval = options.approved
    ? {
        ...options.approved,
        contentHash: createHash('sha256')
          .update(canonicalProposalContent({ ...pricing, terms: FIXTURE_TERMS, currency: 'USD' }))
          .digest('hex'),
      }
    : null;
  return {
    firm: { name: 'Driftless Habitat Works', phone: '(608) 555-0142', email: 'plans@driftless-habitat.example', address: 'PO Box 118, Soldiers Grove, WI 54655' },
    client: { name: 'Marta and Jon Lindqvist' },
    property: { name: 'Coulee Bend', acres: measureArea(BOUNDARY).acres, boundary: BOUNDARY, locality: 'Crawford County, Wisconsin' },
    proposal: {
      number: 'P-2027-004',
      version: 2,
      title: 'Clover, cover and a quiet way in',
      introduction:
        options.introduction === undefined
          ? 'Marta and Jon, here is the work we walked through in April, priced unit by unit. Version 2 adds the exclusion fence you asked about and prices a second saw crew as an option. Everything below is what we would do this season; nothing is ordered until you approve.'
          : options.introduction,
      preparedOn: '2027-04-20',
      expiresOn: '2027-05-20',
      status,
      terms: FIXTURE_TERMS,
      currency: 'USD',
    },
    units: [...UNITS.map((u) => ({ ...u, ...measured(u) })), ...(options.extraUnits ?? [])],
    groups: options.groups ?? FIXTURE_GROUPS,
    lines: totals.lines.map((priced, i) => ({
      ...lines[i],
      amountCents: priced.amountCents,
      included: priced.included,
    })).map(({ selected: _selected, ...line }) => line),
    totals: {
      subtotalCents: totals.subtotalCents,
      discountCents: totals.discountCents,
      taxableCents: totals.taxableCents,
      taxCents: totals.taxCents,
      totalCents: totals.totalCents,
      depositCents: totals.depositCents,
      balanceCents: totals.balanceCents,
      taxRatePct: TAX_RATE_PCT,
      depositPct: DEPOSIT_PCT,
      discountLabel: '10% discount',
    },
    cautions: FIXTURE_CAUTIONS,
    approval,
  };
}
