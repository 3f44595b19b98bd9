/**
 * The shared look of every Browseline document as pdfmake definitions: styles, page frame, cautions
 * box, money and key/value tables, page-break rules. Pure: it builds definitions; the server renders
 * them (server/services/documents/pdf.ts, in a worker thread with our shipped fonts).
 *
 * Headings use Merriweather, body text Source Sans 3, whose default figures are already tabular
 * (equal advance widths), so columns of numbers line up.
 */
import type {
  Content,
  CustomTableLayout,
  DynamicContent,
  Margins,
  Node,
  NodeQueries,
  StyleDictionary,
  TableCell,
  TDocumentDefinitions,
} from 'pdfmake/interfaces';
import { formatCents } from '../../../shared/domain/money';
import { pdfFunction, registerPdfFunction } from './pdf-functions';
import { DOC_COLORS, FONT_BODY, FONT_HEADING } from './look';

export { DOC_COLORS, FONT_BODY, FONT_HEADING };

/** Default text style of every document: Source Sans 3, 10 pt, ink. */
export const documentDefaultStyle = {
  font: FONT_BODY,
  fontSize: 10,
  color: DOC_COLORS.ink,
  lineHeight: 1.25,
} as const;

/** Named styles shared by every Browseline document. */
export const documentStyles: StyleDictionary = {
  title: { font: FONT_HEADING, fontSize: 20, bold: true, color: DOC_COLORS.ink, margin: [0, 0, 0, 2] },
  subtitle: { fontSize: 11, color: DOC_COLORS.slate, margin: [0, 0, 0, 12] },
  h2: { font: FONT_HEADING, fontSize: 13, bold: true, color: DOC_COLORS.ink, margin: [0, 14, 0, 6] },
  h3: { font: FONT_HEADING, fontSize: 11, bold: true, color: DOC_COLORS.mossDeep, margin: [0, 10, 0, 4] },
  figure: { font: FONT_HEADING, fontSize: 12, bold: true, color: DOC_COLORS.mossDeep, fontFeatures: ['tnum'] },
  muted: { color: DOC_COLORS.slate },
  small: { fontSize: 8.5, color: DOC_COLORS.slate },
  tableHeader: { bold: true, fontSize: 9, color: DOC_COLORS.slate, lineHeight: 1.05, fontFeatures: ['tnum'] },
  tableCell: { fontSize: 9.5, lineHeight: 1.05, fontFeatures: ['tnum'] },
  tableTotal: { bold: true, fontSize: 10, lineHeight: 1.05, fontFeatures: ['tnum'] },
  number: { alignment: 'right', fontFeatures: ['tnum'] },
  cautionTitle: { font: FONT_HEADING, bold: true, fontSize: 10, color: DOC_COLORS.clay, margin: [0, 0, 0, 3] },
  caution: { fontSize: 9, color: DOC_COLORS.ink },
  label: { fontSize: 9, color: DOC_COLORS.slate },
};

/** Tabular tables: horizontal rule-coloured lines, a heavier line under the header, no verticals. */
export const ruledTableLayout: CustomTableLayout = {
  hLineWidth: (i, node) => (i === 0 || i === node.table.body.length ? 0 : i === (node.table.headerRows ?? 0) && i > 0 ? 1 : 0.5),
  vLineWidth: () => 0,
  hLineColor: (i, node) => (i === (node.table.headerRows ?? 0) && i > 0 ? DOC_COLORS.slate : DOC_COLORS.rule),
  paddingLeft: (i) => (i === 0 ? 0 : 6),
  paddingRight: (i, node) => (i === (node.table.widths?.length ?? 1) - 1 ? 0 : 6),
  paddingTop: () => 3,
  paddingBottom: () => 3,
};

export interface PageFrameOptions {
  /** Document title, repeated in the running header ("Plan summary"). */
  title: string;
  firmName: string;
  /** A short line under the footer's firm name, such as a phone number or e-mail. */
  firmContact?: string;
  /** Preparation date as people read it ("May 4, 2026"), shown in the footer. */
  preparedOn?: string;
  /** The first page that carries the running header (2 when page 1 has its own letterhead); 1 by default. */
  headerFromPage?: number;
}

export interface PageFrame {
  header: DynamicContent;
  footer: DynamicContent;
  pageMargins: Margins;
}

