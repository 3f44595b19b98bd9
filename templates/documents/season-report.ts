/**
 * The season report a landowner receives at the close of a hunting season: the work done (with a
 * few of the crew's photos), the acres established, the camera-survey estimates compared season
 * over season, the harvest's age structure and buck:doe trend as bar charts, the checks on the
 * plots and the soil tests (season-report-checks.ts), the consultant's
 * recommendations for next season, and the cautions about the survey method and baiting.
 *
 * Figures are printed as the server computed them with shared/domain/survey-estimates.ts; this
 * file only lays them out.
 */
import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces';
import type { Caution } from '../../shared/domain/cautions';
import type { HarvestSummary, SeasonSummary, SurveyEstimatesDisplay, SurveyWarning } from '../../shared/domain/survey-estimates';
import { establishedText, hasBars, type SurveyTrendRow } from '../../shared/domain/season-results';
import { DomainValidationError } from '../../shared/domain/errors';
import { formatArea, type AreaUnit } from '../../shared/units';
import { AGE_CLASS_LABELS } from '../../shared/schemas/results';
import { barChartSvg } from './kit/bar-chart-svg';
import { cautionBox, DOC_COLORS, FONT_HEADING, keyValueTable, pageFrame, ruledTableLayout, CONTENT_WIDTH_PT } from './kit/layout';
import { seasonChecksSection, type SeasonReportChecks } from './season-report-checks';

/** DESIGN.md-like chart colours: moss for bucks, clay for does, ochre for fawns. */
const BUCK_COLOR = DOC_COLORS.moss;
const DOE_COLOR = DOC_COLORS.clay;
const FAWN_COLOR = '#C99A2E';
const MAX_PHOTOS = 4;

export interface SeasonReportSurvey {
  name: string;
  startDate: string;
  endDate: string;
  cameraCount: number;
  surveyDays: number;
  display: SurveyEstimatesDisplay | null;
  warnings: SurveyWarning[];
}

export interface SeasonReportDocumentInput {
  /** `areaUnit`: the firm's unit for areas (acres unless its profile chose hectares). */
  firm: { name: string; phone: string | null; email: string | null; areaUnit?: AreaUnit | null };
  client: { name: string };
  property: { name: string; acres: number | null; locality: string | null };
  season: { label: string; startsOn: string; endsOn: string };
  /** "YYYY-MM-DD". */
  preparedOn: string;
  work: { name: string; unitName: string; practiceName: string; doneOn: string }[];
  acresEstablished: number;
  unitsEstablished: { name: string; acres: number | null }[];
  /** JPEG or PNG photos as data URLs, with a caption each; at most four are printed. */
  photos: { dataUrl: string; caption: string }[];
  surveys: SeasonReportSurvey[];
  surveyTrend: SurveyTrendRow[];
  harvest: HarvestSummary;
  harvestTrend: SeasonSummary[];
  recommendations: string | null;
  cautions: Caution[];
  /** Field observations logged in the season: counts by kind and by unit (omitted: no section). */
  observations?: SeasonReportObservations;
  /** Hunting pressure: sits and deer seen per stand (omitted, or no stands: no section). */
  pressure?: SeasonReportPressure;
  /** Establishment, browse and timber checks of the season and the soil tests on file (omitted or empty: no section). */
  checks?: SeasonReportChecks;
}

/** What the season report says about hunting pressure and sits. */
export interface SeasonReportPressure {
  stands: { name: string; sits: number; hours: number; deerSeen: number; deerPerHour: number | null; sitsOnUnsuitableWind: number; harvests: number }[];
  totals: { sits: number; hours: number; deerSeen: number };
  /** Harvests of the season that carry a state disease-sampling number. */
  sampledHarvests: number;
}

/** What the season report says about field observations. */
export interface SeasonReportObservations {
  total: number;
  byKind: { label: string; count: number }[];
  byUnit: { label: string; count: number }[];
  byMonth: { label: string; count: number }[];
}

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** "2025-08-14" → "August 14, 2025"; refuses anything else, naming the field. */
export function formatReportDate(value: string, field: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!m || Number(m[2]) < 1 || Number(m[2]) > 12) throw new DomainValidationError(field, `${field} must be a date written YYYY-MM-DD (got ${JSON.stringify(value)}).`);
  return `${MONTHS[Number(m[2]) - 1]} ${Number(m[3])}, ${m[1]}`;
}

const one = (n: number, digits: number) => n.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

