/**
 * The proposal PDF a landowner receives: a letterhead with the firm, the proposal's number,
 * version and dates, client and property, an optional introduction and the plan map; the work unit
 * by unit in plain words; the priced lines grouped by unit (options marked, options not chosen
 * greyed and not counted); the totals with discount, sales tax, deposit and balance; the terms,
 * the cautions boxed in clay, and how to approve (or the approval record with its content hash).
 * Drafts and proposals that can no longer be approved carry a banner and a watermark.
 *
 * Every amount is printed exactly as given in the input, which the server computes with
 * shared/domain/proposal-totals.ts: this file never rounds money. It only checks that the given
 * totals agree with one another (included lines add up to the subtotal, and so on) and refuses
 * input that does not, so a PDF can never show figures that contradict each other.
 */
import { LineCategorySchema } from '../../shared/schemas/proposal';
import { ProposalTotalsFiguresSchema } from '../../shared/schemas/proposal-dto';
import type { Geometry, MultiPolygon, Polygon } from 'geojson';
import type { Column, Content, CustomTableLayout, TableCell, TDocumentDefinitions, Watermark } from 'pdfmake/interfaces';
import { z } from 'zod';
import { DomainValidationError } from '../../shared/domain/errors';
import { formatLatLon } from '../../shared/domain/geometry';
import { formatCents } from '../../shared/domain/money';
import { formatDate, formatMoment, isTimeZone } from '../../shared/domain/clock';
import { KIND_STYLES, UNIT_KINDS, type UnitKind } from '../../shared/domain/unit-kinds';
import { kindSwatchSvg, PlanMapOverlaysSchema, renderPlanMap } from './kit/map-svg';
import {
  DOC_COLORS,
  FONT_HEADING,
  keepWithNextRule,
  keyValueTable,
  pageFrame,
  ruledTableLayout,
} from './kit/layout';
import { formatArea, formatLength, DEFAULT_DISPLAY_UNITS, type DisplayUnits } from '../../shared/units';
import type { ProposalDocumentInput } from './proposal-input';
import { firmBlock } from './firm-block';

export type { ProposalDocumentInput, ProposalDocumentLine } from './proposal-input';

/** DESIGN.md token "ochre": attention, drafts. Used for borders and marks only (too light for text). */
const OCHRE = '#C99A2E';
/** A pale wash of ochre behind the draft banner (ink on it passes WCAG AA). */
const OCHRE_TINT = '#FBF5E6';
/** A pale wash of moss behind the approval record (ink on it passes WCAG AA). */
const MOSS_TINT = '#EEF3EA';
/** Greyed text of options that are not included (slate is the lightest text colour that passes AA). */
const GREYED = DOC_COLORS.slate;

const PAGE_WIDTH_PT = 612;
const SIDE_MARGIN_PT = 54;
const CONTENT_WIDTH_PT = PAGE_WIDTH_PT - 2 * SIDE_MARGIN_PT;
/** US Letter height less pageFrame's top (70) and bottom (60) margins. */
const PAGE_INNER_HEIGHT_PT = 792 - 70 - 60;
const MAP_MIN_HEIGHT_PT = 220;
const MAP_MAX_HEIGHT_PT = 430;
/** Room a group's header row needs below it: itself and one line row. */
const GROUP_ROW_KEEP_PT = 52;
const GROUP_ROW_ID = 'proposal-group-row-';

// ---------------------------------------------------------------------------------------------
// Input validation
// ---------------------------------------------------------------------------------------------

const GeometrySchema = z.custom<Geometry>(
  (v) => typeof v === 'object' && v !== null && typeof (v as { type?: unknown }).type === 'string',
  { message: 'must be a GeoJSON geometry' },
);
const AreaGeometrySchema = z.custom<Polygon | MultiPolygon>(
  (v) => typeof v === 'object' && v !== null && ['Polygon', 'MultiPolygon'].includes((v as { type?: string }).type ?? ''),
  { message: 'must be a GeoJSON Polygon or MultiPolygon' },
);
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

type DocData = z.output<typeof ProposalDocumentInputSchema>;
type DocLine = DocData['lines'][number];
type DocGroup = DocData['groups'][number];
type Status = DocData['proposal']['status'];

function fail(field: string, message: string): never {
  throw new DomainValidationError(field, `Proposal document: ${field} ${message}.`);
}

