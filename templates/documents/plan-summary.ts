/**
 * "Plan summary": a one-to-two page PDF for a landowner — firm header, client and property, total
 * acreage, the plan map with legend, scale bar and north arrow, the units with their acres or
 * lengths, acres by kind, cautions for the work planned, and page numbers.
 * Served later by `GET /api/properties/:id/plan.pdf`; its input is plain data.
 */
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import { z } from 'zod';
import { GeometrySchema, AreaGeometrySchema } from './kit/geometry-schemas';
import { DomainValidationError } from '../../shared/domain/errors';
import { formatLatLon } from '../../shared/domain/geometry';
import { KIND_STYLES, UNIT_KINDS, type UnitKind } from '../../shared/domain/unit-kinds';
import { FEET_PER_MILE, formatArea, formatLength as formatLengthIn, DEFAULT_DISPLAY_UNITS, type DisplayUnits } from '../../shared/units';
import { firmBlock } from './firm-block';
import { kindSwatchSvg, PlanMapOverlaysSchema, renderPlanMap } from './kit/map-svg';
import { cautionBox, DOC_COLORS, FONT_HEADING, keyValueTable, pageFrame, ruledTableLayout, CONTENT_WIDTH_PT } from './kit/layout';

const name = (max: number) => z.string().trim().min(1, { message: 'must not be empty' }).max(max, { message: `must be at most ${max} characters` });
const measure = z.number().finite().nonnegative({ message: 'must be zero or more' });

export const PlanSummaryInputSchema = z.object({
  firm: z.object({
    name: name(120),
    phone: z.string().max(40).nullish(),
    email: z.string().max(254).nullish(),
    address: z.string().max(300).nullish(),
    website: z.string().max(200).nullish(),
    licenceNumbers: z.string().max(300).nullish(),
    logo: z.string().startsWith('data:image/').nullish(),
    areaUnit: z.enum(['acres', 'hectares']).nullish(),
    lengthUnit: z.enum(['feet', 'metres']).nullish(),
  }),
  client: z.object({ name: name(120) }),
  property: z.object({
    name: name(120),
    acres: z.number().finite().positive({ message: 'must be more than zero' }),
    boundary: AreaGeometrySchema,
    /** "Richland County, Wisconsin" or similar; the centre's latitude/longitude is shown otherwise. */
    locality: z.string().max(160).optional(),
  }),
  /** "2026 season, version 2". */
  planLabel: z.string().max(120).optional(),
  /** Calendar date the document is prepared (YYYY-MM-DD). */
  preparedOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be a date written YYYY-MM-DD' }),
  units: z
    .array(
      z.object({
        name: name(120),
        kind: z.enum(UNIT_KINDS, { message: `must be one of ${UNIT_KINDS.join(', ')}` }),
        geometry: GeometrySchema,
        acres: measure.nullish(),
        lengthFt: measure.nullish(),
      }),
    )
    .max(500, { message: 'a plan summary lists at most 500 units' }),
  /** Aerial photos printed under the plan (the server downscales them for print). */
  overlays: PlanMapOverlaysSchema.optional(),
  /** Extra cautions the consultant adds to the ones the planned kinds call for. */
  cautions: z.array(z.string().trim().min(1).max(400)).max(20).optional(),
});

export type PlanSummaryInput = z.input<typeof PlanSummaryInputSchema>;
type PlanSummaryData = z.output<typeof PlanSummaryInputSchema>;
type SummaryUnit = PlanSummaryData['units'][number];

const MAP_HEIGHT_PT = 430;
/** Height a letterhead (logo and contact lines) takes from the map, so the summary stays on two pages. */
const LETTERHEAD_HEIGHT_PT = 90;

const DEFERS = 'This plan defers to local codes, state wildlife rules and licensed practice; check them before work begins.';

/** Cautions called for by the kinds of work in the plan, then the consultant's own. */
export function planCautions(kinds: ReadonlySet<UnitKind>, extra: readonly string[] = []): string[] {
  const out: string[] = [];
  if (kinds.has('food-plot') || kinds.has('cover-planting') || kinds.has('firebreak')) {
    out.push(
      'Herbicide work: follow the product label, which is the law. Restricted-use products need a certified applicator; mind drift, water setbacks and protective equipment.',
    );
  }
  if (kinds.has('timber') || kinds.has('bedding-area')) {
    out.push('Chainsaw and hinge-cutting work carries a real risk of injury: trained operators, protective gear, never alone.');
  }
  if (kinds.has('stand-site')) {
    out.push('Tree stands: wear a full-body harness, attached from the moment you leave the ground until you are back on it.');
  }
  if (kinds.has('mock-scrape') || kinds.has('camera-site')) {
    out.push(
      'Deer scents, baiting and feeding (camera surveys included) are restricted in many states, especially where chronic wasting disease is found. Check your state’s rules before using any.',
    );
  }
  if (kinds.has('water') || kinds.has('water-source')) {
    out.push('Work in wetlands or streams may need permits.');
  }
  return [...out, ...extra, DEFERS];
}

