/**
 * Page 1 of the proposal: the letterhead, the headline with its facts, and where the plan map goes.
 */
import { formatCents } from '../../../shared/domain/money';
import { formatArea } from '../../../shared/units';
import { letterhead as firmLetterhead } from '../firm-block';
import { DOC_COLORS, FONT_HEADING, keyValueTable } from '../kit/layout';
import type { Content } from 'pdfmake/interfaces';
import { unitsOf } from './format';
import type { DocData } from './input';
import { MAP_MAX_HEIGHT_PT, MAP_MIN_HEIGHT_PT, PAGE_INNER_HEIGHT_PT } from './look';

/** Page 1's letterhead: the firm, and the proposal's number, version and dates. */
export function letterhead(data: DocData, preparedOn: string, validUntil: string | null): Content {
  const { firm, proposal } = data;
  return firmLetterhead(firm, 'Proposal', [
    { text: `Proposal ${proposal.number} · version ${proposal.version}`, bold: true },
    { text: `Prepared ${preparedOn}` },
    ...(validUntil ? [{ text: `Valid until ${validUntil}` }] : []),
  ]);
}

/** The title, who it is for, and the facts (client, property, locality, dates). */
export function headline(data: DocData, locality: string, preparedOn: string, validUntil: string | null): Content {
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
export function mapPlacement(data: DocData, hasBanner: boolean): { heightPt: number; onPage1: boolean } {
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
