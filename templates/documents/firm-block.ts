/** The firm's block on a document's letterhead: logo, name, address, phone and e-mail, website, licence numbers. */
import type { Column } from 'pdfmake/interfaces';
import { DOC_COLORS, FONT_HEADING } from './kit/layout';
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