function table(header: string[], rows: (string | Content)[][], widths: (string | number)[], numeric: number[] = []): Content {
  const body: TableCell[][] = [
    header.map((h, i) => ({ text: h, style: 'tableHeader', alignment: numeric.includes(i) ? 'right' : 'left' }) as TableCell),
    ...rows.map((r) => r.map((c, i) => (typeof c === 'string' ? ({ text: c, style: 'tableCell', alignment: numeric.includes(i) ? 'right' : 'left' } as TableCell) : (c as TableCell)))),
  ];
  // keepWithHeaderRows: a header is never left alone at the foot of a page, its first row goes with it.
  return { table: { headerRows: 1, keepWithHeaderRows: 1, widths, body, dontBreakRows: true }, layout: ruledTableLayout };
}

function chart(svg: string, heightPt: number): Content {
  return { svg, width: CONTENT_WIDTH_PT, height: heightPt, margin: [0, 8, 0, 4] } as Content;
}

function workSection(input: SeasonReportDocumentInput): Content[] {
  const out: Content[] = [{ text: 'Work done this season', style: 'h2' }];
  if (input.work.length === 0) {
    out.push({ text: 'No habitat work was finished on the property this season.', style: 'muted' });
  } else {
    out.push(table(['Finished', 'Work', 'Where'], input.work.map((w) => [formatReportDate(w.doneOn, 'work.doneOn'), `${w.name} — ${w.practiceName}`, w.unitName]), [92, '*', 150]));
  }
  const established = establishedText(
    input.acresEstablished,
    input.unitsEstablished.map((u) => ({ name: u.name, acresText: u.acres ? formatArea(u.acres, input.firm.areaUnit ?? 'acres') : null })),
    input.work.length,
  );
  if (input.unitsEstablished.length === 0 || input.acresEstablished <= 0) {
    // Never "0.00 acre established": say what there is instead.
    out.push({ text: established, margin: [0, 10, 0, 0] });
  } else {
    out.push({
      margin: [0, 10, 0, 0],
      columns: [
        { width: 'auto', text: formatArea(input.acresEstablished, input.firm.areaUnit ?? 'acres'), font: FONT_HEADING, bold: true, fontSize: 16, color: DOC_COLORS.mossDeep },
        { width: '*', margin: [10, 4, 0, 0], text: established },
      ],
    });
  }
  const photos = input.photos.slice(0, MAX_PHOTOS);
  if (photos.length > 0) {
    const cells = photos.map((p) => ({ stack: [{ image: p.dataUrl, fit: [(CONTENT_WIDTH_PT - 12) / 2, 150] }, { text: p.caption, style: 'small', margin: [0, 2, 0, 6] }] }) as Content);
    const rows: Content[] = [];
    for (let i = 0; i < cells.length; i += 2) rows.push({ columns: [cells[i], cells[i + 1] ?? { text: '' }], columnGap: 12, unbreakable: true } as Content);
    out.push({ text: 'From the field', style: 'h3' }, ...rows);
  }
  return out;
}

function surveySection(input: SeasonReportDocumentInput): Content[] {
  const out: Content[] = [{ text: 'Camera surveys', style: 'h2' }];
  if (input.surveys.length === 0) {
    out.push({ text: 'No camera survey was recorded this season.', style: 'muted' });
  }
  for (const s of input.surveys) {
    out.push({ text: s.name, style: 'h3' });
    out.push(
      keyValueTable([
        { label: 'Dates', value: `${formatReportDate(s.startDate, 'survey.startDate')} – ${formatReportDate(s.endDate, 'survey.endDate')} (${s.surveyDays} days)` },
        { label: 'Cameras', value: `${s.cameraCount}` },
      ]),
    );
    if (s.display) {
      const d = s.display;
      out.push({
        margin: [0, 6, 0, 0],
        ...(table(
          ['Bucks', 'Does', 'Fawns', 'Total deer', 'Buck:doe', 'Fawns per doe', 'Deer per mi²'],
          [[d.bucks, d.does, d.fawns, d.total, d.buckDoeRatio, d.fawnDoeRatio, d.deerPerSqMi]],
          ['*', '*', '*', '*', '*', '*', '*'],
          [0, 1, 2, 3, 5, 6],
        ) as object),
      } as Content);
    }
    const warnings = s.warnings.filter((w) => w.severity === 'warning');
    if (warnings.length > 0) out.push({ ul: warnings.map((w) => ({ text: w.message, style: 'caution' })), margin: [0, 6, 0, 0], markerColor: DOC_COLORS.clay } as Content);
  }
  const surveySeries = [
    { label: 'Bucks', color: BUCK_COLOR, values: input.surveyTrend.map((t) => Math.round(t.bucks)) },
    { label: 'Does', color: DOE_COLOR, values: input.surveyTrend.map((t) => Math.round(t.does)) },
    { label: 'Fawns', color: FAWN_COLOR, values: input.surveyTrend.map((t) => Math.round(t.fawns)) },
  ];
  if (input.surveyTrend.length > 0 && hasBars(surveySeries)) {
    out.push(
      chart(
        barChartSvg({
          title: 'Estimated deer by season (camera surveys)',
          categories: input.surveyTrend.map((t) => t.label),
          series: surveySeries,
          widthPt: CONTENT_WIDTH_PT,
          heightPt: 170,
          axisLabel: 'deer',
          wholeTicks: true,
        }),
        170,
      ),
    );
    out.push(
      table(
        ['Season', 'Survey', 'Total deer', 'Does per buck', 'Fawns per doe', 'Deer per mi²'],
        input.surveyTrend.map((t) => [t.label, t.surveyName, one(t.total, 0), `1:${one(t.buckDoeRatio, 1)}`, t.fawnDoeRatio === null ? 'n/a' : one(t.fawnDoeRatio, 2), one(t.deerPerSqMi, 1)]),
        [52, '*', 54, 66, 66, 64],
        [2, 4, 5],
      ),
    );
  }
  return out;
}

