/**
 * The terms and the cautions (boxed in clay, deferring to local rules and licensed practice).
 */
import { DOC_COLORS, FONT_HEADING } from '../kit/layout';
import type { Content, TableCell } from 'pdfmake/interfaces';
import { paragraphs } from './format';
import type { DocData } from './input';

/** The terms as written, in paragraphs. */
export function termsSection(terms: string): Content[] {
  const body = paragraphs(terms, { fontSize: 9.5 });
  return [{ text: 'Terms', style: 'h2' }, ...(body.length > 0 ? body : [{ text: 'No further terms.', style: 'muted' }])];
}

const DEFERS = 'This proposal defers to local codes, state wildlife rules and licensed practice; check them before work begins.';

/** The cautions boxed in clay, deferring to local codes, wildlife rules and licensed practice. */
export function cautionsSection(cautions: DocData['cautions']): Content {
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
