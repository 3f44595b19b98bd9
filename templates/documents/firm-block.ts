/** The firm's block on a document's letterhead: logo, name, address, phone and e-mail, website, licence numbers. */
import type { Column, Content } from 'pdfmake/interfaces';
import { CONTENT_WIDTH_PT, DOC_COLORS, FONT_HEADING } from './kit/layout';
import { firmContactLines } from '../../shared/domain/firm-contact';

/** What the letterhead prints about the firm; `logo` is a PNG or JPEG data URL. */
export interface LetterheadFirm {
  name: string;
  phone?: string | null;
  email?: string | null;
  address?: string | null;
  website?: string | null;
  licenceNumbers?: string | null;
  logo?: string | null;
  /** The units the firm shows areas and lengths in (acres and feet when unset). */
  areaUnit?: 'acres' | 'hectares' | null;
  lengthUnit?: 'feet' | 'metres' | null;
}

/** The letterhead's left column: the logo (at most 1.6 × 0.7 in) above the firm's name and contact lines. */
export function firmBlock(firm: LetterheadFirm): Column {
  const lines = firmContactLines(firm);
  return {
    width: '*',
    stack: [
      ...(firm.logo ? [{ image: firm.logo, fit: [115, 50] as [number, number], margin: [0, 0, 0, 6] as [number, number, number, number] }] : []),
      { text: firm.name, font: FONT_HEADING, bold: true, fontSize: 15, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 3] },
      ...lines.map((line) => ({ text: line, fontSize: 9, color: DOC_COLORS.slate })),
    ],
  };
}

/** One line on the right of the letterhead (the first is the document's number, in bold). */
export interface LetterheadLine {
  text: string;
  bold?: boolean;
}

/**
 * A document's letterhead: the firm's block on the left; on the right the kind of document in
 * small capitals ("PROPOSAL", "INVOICE") above its number and dates; a rule below.
 */
export function letterhead(firm: LetterheadFirm, kind: string, lines: readonly LetterheadLine[]): Content {
  return {
    margin: [0, 0, 0, 14],
    stack: [
      {
        columns: [
          firmBlock(firm),
          {
            width: 'auto',
            stack: [
              { text: kind.toUpperCase(), fontSize: 8, bold: true, color: DOC_COLORS.moss, characterSpacing: 1.2, alignment: 'right', margin: [0, 2, 0, 2] },
              ...lines.map((line) => (line.bold ? { text: line.text, bold: true, fontSize: 10, alignment: 'right' as const } : { text: line.text, fontSize: 9, color: DOC_COLORS.slate, alignment: 'right' as const })),
            ],
          },
        ],
        columnGap: 16,
      },
      { canvas: [{ type: 'line', x1: 0, y1: 8, x2: CONTENT_WIDTH_PT, y2: 8, lineWidth: 1, lineColor: DOC_COLORS.rule }] },
    ],
  };
}
