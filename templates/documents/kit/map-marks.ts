/**
 * The plan map's marks: number formatting for SVG, label widths, our point symbols, area paint and
 * cased lines in the kind palette, and the small key of a kind for tables and lists.
 */
import { KIND_STYLES, type KindStyle, type UnitKind } from '../../../shared/domain/unit-kinds';
import { DOC_COLORS } from './look';

/** A number for SVG: two decimals at most, never "-0". */
export const fmt = (n: number): string => {
  const r = Math.round(n * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
};

// Advance widths of Source Sans 3 SemiBold (the map's label face), 1/1000 em, for ASCII 32–126,
// read from @fontsource/source-sans-3 5.3.1 with fontkit. Other characters count as 0.56 em.
const SEMIBOLD_WIDTHS = [
  200, 315, 482, 513, 513, 841, 639, 275, 324, 324, 438, 513, 275, 322, 275, 344, 513, 513, 513, 513, 513, 513, 513, 513,
  513, 513, 275, 275, 513, 513, 513, 444, 875, 558, 597, 576, 625, 538, 510, 628, 663, 282, 494, 597, 502, 745, 657, 674,
  582, 674, 592, 545, 546, 655, 536, 800, 541, 501, 540, 324, 344, 324, 513, 500, 549, 516, 563, 462, 564, 507, 317, 520,
  558, 262, 263, 522, 271, 843, 560, 549, 564, 564, 373, 431, 361, 556, 495, 748, 481, 495, 443, 324, 255, 324, 513,
];

/** Width in points of a label set in Source Sans 3 SemiBold at `fontSizePt`. */
export function labelWidthPt(text: string, fontSizePt: number): number {
  let units = 0;
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    units += code >= 32 && code < 127 ? SEMIBOLD_WIDTHS[code - 32] : 560;
  }
  return (units / 1000) * fontSizePt;
}

function dashFor(dash: KindStyle['dash'], widthPt: number): string {
  if (dash === 'dashed') return ` stroke-dasharray="${fmt(widthPt * 3)} ${fmt(widthPt * 2)}"`;
  // Round caps turn near-zero dashes into dots.
  if (dash === 'dotted') return ` stroke-dasharray="0.1 ${fmt(widthPt * 2)}" stroke-linecap="round"`;
  return '';
}

/** Half the size of a point symbol on the map, in points. */
export const SYMBOL_HALF_PT = 5;

/** Our own point symbol, centred at (x, y). */
export function symbolSvg(style: KindStyle, x: number, y: number, half = SYMBOL_HALF_PT): string {
  const paint = `fill="${style.fill}" stroke="${style.stroke}" stroke-width="1" stroke-linejoin="round"`;
  switch (style.symbol) {
    case 'triangle':
      return `<path d="M${fmt(x)} ${fmt(y - half * 1.15)}L${fmt(x + half * 1.1)} ${fmt(y + half * 0.85)}L${fmt(x - half * 1.1)} ${fmt(y + half * 0.85)}Z" ${paint}/>`;
    case 'square':
      return `<rect x="${fmt(x - half * 0.85)}" y="${fmt(y - half * 0.85)}" width="${fmt(half * 1.7)}" height="${fmt(half * 1.7)}" ${paint}/>`;
    case 'diamond':
      return `<path d="M${fmt(x)} ${fmt(y - half * 1.15)}L${fmt(x + half)} ${fmt(y)}L${fmt(x)} ${fmt(y + half * 1.15)}L${fmt(x - half)} ${fmt(y)}Z" ${paint}/>`;
    case 'bar':
      return `<rect x="${fmt(x - half * 1.2)}" y="${fmt(y - half * 0.45)}" width="${fmt(half * 2.4)}" height="${fmt(half * 0.9)}" ${paint}/>`;
    case 'circle':
    default:
      return `<circle cx="${fmt(x)}" cy="${fmt(y)}" r="${fmt(half * 0.9)}" ${paint}/>`;
  }
}

/** Fill and stroke attributes of an area in its kind's style (even-odd fill, so holes stay holes). */
export function areaPaint(style: KindStyle, strokeWidthPt = 1): string {
  return `fill="${style.fill}" fill-opacity="${style.fillOpacity}" fill-rule="evenodd" stroke="${style.stroke}" stroke-width="${strokeWidthPt}" stroke-linejoin="round"${dashFor(style.dash, strokeWidthPt * 1.6)}`;
}

function lineWidthFor(kind: UnitKind): number {
  return kind === 'fence' ? 1.3 : 2.2;
}

/** A line in its kind's style over a pale casing, from SVG path data. */
export function lineSvg(style: KindStyle, path: string): string {
  const width = lineWidthFor(style.kind);
  // A pale casing under the line keeps it readable over any area fill.
  return (
    `<path d="${path}" fill="none" stroke="${DOC_COLORS.card}" stroke-opacity="0.85" stroke-width="${fmt(width + 2)}" stroke-linejoin="round" stroke-linecap="round"/>` +
    `<path d="${path}" fill="none" stroke="${style.stroke}" stroke-width="${width}" stroke-linejoin="round"${dashFor(style.dash, width)}/>`
  );
}

/**
 * A small SVG key for one kind (area swatch, line sample or point symbol), the same marks as the
 * map's legend, for tables and lists in documents.
 */
export function kindSwatchSvg(kind: UnitKind, widthPt = 16, heightPt = 10): string {
  const style = KIND_STYLES[kind];
  const cy = heightPt / 2;
  let mark: string;
  if (style.family === 'area') mark = `<rect x="0.5" y="0.5" width="${fmt(widthPt - 1)}" height="${fmt(heightPt - 1)}" ${areaPaint(style)}/>`;
  else if (style.family === 'line') mark = lineSvg(style, `M1.5 ${fmt(cy)}L${fmt(widthPt - 1.5)} ${fmt(cy)}`);
  else mark = symbolSvg(style, widthPt / 2, cy, Math.min(4.5, heightPt / 2 - 0.5));
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${fmt(widthPt)}" height="${fmt(heightPt)}" viewBox="0 0 ${fmt(widthPt)} ${fmt(heightPt)}">${mark}</svg>`;
}