function harvestSection(input: SeasonReportDocumentInput): Content[] {
  const h = input.harvest;
  const out: Content[] = [{ text: 'Harvest', style: 'h2' }];
  if (h.total === 0) {
    out.push({ text: 'No harvest was recorded this season.', style: 'muted' });
  } else {
    out.push({ text: `${h.total} deer taken: ${h.bucks} ${h.bucks === 1 ? 'buck' : 'bucks'} and ${h.does} ${h.does === 1 ? 'doe' : 'does'}.`, margin: [0, 0, 0, 4] });
    out.push(
      chart(
        barChartSvg({
          title: 'Age structure of the harvest',
          categories: h.ageClasses.map((c) => AGE_CLASS_LABELS[c.ageClass]),
          series: [
            { label: 'Bucks', color: BUCK_COLOR, values: h.ageClasses.map((c) => c.bucks) },
            { label: 'Does', color: DOE_COLOR, values: h.ageClasses.map((c) => c.does) },
          ],
          widthPt: CONTENT_WIDTH_PT,
          heightPt: 160,
          axisLabel: 'deer',
          wholeTicks: true,
        }),
        160,
      ),
    );
    out.push(
      table(
        ['Age class', 'Bucks', 'Does', 'Mean dressed weight'],
        h.ageClasses.filter((c) => c.total > 0).map((c) => [AGE_CLASS_LABELS[c.ageClass], `${c.bucks}`, `${c.does}`, c.meanDressedWeightLb === null ? '—' : `${one(c.meanDressedWeightLb, 0)} lb`]),
        ['*', 60, 60, 110],
        [1, 2, 3],
      ),
    );
  }
  const trend = input.harvestTrend.filter((s) => s.doesPerBuck !== null);
  if (trend.length > 0 && hasBars([{ values: trend.map((s) => s.doesPerBuck) }])) {
    out.push(
      chart(
        barChartSvg({
          title: 'Adult does taken per adult buck, by season',
          categories: trend.map((s) => s.label),
          series: [{ label: 'Does per buck', color: DOE_COLOR, values: trend.map((s) => s.doesPerBuck) }],
          widthPt: CONTENT_WIDTH_PT,
          heightPt: 140,
          valueDecimals: 1,
          axisLabel: 'does per buck',
        }),
        140,
      ),
    );
  }
  return out;
}

function observationsSection(input: SeasonReportDocumentInput): Content[] {
  const o = input.observations;
  if (!o) return [];
  const out: Content[] = [{ text: 'Sign on the ground', style: 'h2' }];
  if (o.total === 0) {
    out.push({ text: 'No field observations were logged this season.', style: 'muted' });
    return out;
  }
  out.push({ text: `${o.total} ${o.total === 1 ? 'observation was' : 'observations were'} logged on the property this season.`, margin: [0, 0, 0, 4] });
  if (o.byMonth.length > 1) {
    out.push(
      chart(
        barChartSvg({
          title: 'Observations by month',
          categories: o.byMonth.map((m) => m.label),
          series: [{ label: 'Observations', color: BUCK_COLOR, values: o.byMonth.map((m) => m.count) }],
          widthPt: CONTENT_WIDTH_PT,
          heightPt: 130,
          axisLabel: 'observations',
          wholeTicks: true,
        }),
        130,
      ),
    );
  }
  out.push(table(['Kind of sign', 'Count'], o.byKind.map((k) => [k.label, `${k.count}`]), ['*', 60], [1]));
  out.push(table(['Unit', 'Count'], o.byUnit.map((u) => [u.label, `${u.count}`]), ['*', 60], [1]));
  return out;
}