function parseInput(input: PlanSummaryInput): PlanSummaryData {
  const result = PlanSummaryInputSchema.safeParse(input);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const field = issue.path.join('.') || 'input';
  throw new DomainValidationError(field, `Plan summary: ${field} ${issue.message}.`);
}

/** "May 4, 2026" from "2026-05-04", read as a calendar date (no time zone shift). */
function formatDate(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const date = new Date(Date.UTC(y, m - 1, d));
  if (date.getUTCMonth() !== m - 1) throw new DomainValidationError('preparedOn', `Plan summary: preparedOn ${isoDate} is not a calendar date.`);
  return date.toLocaleDateString('en-US', { year: 'numeric', month: 'long', day: 'numeric', timeZone: 'UTC' });
}

/** "1,240 ft", or "1.32 mi (6,970 ft)" from a mile up. */
export function formatLength(lengthFt: number): string {
  const ft = `${Math.round(lengthFt).toLocaleString('en-US')} ft`;
  return lengthFt >= FEET_PER_MILE ? `${(lengthFt / FEET_PER_MILE).toFixed(2)} mi (${ft})` : ft;
}

function formatShare(part: number, whole: number): string {
  const pct = (part / whole) * 100;
  return `${pct < 10 ? pct.toFixed(1) : pct.toFixed(0)}%`;
}

/** The kind's key (the map legend's mark) for a table row. SVG rather than canvas: pdfmake
 * re-lays out pages after a page-break rule fires and then offsets canvas polylines twice. */
function kindSwatch(kind: UnitKind): Content {
  return { svg: kindSwatchSvg(kind, 16, 10), width: 16, margin: [0, 1.5, 0, 0] };
}

function unitOrder(a: SummaryUnit, b: SummaryUnit): number {
  const byKind = UNIT_KINDS.indexOf(a.kind) - UNIT_KINDS.indexOf(b.kind);
  return byKind !== 0 ? byKind : a.name.localeCompare(b.name, 'en-US', { numeric: true });
}

function sizeText(unit: SummaryUnit, du: DisplayUnits): string {
  const family = KIND_STYLES[unit.kind].family;
  if (family === 'area') return unit.acres == null ? '—' : formatArea(unit.acres, du.areaUnit);
  if (family === 'line') return unit.lengthFt == null ? '—' : formatLengthIn(unit.lengthFt, du.lengthUnit);
  if (unit.geometry.type === 'Point') return formatLatLon(unit.geometry.coordinates[0], unit.geometry.coordinates[1]);
  if (unit.geometry.type === 'MultiPoint') return `${unit.geometry.coordinates.length} points`;
  return '—';
}

function unitsTable(units: readonly SummaryUnit[], propertyAcres: number, du: DisplayUnits): Content {
  const header: TableCell[] = [
    { text: '' },
    { text: 'Unit', style: 'tableHeader' },
    { text: 'Kind', style: 'tableHeader' },
    { text: 'Acres, length or location', style: 'tableHeader', alignment: 'right' },
    { text: 'Share', style: 'tableHeader', alignment: 'right' },
  ];
  const rows: TableCell[][] = [...units].sort(unitOrder).map((u) => {
    const style = KIND_STYLES[u.kind];
    return [
      kindSwatch(u.kind),
      { text: u.name, style: 'tableCell' },
      { text: style.label, style: 'tableCell', color: DOC_COLORS.slate },
      { text: sizeText(u, du), style: 'tableCell', alignment: 'right' },
      {
        text: style.family === 'area' && u.acres != null ? formatShare(u.acres, propertyAcres) : '',
        style: 'tableCell',
        alignment: 'right',
        color: DOC_COLORS.slate,
      },
    ];
  });
  return {
    table: { headerRows: 1, keepWithHeaderRows: 1, dontBreakRows: true, widths: [16, '*', 92, 130, 38], body: [header, ...rows] },
    layout: ruledTableLayout,
  };
}