/** The side margins of every document page (US Letter). */
export const SIDE_MARGIN_PT = 54;
/** US Letter width less the side margins. */
export const CONTENT_WIDTH_PT = 612 - 2 * SIDE_MARGIN_PT;

function frameHeader(options: PageFrameOptions): DynamicContent {
  const side = SIDE_MARGIN_PT;
  return (currentPage, _pageCount, pageSize) =>
    currentPage < (options.headerFromPage ?? 1)
      ? null
      : {
          margin: [side, 30, side, 0],
          stack: [
            {
              columns: [
                { text: options.firmName, font: FONT_HEADING, bold: true, fontSize: 10, color: DOC_COLORS.mossDeep },
                { text: options.title, alignment: 'right', fontSize: 9, color: DOC_COLORS.slate, margin: [0, 1, 0, 0] },
              ],
            },
            {
              canvas: [{ type: 'line', x1: 0, y1: 6, x2: pageSize.width - 2 * side, y2: 6, lineWidth: 0.75, lineColor: DOC_COLORS.rule }],
            },
          ],
        };
}

function frameFooter(options: PageFrameOptions): DynamicContent {
  const side = SIDE_MARGIN_PT;
  const left = [options.firmName, options.firmContact].filter(Boolean).join('  ·  ');
  return (currentPage, pageCount, pageSize) => ({
    margin: [side, 18, side, 0],
    stack: [
      {
        canvas: [{ type: 'line', x1: 0, y1: 0, x2: pageSize.width - 2 * side, y2: 0, lineWidth: 0.5, lineColor: DOC_COLORS.rule }],
      },
      {
        margin: [0, 5, 0, 0],
        columns: [
          { text: left, fontSize: 8, color: DOC_COLORS.slate, width: '*' },
          ...(options.preparedOn
            ? [{ text: `Prepared ${options.preparedOn}`, fontSize: 8, color: DOC_COLORS.slate, alignment: 'center' as const, width: 'auto' as const }]
            : []),
          { text: `Page ${currentPage} of ${pageCount}`, fontSize: 8, color: DOC_COLORS.slate, alignment: 'right', width: 90 },
        ],
      },
    ],
  });
}

registerPdfFunction('pageFrame.header', frameHeader);
registerPdfFunction('pageFrame.footer', frameFooter);

/** Running header (firm, document title) and footer (contact, date, "Page N of M") for US Letter. */
export function pageFrame(options: PageFrameOptions): PageFrame {
  return {
    pageMargins: [SIDE_MARGIN_PT, 70, SIDE_MARGIN_PT, 60],
    header: pdfFunction<DynamicContent, PageFrameOptions>('pageFrame.header', { ...options }),
    footer: pdfFunction<DynamicContent, PageFrameOptions>('pageFrame.footer', { ...options }),
  };
}

/** A box ruled in clay with a heading and bullet lines, for safety and legal cautions. */
export function cautionBox(title: string, lines: readonly string[]): Content {
  const body: Content[] = [{ text: title, style: 'cautionTitle' }];
  if (lines.length > 0) {
    body.push({ ul: lines.map((line) => ({ text: line, style: 'caution', margin: [0, 0, 0, 2] })), markerColor: DOC_COLORS.clay });
  }
  return {
    unbreakable: true,
    margin: [0, 12, 0, 0],
    table: { widths: ['*'], body: [[{ stack: body, fillColor: DOC_COLORS.clayTint }]] },
    layout: {
      hLineWidth: () => 1,
      vLineWidth: () => 1,
      hLineColor: () => DOC_COLORS.clay,
      vLineColor: () => DOC_COLORS.clay,
      paddingLeft: () => 10,
      paddingRight: () => 10,
      paddingTop: () => 8,
      paddingBottom: () => 6,
    },
  };
}

export interface MoneyRow {
  label: string;
  amountCents: number;
  /** A total or subtotal: bold, with a line above. */
  total?: boolean;
  /** Small slate text under the label. */
  note?: string;
}

/** A two-column table of labels and amounts in dollars (exact from integer cents), totals in bold. */
export function moneyTable(rows: readonly MoneyRow[], header: readonly [string, string] = ['Item', 'Amount']): Content {
  const body: TableCell[][] = [
    [
      { text: header[0], style: 'tableHeader' },
      { text: header[1], style: 'tableHeader', alignment: 'right' },
    ],
  ];
  for (const row of rows) {
    const style = row.total ? 'tableTotal' : 'tableCell';
    body.push([
      row.note ? { stack: [{ text: row.label, style }, { text: row.note, style: 'small' }] } : { text: row.label, style },
      { text: formatCents(row.amountCents), style, alignment: 'right' },
    ]);
  }
  return { table: { headerRows: 1, widths: ['*', 'auto'], body, dontBreakRows: true }, layout: ruledTableLayout };
}