/** Up to this many stands, the pressure section is kept on one page. */
const PRESSURE_STANDS_ON_ONE_PAGE = 20;

function pressureSection(input: SeasonReportDocumentInput): Content[] {
  const p = input.pressure;
  if (!p || p.stands.length === 0) return [];
  const out: Content[] = [{ text: 'Hunting pressure and sits', style: 'h2' }];
  if (p.totals.sits === 0) {
    out.push({ text: 'No sits were logged this season.', style: 'muted' });
    return out;
  }
  out.push({
    text: `${p.totals.sits} ${p.totals.sits === 1 ? 'sit' : 'sits'} over ${one(p.totals.hours, 1)} hours were logged this season, with ${p.totals.deerSeen} deer seen. Stands sat often learn deer to avoid them; rest a stand between sits and sit it only on a wind that suits it.`,
    margin: [0, 0, 0, 4],
  });
  out.push(
    table(
      ['Stand', 'Sits', 'Hours', 'Deer seen', 'Deer / hour', 'On a wrong wind', 'Harvests'],
      p.stands.map((s) => [s.name, `${s.sits}`, one(s.hours, 1), `${s.deerSeen}`, s.deerPerHour === null ? '—' : one(s.deerPerHour, 2), `${s.sitsOnUnsuitableWind}`, `${s.harvests}`]),
      // "On a wrong wind" needs ~76 pt on one line at the table header's size; the stand name takes the rest.
      ['*', 34, 40, 52, 58, 82, 50],
      [1, 2, 3, 4, 5, 6],
    ),
  );
  if (p.sampledHarvests > 0) out.push({ text: `${p.sampledHarvests} ${p.sampledHarvests === 1 ? 'harvest carries' : 'harvests carry'} a state disease-sampling number; results come from the state wildlife agency.`, style: 'muted', margin: [0, 6, 0, 0] });
  // A property's stands fit on one page: the heading, its words and the table move to the next page together.
  return p.stands.length <= PRESSURE_STANDS_ON_ONE_PAGE ? [{ stack: out, unbreakable: true }] : out;
}

/** The season report's document definition; throws DomainValidationError naming the field on bad input. */
export function seasonReportDocument(input: SeasonReportDocumentInput): TDocumentDefinitions {
  const preparedOn = formatReportDate(input.preparedOn, 'preparedOn');
  const frame = pageFrame({
    title: `Season report ${input.season.label}`,
    firmName: input.firm.name,
    firmContact: [input.firm.phone, input.firm.email].filter(Boolean).join(' · ') || undefined,
    preparedOn,
  });
  const recommendations = input.recommendations?.trim();
  const content: Content[] = [
    { text: `${input.property.name}: the ${input.season.label} season`, style: 'title' },
    { text: `Prepared for ${input.client.name} by ${input.firm.name}`, style: 'subtitle' },
    keyValueTable([
      { label: 'Property', value: `${input.property.name}${input.property.acres ? `, ${formatArea(input.property.acres, input.firm.areaUnit ?? 'acres')}` : ''}` },
      ...(input.property.locality ? [{ label: 'Location', value: input.property.locality }] : []),
      { label: 'Season', value: `${formatReportDate(input.season.startsOn, 'season.startsOn')} – ${formatReportDate(input.season.endsOn, 'season.endsOn')}` },
    ]),
    ...workSection(input),
    ...seasonChecksSection(input.checks),
    ...surveySection(input),
    ...harvestSection(input),
    ...observationsSection(input),
    ...pressureSection(input),
    { text: 'Recommendations for next season', style: 'h2' },
    ...(recommendations
      ? recommendations.split(/\n\s*\n/).map((p) => ({ text: p.trim(), margin: [0, 0, 0, 6] }) as Content)
      : [{ text: 'Your consultant will go over next season’s plan with you.', style: 'muted' } as Content]),
    cautionBox('About these figures', [
      'Camera surveys tend to undercount deer (a field test found a mean of −32 %: Moore et al. 2014, Journal of the Southeastern Association of Fish and Wildlife Agencies 1). Read the estimates as a minimum and compare surveys done the same way year to year.',
      ...input.cautions.map((c) => `${c.title}: ${c.text}`),
    ]),
  ];
  return {
    ...frame,
    info: { title: `Season report ${input.season.label} — ${input.property.name}`, author: input.firm.name, subject: `Season report for ${input.client.name}` },
    content,
  };
}