/** Validated input whose totals agree with its lines and with one another. */
function parseInput(input: ProposalDocumentInput): DocData {
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

// ---------------------------------------------------------------------------------------------
// Formatting (no money arithmetic: amounts come from the input)
// ---------------------------------------------------------------------------------------------

/** "May 4, 2026" from "2026-05-04", read as a calendar date (no time zone shift). */
function formatCalendarDate(isoDate: string, field: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const date = new Date(Date.UTC(y, m - 1, d));
  if (date.getUTCMonth() !== m - 1 || date.getUTCDate() !== d) fail(field, `${isoDate} is not a calendar date`);
  return formatDate(isoDate, { long: true });
}

/** "March 14, 2027, 10:42 AM CDT" from an ISO date-time, in the firm's zone; the date alone from a date. */
function formatSignedAt(value: string, timeZone: string): string {
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return formatCalendarDate(value, 'approval.signedAt');
  const instant = new Date(/(Z|[+-]\d{2}:?\d{2})$/.test(value) ? value : `${value}Z`);
  if (Number.isNaN(instant.getTime())) fail('approval.signedAt', `${value} is not a date-time`);
  return formatMoment(instant, timeZone, { long: true });
}

/** "1,200" from "1200.0000", "2.37" from "2.3700": the decimal string as written, grouped, zeros trimmed. */
export function formatQuantity(quantity: string): string {
  const [whole, fraction = ''] = quantity.split('.');
  const grouped = whole.replace(/^0+(?=\d)/, '').replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const trimmed = fraction.replace(/0+$/, '');
  return trimmed ? `${grouped}.${trimmed}` : grouped;
}

/** Count nouns whose plural is a plain "s"; other units ("lb", "gal", "each") read the same either way. */
const PLURAL_NOUNS = new Set(['acre', 'hour', 'ton', 'day', 'bag', 'trip', 'load', 'visit', 'tree', 'sign', 'post']);

/** "2.37 acres", "1 acre", "3 50-lb bags", "12.5 lb". */
export function quantityWithUnit(quantity: string, unit: string): string {
  const shown = formatQuantity(quantity);
  const trimmedUnit = unit.trim();
  if (!trimmedUnit) return shown;
  const match = /^(.*?)([A-Za-z]+)$/.exec(trimmedUnit);
  const plural = shown !== '1' && match !== null && PLURAL_NOUNS.has(match[2].toLowerCase());
  return `${shown} ${plural ? `${trimmedUnit}s` : trimmedUnit}`;
}

/** "5.5%", "7.25%", "30%" — up to four decimals, trailing zeros dropped. */
function formatPct(pct: number): string {
  return `${Number(pct.toFixed(4))}%`;
}

/** Paragraphs split on blank lines; single line breaks kept inside a paragraph. */
function paragraphs(body: string, style: Record<string, unknown> = {}): Content[] {
  return body
    .replace(/\r\n?/g, '\n')
    .split(/\n\s*\n/)
    .map((p) => p.replace(/^\n+|\n+$/g, ''))
    .filter((p) => p.trim() !== '')
    .map((p, i, all) => ({ text: p, margin: [0, 0, 0, i === all.length - 1 ? 0 : 6], ...style }) as Content);
}

function swatch(kind: UnitKind | null | undefined, marginTopPt = 1.5): Column {
  if (!kind) return { text: '', width: 16 };
  return { svg: kindSwatchSvg(kind, 16, 10), width: 16, margin: [0, marginTopPt, 0, 0] };
}

/** The firm's units as the document's firm carries them (acres and feet when it chose none). */
function unitsOf(data: DocData): DisplayUnits {
  return { areaUnit: data.firm.areaUnit ?? DEFAULT_DISPLAY_UNITS.areaUnit, lengthUnit: data.firm.lengthUnit ?? DEFAULT_DISPLAY_UNITS.lengthUnit };
}

function sizeOf(group: Pick<DocGroup, 'kind' | 'acres' | 'lengthFt'>, units: DisplayUnits): string {
  const family = group.kind ? KIND_STYLES[group.kind].family : null;
  if (family !== 'line' && group.acres != null) return formatArea(group.acres, units.areaUnit);
  if (family !== 'area' && group.lengthFt != null) return formatLength(group.lengthFt, units.lengthUnit);
  return '';
}

// ---------------------------------------------------------------------------------------------
// Status
// ---------------------------------------------------------------------------------------------

interface StatusLook {
  word: string;
  headline: string;
  detail: string;
  color: string;
  tint: string;
}

function statusLook(status: Status, firmName: string, validUntil: string | null): StatusLook | null {
  switch (status) {
    case 'draft':
      return {
        word: 'DRAFT',
        headline: 'DRAFT — not yet sent',
        detail: 'Prices and terms may still change; this copy cannot be approved.',
        color: OCHRE,
        tint: OCHRE_TINT,
      };
    case 'declined':
      return {
        word: 'DECLINED',
        headline: 'DECLINED — this proposal was declined',
        detail: `It can no longer be approved. Ask ${firmName} for a revised version.`,
        color: DOC_COLORS.clay,
        tint: DOC_COLORS.clayTint,
      };
    case 'withdrawn':
      return {
        word: 'WITHDRAWN',
        headline: `WITHDRAWN — ${firmName} withdrew this proposal`,
        detail: 'It can no longer be approved; a newer version may replace it.',
        color: DOC_COLORS.clay,
        tint: DOC_COLORS.clayTint,
      };
    case 'expired':
      return {
        word: 'EXPIRED',
        headline: validUntil ? `EXPIRED — this proposal was valid until ${validUntil}` : 'EXPIRED — this proposal is no longer valid',
        detail: `Prices may have changed. Ask ${firmName} for a current version.`,
        color: DOC_COLORS.clay,
        tint: DOC_COLORS.clayTint,
      };
    default:
      return null;
  }
}

function banner(look: { headline: string; detail: string; color: string; tint: string }): Content {
  return {
    margin: [0, 0, 0, 12],
    table: {
      widths: ['*'],
      body: [
        [
          {
            fillColor: look.tint,
            stack: [
              { text: look.headline, font: FONT_HEADING, bold: true, fontSize: 10.5, color: DOC_COLORS.ink },
              { text: look.detail, fontSize: 9, color: DOC_COLORS.ink, margin: [0, 2, 0, 0] },
            ],
          },
        ],
      ],
    },
    layout: {
      hLineWidth: () => 0,
      vLineWidth: (i) => (i === 0 ? 4 : 0),
      vLineColor: () => look.color,
      paddingLeft: () => 10,
      paddingRight: () => 10,
      paddingTop: () => 7,
      paddingBottom: () => 7,
    },
  };
}

function watermarkFor(look: StatusLook | null): Watermark | undefined {
  if (!look) return undefined;
  return { text: look.word, color: look.color, opacity: 0.09, bold: true, font: FONT_HEADING, fontSize: look.word.length > 7 ? 86 : 110 };
}

// ---------------------------------------------------------------------------------------------
// Sections
// ---------------------------------------------------------------------------------------------

function letterhead(data: DocData, preparedOn: string, validUntil: string | null): Content {
  const { firm, proposal } = data;
  return {
    margin: [0, 0, 0, 14],
    stack: [
      {
        columns: [
          firmBlock(firm),
          {
            width: 'auto',
            stack: [
              { text: 'PROPOSAL', fontSize: 8, bold: true, color: DOC_COLORS.moss, characterSpacing: 1.2, alignment: 'right', margin: [0, 2, 0, 2] },
              { text: `Proposal ${proposal.number} · version ${proposal.version}`, bold: true, fontSize: 10, alignment: 'right' },
              { text: `Prepared ${preparedOn}`, fontSize: 9, color: DOC_COLORS.slate, alignment: 'right' },
              ...(validUntil ? [{ text: `Valid until ${validUntil}`, fontSize: 9, color: DOC_COLORS.slate, alignment: 'right' as const }] : []),
            ],
          },
        ],
        columnGap: 16,
      },
      { canvas: [{ type: 'line', x1: 0, y1: 8, x2: CONTENT_WIDTH_PT, y2: 8, lineWidth: 1, lineColor: DOC_COLORS.rule }] },
    ],
  };
}

function headline(data: DocData, locality: string, preparedOn: string, validUntil: string | null): Content {
  const money = (c: number) => formatCents(c, data.proposal.currency);
  const facts = keyValueTable(
    [
      { label: 'Prepared for', value: data.client.name },
      { label: 'Property', value: data.property.name },
      { label: 'Location', value: locality },
      { label: 'Prepared', value: `${preparedOn} by ${data.firm.name}` },
      ...(validUntil ? [{ label: 'Valid until', value: validUntil }] : []),
    ],
    74,
  );
  const figures: Content = {
    stack: [
      { text: formatArea(data.property.acres, unitsOf(data).areaUnit), font: FONT_HEADING, bold: true, fontSize: 16, color: DOC_COLORS.mossDeep, alignment: 'right' },
      { text: 'total property area', style: 'small', alignment: 'right', margin: [0, 0, 0, 6] },
      { text: money(data.totals.totalCents), font: FONT_HEADING, bold: true, fontSize: 16, color: DOC_COLORS.ink, alignment: 'right' },
      {
        text: data.totals.taxCents > 0 ? 'total, sales tax included' : 'total',
        style: 'small',
        alignment: 'right',
      },
    ],
  };
  return {
    stack: [
      { text: data.proposal.title, style: 'title' },
      { text: `Prepared for ${data.client.name} by ${data.firm.name}`, style: 'subtitle' },
      { columns: [{ width: '*', stack: [facts] }, { width: 160, stack: [figures] }], columnGap: 16, margin: [0, 0, 0, 12] },
    ],
  };
}

/*
 * Heights on page 1, measured on rendered proposals (pdftotext -bbox): a 10 pt body line of
 * Source Sans 3 at line height 1.25 takes 17.8 pt, a facts row 20.8 pt, a 20 pt title line 31.5 pt.
 */
const LETTERHEAD_PT = 80;
const TITLE_LINE_PT = 31.5;
const TITLE_CHARS_PER_LINE = 40;
const SUBTITLE_PT = 31;
const FACT_ROW_PT = 20.8;
const BODY_LINE_PT = 17.8;
const BODY_CHARS_PER_LINE = 105;
const BANNER_PT = 60;
const MAP_NOTE_PT = 20;
const SLACK_PT = 20;

/**
 * Height of the map that fills the rest of page 1 below the letterhead, facts and introduction
 * (estimated from the text's length). When less than MAP_MIN_HEIGHT_PT would be left, the map
 * gets its full height and follows the work section instead (page 1 then fills with text).
 */
function mapPlacement(data: DocData, hasBanner: boolean): { heightPt: number; onPage1: boolean } {
  const intro = data.proposal.introduction?.trim() ?? '';
  const introParagraphs = intro ? intro.split(/\n\s*\n/) : [];
  const introLines = introParagraphs.reduce(
    (n, p) => n + p.split('\n').reduce((m, line) => m + Math.max(1, Math.ceil(line.length / BODY_CHARS_PER_LINE)), 0),
    0,
  );
  const introPt = intro ? introLines * BODY_LINE_PT + (introParagraphs.length - 1) * 6 + 12 : 0;
  const titlePt = Math.ceil(data.proposal.title.length / TITLE_CHARS_PER_LINE) * TITLE_LINE_PT + SUBTITLE_PT;
  const factsPt = (data.proposal.expiresOn ? 5 : 4) * FACT_ROW_PT + 12;
  const usedPt = LETTERHEAD_PT + (hasBanner ? BANNER_PT : 0) + titlePt + factsPt + introPt + MAP_NOTE_PT + SLACK_PT;
  const available = PAGE_INNER_HEIGHT_PT - usedPt;
  if (available < MAP_MIN_HEIGHT_PT) return { heightPt: MAP_MAX_HEIGHT_PT, onPage1: false };
  return { heightPt: Math.floor(Math.min(MAP_MAX_HEIGHT_PT, available)), onPage1: true };
}

function workSection(groups: readonly DocGroup[], units: DisplayUnits): Content[] {
  if (groups.length === 0) return [];
  const blocks: Content[] = groups.map((g) => {
    const kindLabel = g.kind ? KIND_STYLES[g.kind].label : '';
    const size = sizeOf(g, units);
    return {
      unbreakable: true,
      margin: [0, 0, 0, 10],
      stack: [
        {
          columns: [
            swatch(g.kind, 3),
            { width: '*', text: g.label, font: FONT_HEADING, bold: true, fontSize: 10.5, color: DOC_COLORS.ink },
            {
              width: 'auto',
              text: [kindLabel, size].filter(Boolean).join(' · '),
              fontSize: 9,
              color: DOC_COLORS.slate,
              alignment: 'right',
              margin: [0, 1.5, 0, 0],
            },
          ],
          columnGap: 8,
          margin: [0, 0, 0, 3],
        },
        g.summaries.length > 0
          ? { ul: g.summaries.map((s) => ({ text: s, fontSize: 9.5, margin: [0, 0, 0, 1.5] })), markerColor: DOC_COLORS.moss, margin: [24, 0, 0, 0] }
          : { text: 'No work described for this unit.', style: 'small', margin: [24, 0, 0, 0] },
      ],
    };
  });
  return [{ text: 'The work, unit by unit', style: 'h2' }, ...blocks];
}

interface LineGroup {
  label: string;
  group: DocGroup | null;
  lines: DocLine[];
}

/** Lines grouped by unit: groups in the order given, then any other labels in order of first use. */
function groupLines(lines: readonly DocLine[], groups: readonly DocGroup[]): LineGroup[] {
  const byLabel = new Map<string, LineGroup>();
  for (const g of groups) if (!byLabel.has(g.label)) byLabel.set(g.label, { label: g.label, group: g, lines: [] });
  for (const line of lines) {
    const label = line.groupLabel.trim() || 'General';
    let entry = byLabel.get(label);
    if (!entry) {
      entry = { label, group: null, lines: [] };
      byLabel.set(label, entry);
    }
    entry.lines.push(line);
  }
  return [...byLabel.values()].filter((g) => g.lines.length > 0);
}

function lineRow(line: DocLine, money: (c: number) => string): TableCell[] {
  const notIncluded = line.optional && !line.included;
  const color = notIncluded ? GREYED : DOC_COLORS.ink;
  const tag = line.optional ? [{ text: 'OPTION  ', fontSize: 7.5, bold: true, color: notIncluded ? GREYED : DOC_COLORS.moss, characterSpacing: 0.6 }] : [];
  return [
    { text: [...tag, { text: line.description }], style: 'tableCell', color },
    { text: quantityWithUnit(line.quantity, line.unit), style: 'tableCell', alignment: 'right', color },
    { text: money(line.unitPriceCents), style: 'tableCell', alignment: 'right', color },
    notIncluded
      ? { text: 'not included', style: 'tableCell', alignment: 'right', italics: true, color: GREYED }
      : { text: money(line.amountCents), style: 'tableCell', alignment: 'right' },
  ];
}

function linesTable(groups: readonly LineGroup[], money: (c: number) => string, units: DisplayUnits): Content {
  const header: TableCell[] = [
    { text: 'Description', style: 'tableHeader' },
    { text: 'Quantity', style: 'tableHeader', alignment: 'right' },
    { text: 'Unit price', style: 'tableHeader', alignment: 'right' },
    { text: 'Amount', style: 'tableHeader', alignment: 'right' },
  ];
  const body: TableCell[][] = [header];
  const groupRows = new Set<number>();
  groups.forEach((g, index) => {
    groupRows.add(body.length);
    const size = g.group ? sizeOf(g.group, units) : '';
    body.push([
      {
        // pdfmake passes a node's id to the page-break rule; its typings know ids on ToC nodes only.
        id: `${GROUP_ROW_ID}${index}`,
        colSpan: 4,
        fillColor: DOC_COLORS.paper,
        columns: [
          ...(g.group?.kind ? [swatch(g.group.kind, 2)] : []),
          { width: '*', text: g.label, font: FONT_HEADING, bold: true, fontSize: 9.5, color: DOC_COLORS.ink },
          { width: 'auto', text: size, fontSize: 8.5, color: DOC_COLORS.slate, alignment: 'right', margin: [0, 1, 0, 0] },
        ],
        columnGap: 8,
      } as TableCell,
      {},
      {},
      {},
    ]);
    for (const line of g.lines) body.push(lineRow(line, money));
  });
  const layout: CustomTableLayout = {
    ...ruledTableLayout,
    hLineWidth: (i, node) => (i === 0 || i === node.table.body.length ? 0 : i === 1 ? 1 : 0.5),
    hLineColor: (i) => (i === 1 ? DOC_COLORS.slate : DOC_COLORS.rule),
    paddingLeft: (i) => (i === 0 ? 4 : 6),
    paddingRight: (i, node) => (i === (node.table.widths?.length ?? 1) - 1 ? 4 : 6),
    paddingTop: (row) => (groupRows.has(row) ? 4 : 3),
    paddingBottom: (row) => (groupRows.has(row) ? 3 : 3),
  };
  return {
    table: { headerRows: 1, dontBreakRows: true, widths: ['*', 84, 64, 70], body },
    layout,
  };
}

const CATEGORY_LABELS: Record<DocLine['category'], string> = {
  materials: 'Materials',
  labor: 'Labor',
  equipment: 'Equipment',
  fees: 'Fees',
};

/**
 * Included amounts by category, when the lines span more than one. A plain sum of the given line
 * amounts (whole cents, no rounding), so the rows add up to the subtotal exactly.
 */
function categoryTable(lines: readonly DocLine[], subtotalCents: number, money: (c: number) => string): Content | null {
  const sums = new Map<DocLine['category'], number>();
  for (const line of lines) if (line.included) sums.set(line.category, (sums.get(line.category) ?? 0) + line.amountCents);
  if (sums.size < 2) return null;
  const order = Object.keys(CATEGORY_LABELS) as Array<DocLine['category']>;
  const rows: TableCell[][] = order
    .filter((c) => sums.has(c))
    .map((c) => [
      { text: CATEGORY_LABELS[c], style: 'tableCell' },
      { text: money(sums.get(c)!), style: 'tableCell', alignment: 'right' },
    ]);
  return {
    unbreakable: true,
    stack: [
      { text: 'By category', font: FONT_HEADING, bold: true, fontSize: 9.5, margin: [0, 0, 0, 3] },
      {
        table: {
          widths: ['*', 'auto'],
          body: [...rows, [{ text: 'Subtotal', style: 'tableTotal' }, { text: money(subtotalCents), style: 'tableTotal', alignment: 'right' }]],
        },
        layout: { ...ruledTableLayout, hLineWidth: (i, node) => (i === node.table.body.length - 1 ? 0.75 : 0), hLineColor: () => DOC_COLORS.rule },
      },
      { text: 'Before discount and sales tax.', style: 'small', margin: [0, 3, 0, 0] },
    ],
  };
}

function totalsBlock(data: DocData, money: (c: number) => string): Content {
  const t = data.totals;
  type Row = { label: string; value: string; kind?: 'muted' | 'total' | 'after' };
  const rows: Row[] = [{ label: 'Subtotal', value: money(t.subtotalCents) }];
  if (t.discountCents > 0) rows.push({ label: t.discountLabel?.trim() || 'Discount', value: `−${money(t.discountCents)}` });
  if (t.taxRatePct > 0 || t.taxCents > 0) {
    rows.push({ label: 'Taxable amount', value: money(t.taxableCents), kind: 'muted' });
    rows.push({ label: `Sales tax at ${formatPct(t.taxRatePct)}`, value: money(t.taxCents) });
  } else {
    rows.push({ label: 'No sales tax', value: money(t.taxCents), kind: 'muted' });
  }
  rows.push({ label: 'Total', value: money(t.totalCents), kind: 'total' });
  if (t.depositPct > 0 || t.depositCents > 0) {
    rows.push({ label: `Deposit due on approval (${formatPct(t.depositPct)})`, value: money(t.depositCents), kind: 'after' });
    rows.push({ label: 'Balance, invoiced as the work is done', value: money(t.balanceCents), kind: 'after' });
  }
  const totalIndex = rows.findIndex((r) => r.kind === 'total');
  const body: TableCell[][] = rows.map((r) => {
    if (r.kind === 'total') {
      return [
        { text: 'Total', font: FONT_HEADING, bold: true, fontSize: 13, margin: [0, 3, 0, 0] },
        { text: r.value, font: FONT_HEADING, bold: true, fontSize: 16, color: DOC_COLORS.mossDeep, alignment: 'right', fontFeatures: ['tnum'] },
      ];
    }
    const color = r.kind === 'muted' ? DOC_COLORS.slate : DOC_COLORS.ink;
    return [
      { text: r.label, style: 'tableCell', color },
      { text: r.value, style: 'tableCell', alignment: 'right', color },
    ];
  });
  return {
    unbreakable: true,
    table: { widths: ['*', 'auto'], body },
    layout: {
      hLineWidth: (i) => (i === totalIndex ? 1 : i === totalIndex + 1 && totalIndex + 1 < body.length ? 0.5 : 0),
      vLineWidth: () => 0,
      hLineColor: (i) => (i === totalIndex ? DOC_COLORS.ink : DOC_COLORS.rule),
      paddingLeft: () => 0,
      paddingRight: (i) => (i === 0 ? 10 : 0),
      paddingTop: (i) => (i === totalIndex ? 6 : i === totalIndex + 1 ? 6 : 2.5),
      paddingBottom: (i) => (i === totalIndex ? 6 : 2.5),
    },
  };
}

function priceSection(data: DocData, money: (c: number) => string): Content[] {
  const grouped = groupLines(data.lines, data.groups);
  const hasExcluded = data.lines.some((l) => l.optional && !l.included);
  const hasOptions = data.lines.some((l) => l.optional);
  const byCategory = categoryTable(data.lines, data.totals.subtotalCents, money);
  const out: Content[] = [{ text: 'Price', style: 'h2' }];
  if (grouped.length === 0) {
    out.push({ text: 'No priced lines yet.', style: 'muted' });
  } else {
    out.push(linesTable(grouped, money, unitsOf(data)));
  }
  // The note on options stays with the totals it explains, never alone at the top of a page.
  const note: Content[] = hasOptions
    ? [
        {
          text: hasExcluded
            ? 'Lines marked OPTION are extras. Options shown “not included” are priced for reference and are not counted in any total.'
            : 'Lines marked OPTION are extras you chose; they are counted in the totals.',
          style: 'small',
          margin: [0, 0, 0, 12],
        },
      ]
    : [];
  out.push({
    margin: [0, 5, 0, 0],
    unbreakable: true,
    stack: [
      ...note,
      {
        columns: [
          byCategory ? { width: 190, stack: [byCategory] } : { width: 190, text: '' },
          { width: '*', text: '' },
          { width: 250, stack: [totalsBlock(data, money)] },
        ],
        columnGap: 0,
        margin: [0, note.length > 0 ? 0 : 9, 0, 0],
      },
    ],
  });
  return out;
}

function termsSection(terms: string): Content[] {
  const body = paragraphs(terms, { fontSize: 9.5 });
  return [{ text: 'Terms', style: 'h2' }, ...(body.length > 0 ? body : [{ text: 'No further terms.', style: 'muted' }])];
}

const DEFERS = 'This proposal defers to local codes, state wildlife rules and licensed practice; check them before work begins.';

function cautionsSection(cautions: DocData['cautions']): Content {
  const rows: TableCell[][] = [
    [{ text: 'Before the work begins', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.clay, fillColor: DOC_COLORS.clayTint }],
    ...cautions.map((c): TableCell[] => [
      {
        fillColor: DOC_COLORS.clayTint,
        stack: [
          { text: c.title, style: 'cautionTitle', margin: [0, 0, 0, 1] },
          { text: c.text, style: 'caution' },
        ],
      },
    ]),
    [{ text: DEFERS, style: 'caution', italics: true, fillColor: DOC_COLORS.clayTint }],
  ];
  const last = rows.length - 1;
  return {
    margin: [0, 16, 0, 0],
    table: { widths: ['*'], headerRows: 1, keepWithHeaderRows: 1, dontBreakRows: true, body: rows },
    layout: {
      hLineWidth: (i, node) => (i === 0 || i === node.table.body.length ? 1 : 0),
      vLineWidth: () => 1,
      hLineColor: () => DOC_COLORS.clay,
      vLineColor: () => DOC_COLORS.clay,
      paddingLeft: () => 12,
      paddingRight: () => 12,
      paddingTop: (i) => (i === 0 ? 9 : i === last ? 6 : 4),
      paddingBottom: (i) => (i === last ? 9 : 4),
    },
  };
}

function approvalSection(data: DocData, money: (c: number) => string): Content {
  const { approval, proposal, firm } = data;
  let body: Content[];
  let color: string = DOC_COLORS.moss;
  let tint: string = MOSS_TINT;
  if (approval) {
    body = [
      { text: 'Approved', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 4] },
      { text: [{ text: 'Approved by ' }, { text: approval.signedName, bold: true }, { text: ` on ${formatSignedAt(approval.signedAt, data.timeZone)}.` }] },
      {
        text: `The approval covers version ${proposal.version} exactly as printed: its lines, prices, options, discount, sales tax, deposit and terms. Approval fingerprint (a code computed from all of that; any change would change it):`,
        style: 'small',
        margin: [0, 4, 0, 2],
      },
      { text: approval.contentHash.toLowerCase(), fontSize: 8, characterSpacing: 0.5, fontFeatures: ['tnum'], color: DOC_COLORS.ink },
    ];
  } else if (proposal.status === 'sent') {
    const deposit = data.totals.depositCents > 0 ? ` The deposit of ${money(data.totals.depositCents)} is due on approval.` : '';
    body = [
      { text: 'How to approve', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 4] },
      {
        text: `Approve online in your portal: open proposal ${proposal.number}, read it through, and type your name to approve it.${deposit}`,
      },
      {
        text: `Questions or changes? Contact ${[firm.name, firm.phone, firm.email].filter(Boolean).join(' · ')}.`,
        style: 'small',
        margin: [0, 4, 0, 0],
      },
    ];
  } else if (proposal.status === 'draft') {
    body = [
      { text: 'How to approve', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 4] },
      { text: 'Once this proposal is sent, the client approves it online in the portal by typing their name.' },
    ];
    color = OCHRE;
    tint = OCHRE_TINT;
  } else {
    body = [
      { text: 'Approval', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.ink, margin: [0, 0, 0, 4] },
      { text: `This version can no longer be approved online. Ask ${firm.name} for a current version.` },
    ];
    color = DOC_COLORS.slate;
    tint = DOC_COLORS.card;
  }
  return {
    unbreakable: true,
    margin: [0, 16, 0, 0],
    table: { widths: ['*'], body: [[{ stack: body, fillColor: tint }]] },
    layout: {
      hLineWidth: () => 1,
      vLineWidth: () => 1,
      hLineColor: () => color,
      vLineColor: () => color,
      paddingLeft: () => 12,
      paddingRight: () => 12,
      paddingTop: () => 9,
      paddingBottom: () => 9,
    },
  };
}

