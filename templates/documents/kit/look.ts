/** The look shared by Browseline's documents: palette (DESIGN.md tokens) and font family names. */

/** The document palette (DESIGN.md tokens). */
export const DOC_COLORS = {
  ink: '#1F2A24',
  moss: '#3F6B3A',
  mossDeep: '#2E5029',
  slate: '#5B6770',
  rule: '#D9D3C3',
  clay: '#B5562B',
  /** A pale wash of clay behind caution text (ink on it passes WCAG AA by a wide margin). */
  clayTint: '#FBF1EB',
  paper: '#F6F3EA',
  card: '#FFFDF7',
} as const;

/** Font family names as registered with pdfmake; SVG text must use these names too. */
export const FONT_HEADING = 'Merriweather';
export const FONT_BODY = 'SourceSans3';