export interface KeyValueRow {
  label: string;
  value: string | Content;
}

/** A borderless two-column table of labels (slate) and values (ink), for document facts. */
export function keyValueTable(rows: readonly KeyValueRow[], labelWidthPt = 110): Content {
  return {
    table: {
      widths: [labelWidthPt, '*'],
      body: rows.map((row) => [
        { text: row.label, style: 'label' },
        typeof row.value === 'string' ? { text: row.value } : row.value,
      ]),
    },
    layout: {
      hLineWidth: () => 0,
      vLineWidth: () => 0,
      paddingLeft: () => 0,
      paddingRight: (i) => (i === 0 ? 8 : 0),
      paddingTop: () => 1.5,
      paddingBottom: () => 1.5,
    },
  };
}

const HEADING_STYLES = new Set(['title', 'h2', 'h3']);
/** Room a heading needs below it on its page: itself, a table header and a couple of rows. */
const HEADING_KEEP_PT = 100;

/**
 * Page-break rule: a heading (style title, h2 or h3, or any node with a headlineLevel) that starts
 * within HEADING_KEEP_PT of the page bottom moves to the next page, so it stays with what it
 * introduces. (pdfmake reports a table's header row on the page the table was first tried on, so
 * "no node follows on this page" cannot be relied on.)
 */
export function keepHeadingsWithNext(node: Node, queries: NodeQueries): boolean {
  const styles = node.style === undefined ? [] : Array.isArray(node.style) ? node.style : [node.style];
  const isHeading = node.headlineLevel !== undefined || styles.some((s) => typeof s === 'string' && HEADING_STYLES.has(s));
  if (!isHeading) return false;
  const { verticalRatio, pageInnerHeight } = node.startPosition;
  const roomBelowPt = (1 - verticalRatio) * pageInnerHeight;
  return roomBelowPt < HEADING_KEEP_PT && queries.getNodesOnNextPage().length > 0;
}

export interface KeepWithNextOptions {
  /** Nodes whose id starts with this prefix are kept with what follows them, like headings. */
  idPrefix: string;
  /** Room such a node needs below it on its page, in points. */
  keepPt: number;
}

function keepWithNext(options: KeepWithNextOptions) {
  return (node: Node, queries: NodeQueries): boolean => {
    if (keepHeadingsWithNext(node, queries)) return true;
    if (typeof node.id !== 'string' || !node.id.startsWith(options.idPrefix)) return false;
    const { verticalRatio, pageInnerHeight } = node.startPosition;
    return (1 - verticalRatio) * pageInnerHeight < options.keepPt && queries.getNodesOnNextPage().length > 0;
  };
}

registerPdfFunction('keepHeadingsWithNext', () => keepHeadingsWithNext);
registerPdfFunction('keepWithNext', keepWithNext);
registerPdfFunction('neverBreakBefore', () => () => false);

/** Page-break rule: headings, and the nodes whose id starts with `idPrefix`, stay with what follows them. */
export function keepWithNextRule(options: KeepWithNextOptions): (node: Node, queries: NodeQueries) => boolean {
  return pdfFunction('keepWithNext', options);
}

/** Page-break rule that never moves a node (for documents made of short unbreakable sections). */
export function neverBreakBefore(): (node: Node, queries: NodeQueries) => boolean {
  return pdfFunction('neverBreakBefore');
}

/** The definition with the shared look filled in where it does not set its own (page size, styles, break rule). */
export function withDocumentDefaults(docDefinition: TDocumentDefinitions): TDocumentDefinitions {
  return {
    pageSize: 'LETTER',
    pageBreakBefore: pdfFunction<(node: Node, queries: NodeQueries) => boolean>('keepHeadingsWithNext'),
    ...docDefinition,
    defaultStyle: { ...documentDefaultStyle, ...docDefinition.defaultStyle },
    styles: { ...documentStyles, ...docDefinition.styles },
    info: { creator: 'Browseline', producer: 'Browseline', ...docDefinition.info },
  };
}