/**
 * Page-break rule of the proposal: headings stay with what follows (the shared rule), and a unit's
 * header row in the price table moves to the next page unless one line row fits below it.
 */
export const proposalPageBreakBefore = keepWithNextRule({ idPrefix: GROUP_ROW_ID, keepPt: GROUP_ROW_KEEP_PT });

/** The pdfmake document definition of a proposal (build a fresh one for every render). */
export function proposalDocument(input: ProposalDocumentInput): TDocumentDefinitions {
  const data = parseInput(input);
  const { firm, proposal, property } = data;
  const money = (c: number) => formatCents(c, proposal.currency);
  const preparedOn = formatCalendarDate(proposal.preparedOn, 'proposal.preparedOn');
  const validUntil = proposal.expiresOn ? formatCalendarDate(proposal.expiresOn, 'proposal.expiresOn') : null;
  const look = statusLook(proposal.status, firm.name, validUntil);
  const approvedLook =
    proposal.status === 'approved' && data.approval
      ? {
          headline: `APPROVED — by ${data.approval.signedName} on ${formatSignedAt(data.approval.signedAt, data.timeZone)}`,
          detail: 'The approval record is at the end of this proposal.',
          color: DOC_COLORS.moss,
          tint: MOSS_TINT,
        }
      : null;
  const bannerLook = look ?? approvedLook;

  const placement = mapPlacement(data, bannerLook !== null);
  const map = renderPlanMap({
    boundary: property.boundary,
    units: data.units.map((u) => ({ name: u.name, kind: u.kind, geometry: u.geometry })),
    overlays: data.overlays,
    widthPt: CONTENT_WIDTH_PT,
    heightPt: placement.heightPt,
  });
  const centre = map.layout.projection;
  const locality = property.locality?.trim() || `Near ${formatLatLon(centre.lon0, centre.lat0)}`;
  const intro = proposal.introduction?.trim() ? paragraphs(proposal.introduction) : [];
  const mapBlock: Content = {
    unbreakable: true,
    stack: [
      { svg: map.svg, width: CONTENT_WIDTH_PT },
      { text: 'Positions are approximate; the map is not a survey.', style: 'small', margin: [0, 4, 0, 0] },
    ],
  };

  const content: Content[] = [
    letterhead(data, preparedOn, validUntil),
    ...(bannerLook ? [banner(bannerLook)] : []),
    headline(data, locality, preparedOn, validUntil),
    ...(intro.length > 0 ? [{ stack: intro, margin: [0, 0, 0, 12] } as Content] : []),
    ...(placement.onPage1 ? [mapBlock] : []),
    ...workSection(data.groups, unitsOf(data)),
    ...(placement.onPage1 ? [] : [{ ...mapBlock, margin: [0, 8, 0, 0] } as Content]),
    ...priceSection(data, money),
    ...termsSection(proposal.terms),
    cautionsSection(data.cautions),
    approvalSection(data, money),
  ];

  const frame = pageFrame({
    title: `Proposal ${proposal.number} · version ${proposal.version}${look ? ` · ${look.word}` : ''}`,
    firmName: firm.name,
    firmContact: [firm.phone, firm.email].filter(Boolean).join(' · ') || undefined,
    preparedOn,
    // Page 1 carries its own letterhead; the running header starts on page 2.
    headerFromPage: 2,
  });
  return {
    ...frame,
    watermark: watermarkFor(look),
    pageBreakBefore: proposalPageBreakBefore,
    info: {
      title: `Proposal ${proposal.number} (version ${proposal.version}) — ${proposal.title}`,
      author: firm.name,
      subject: `Proposal for ${data.client.name}, ${property.name}`,
    },
    content,
  };
}
