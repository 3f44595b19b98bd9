/**
 * Simple grouped bar charts as SVG for documents (pdfmake draws `svg` nodes): a title, a legend,
 * a value axis from zero with "nice" gridlines, one group of bars per category and the value above
 * each bar. Same palette and fonts as the rest of the documents; every text is XML-escaped.
 */
import { escapeXml } from '../../../shared/domain/xml';
import { DOC_COLORS, FONT_BODY, FONT_HEADING } from './look';

export interface BarSeries {
  label: string;
  /** Fill colour, "#RRGGBB". */
  color: string;
  /** One value per category; null leaves a gap (nothing measured). */
  values: readonly (number | null)[];
}

export interface BarChartInput {
  title: string;
  categories: readonly string[];
  series: readonly BarSeries[];
  widthPt: number;
  heightPt: number;
  /** Decimals of the value printed above each bar. */
  valueDecimals?: number;
  /** Label of the value axis ("deer", "does per buck"). */
  axisLabel?: string;
  /** Counts: gridlines at whole numbers only. */
  wholeTicks?: boolean;
}

export interface BarChartLayout {
  /** Plot area: bars stand on `baselineY` and reach at most up to `topY`. */
  plot: { left: number; right: number; topY: number; baselineY: number };
  axisMax: number;
  ticks: number[];
  bars: { series: number; category: number; x: number; y: number; width: number; height: number; value: number }[];
}

const fmt = (n: number): string => {
  const r = Math.round(n * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
};

/** The smallest "nice" step (1, 2 or 5 × 10ⁿ) giving at most `maxTicks` steps to `max` (common practice, no source). */
export function niceStep(max: number, maxTicks = 5): number {
  if (!(max > 0)) return 1;
  const raw = max / maxTicks;
  const power = 10 ** Math.floor(Math.log10(raw));
  for (const m of [1, 2, 5, 10]) if (m * power >= raw) return m * power;
  return 10 * power;
}

/** Where every bar goes; values must be finite and zero or more. */
export function barChartLayout(input: BarChartInput): BarChartLayout {
  const values = input.series.flatMap((s) => s.values.filter((v): v is number => v !== null));
  for (const v of values) if (!Number.isFinite(v) || v < 0) throw new RangeError(`Bar values must be finite and zero or more (got ${v}).`);
  const top = Math.max(0, ...values);
  const step = input.wholeTicks ? Math.max(1, niceStep(top)) : niceStep(top);
  const axisMax = top > 0 ? Math.ceil(top / step) * step : step;
  const ticks: number[] = [];
  for (let t = 0; t <= axisMax + step / 1000; t += step) ticks.push(Math.round(t * 1e6) / 1e6);
  const legendPt = input.series.length > 1 ? 14 : 0;
  const plot = { left: 34, right: input.widthPt - 4, topY: 22 + legendPt + 10, baselineY: input.heightPt - 18 };
  const n = Math.max(1, input.categories.length);
  const groupWidth = (plot.right - plot.left) / n;
  const barWidth = Math.min(28, (groupWidth * 0.75) / Math.max(1, input.series.length));
  const bars: BarChartLayout['bars'] = [];
  input.categories.forEach((_, c) => {
    const groupLeft = plot.left + c * groupWidth + (groupWidth - barWidth * input.series.length) / 2;
    input.series.forEach((s, k) => {
      const value = s.values[c];
      if (value === null || value === undefined) return;
      const height = ((plot.baselineY - plot.topY) * value) / axisMax;
      bars.push({ series: k, category: c, x: groupLeft + k * barWidth, y: plot.baselineY - height, width: barWidth, height, value });
    });
  });
  return { plot, axisMax, ticks, bars };
}

/** The chart as an SVG string sized widthPt × heightPt. */
export function barChartSvg(input: BarChartInput): string {
  const layout = barChartLayout(input);
  const { plot } = layout;
  const decimals = input.valueDecimals ?? 0;
  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${fmt(input.widthPt)}" height="${fmt(input.heightPt)}" viewBox="0 0 ${fmt(input.widthPt)} ${fmt(input.heightPt)}" font-family="${FONT_BODY}">`,
    `<text x="0" y="11" font-family="${FONT_HEADING}" font-weight="bold" font-size="10" fill="${DOC_COLORS.ink}">${escapeXml(input.title)}</text>`,
  ];
  if (input.series.length > 1) {
    let x = 0;
    for (const s of input.series) {
      parts.push(`<rect x="${fmt(x)}" y="20" width="9" height="9" fill="${s.color}"/>`);
      parts.push(`<text x="${fmt(x + 12)}" y="28" font-size="8.5" fill="${DOC_COLORS.ink}">${escapeXml(s.label)}</text>`);
      x += 12 + s.label.length * 4.6 + 14;
    }
  }
  for (const tick of layout.ticks) {
    const y = plot.baselineY - ((plot.baselineY - plot.topY) * tick) / layout.axisMax;
    parts.push(`<line x1="${fmt(plot.left)}" y1="${fmt(y)}" x2="${fmt(plot.right)}" y2="${fmt(y)}" stroke="${DOC_COLORS.rule}" stroke-width="${tick === 0 ? 1 : 0.5}"/>`);
    parts.push(`<text x="${fmt(plot.left - 4)}" y="${fmt(y + 3)}" font-size="8" text-anchor="end" fill="${DOC_COLORS.slate}">${escapeXml(tick.toLocaleString('en-US', { maximumFractionDigits: 2 }))}</text>`);
  }
  if (input.axisLabel) {
    parts.push(`<text x="${fmt(plot.left)}" y="${fmt(plot.topY - 4)}" font-size="7.5" fill="${DOC_COLORS.slate}">${escapeXml(input.axisLabel)}</text>`);
  }
  for (const bar of layout.bars) {
    const color = input.series[bar.series].color;
    parts.push(`<rect class="bar" x="${fmt(bar.x)}" y="${fmt(bar.y)}" width="${fmt(Math.max(0, bar.width - 1.5))}" height="${fmt(bar.height)}" fill="${color}"/>`);
    parts.push(
      `<text x="${fmt(bar.x + (bar.width - 1.5) / 2)}" y="${fmt(bar.y - 2.5)}" font-size="7.5" text-anchor="middle" fill="${DOC_COLORS.ink}">${escapeXml(bar.value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }))}</text>`,
    );
  }
  const groupWidth = (plot.right - plot.left) / Math.max(1, input.categories.length);
  input.categories.forEach((label, c) => {
    parts.push(`<text x="${fmt(plot.left + (c + 0.5) * groupWidth)}" y="${fmt(plot.baselineY + 11)}" font-size="8.5" text-anchor="middle" fill="${DOC_COLORS.ink}">${escapeXml(label)}</text>`);
  });
  parts.push('</svg>');
  return parts.join('');
}