function acresByKindTable(units: readonly SummaryUnit[], propertyAcres: number, du: DisplayUnits): Content | null {
  const totals = new Map<UnitKind, number>();
  for (const u of units) {
    if (KIND_STYLES[u.kind].family === 'area' && u.acres != null) totals.set(u.kind, (totals.get(u.kind) ?? 0) + u.acres);
  }
  if (totals.size === 0) return null;
  const rows: TableCell[][] = UNIT_KINDS.filter((k) => totals.has(k)).map((k) => [
    kindSwatch(k),
    { text: KIND_STYLES[k].label, style: 'tableCell' },
    { text: formatArea(totals.get(k)!, du.areaUnit), style: 'tableCell', alignment: 'right' },
    { text: formatShare(totals.get(k)!, propertyAcres), style: 'tableCell', alignment: 'right', color: DOC_COLORS.slate },
  ]);
  return {
    unbreakable: true,
    stack: [
      { text: 'Acres by kind', style: 'h3' },
      {
        table: {
          headerRows: 1,
          widths: [16, '*', 80, 38],
          body: [
            [
              { text: '' },
              { text: 'Kind', style: 'tableHeader' },
              { text: 'Acres', style: 'tableHeader', alignment: 'right' },
              { text: 'Share', style: 'tableHeader', alignment: 'right' },
            ],
            ...rows,
          ],
        },
        layout: ruledTableLayout,
      },
      { text: 'Units may overlap, so the kinds need not add up to the whole property.', style: 'small', margin: [0, 4, 0, 0] },
    ],
  };
}

/** The pdfmake document definition of a plan summary (build a fresh one for every render). */
export function planSummaryDocument(input: PlanSummaryInput): TDocumentDefinitions {
  const data = parseInput(input);
  const { firm, client, property } = data;
  const preparedOn = formatDate(data.preparedOn);
  const hasLetterhead = Boolean(firm.logo || firm.address || firm.licenceNumbers);
  const map = renderPlanMap({
    boundary: property.boundary,
    units: data.units.map((u) => ({ name: u.name, kind: u.kind, geometry: u.geometry })),
    overlays: data.overlays,
    widthPt: CONTENT_WIDTH_PT,
    heightPt: hasLetterhead ? MAP_HEIGHT_PT - LETTERHEAD_HEIGHT_PT : MAP_HEIGHT_PT,
  });
  const centre = map.layout.projection;
  const locality = property.locality?.trim() || `Near ${formatLatLon(centre.lon0, centre.lat0)}`;
  const kinds = new Set(data.units.map((u) => u.kind));
  const contact = [firm.phone, firm.email].filter(Boolean).join(' · ');
  // The firm's units (acres and feet unless its profile chose hectares or metres).
  const du: DisplayUnits = { areaUnit: firm.areaUnit ?? DEFAULT_DISPLAY_UNITS.areaUnit, lengthUnit: firm.lengthUnit ?? DEFAULT_DISPLAY_UNITS.lengthUnit };
  const byKind = acresByKindTable(data.units, property.acres, du);

  const facts = keyValueTable(
    [
      { label: 'Prepared for', value: client.name },
      { label: 'Property', value: property.name },
      { label: 'Location', value: locality },
      ...(data.planLabel ? [{ label: 'Plan', value: data.planLabel }] : []),
      { label: 'Prepared', value: `${preparedOn} by ${firm.name}` },
    ],
    78,
  );
  const acreage: Content = {
    stack: [
      { text: formatArea(property.acres, du.areaUnit), font: FONT_HEADING, bold: true, fontSize: 18, color: DOC_COLORS.mossDeep, alignment: 'right' },
      { text: 'total property area', style: 'small', alignment: 'right' },
    ],
  };

  const content: Content[] = [
    // The firm's letterhead from its profile (logo, name, address, phone · e-mail · website, licence
    // numbers) once the profile has more than a name; the map gives up the height it takes.
    ...(hasLetterhead ? [{ columns: [firmBlock(firm)], margin: [0, 0, 0, 10] } as Content] : []),
    { text: 'PLAN SUMMARY', fontSize: 8, bold: true, color: DOC_COLORS.moss, characterSpacing: 1.2, margin: [0, 0, 0, 3] },
    { text: property.name, style: 'title' },
    { text: `Prepared for ${client.name} by ${firm.name}`, style: 'subtitle' },
    { columns: [{ width: '*', stack: [facts] }, { width: 150, stack: [acreage] }], columnGap: 16, margin: [0, 0, 0, 12] },
    { svg: map.svg, width: CONTENT_WIDTH_PT },
    {
      text:
        map.layout.labels.length < data.units.filter((u) => KIND_STYLES[u.kind].family === 'area').length
          ? 'Units too small to label on the map are listed below. Positions are approximate; the map is not a survey.'
          : 'Positions are approximate; the map is not a survey.',
      style: 'small',
      margin: [0, 4, 0, 0],
    },
    { text: 'Units', style: 'h2' },
    data.units.length > 0 ? unitsTable(data.units, property.acres, du) : { text: 'No units are drawn on this plan yet.', style: 'muted' },
    ...(byKind ? [byKind] : []),
    cautionBox('Before the work begins', planCautions(kinds, data.cautions ?? [])),
  ];

  return {
    ...pageFrame({ title: `Plan summary · ${property.name}`, firmName: firm.name, firmContact: contact || undefined, preparedOn }),
    info: { title: `Plan summary — ${property.name}`, author: firm.name, subject: `Habitat plan for ${client.name}` },
    content,
  };
}
