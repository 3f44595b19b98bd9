import { describe, expect, it } from 'vitest';
import { barChartLayout, barChartSvg, niceStep } from '../../../templates/documents/kit/bar-chart-svg';

describe('niceStep', () => {
  it('picks 1, 2 or 5 × 10ⁿ so that at most five steps reach the top', () => {
    // Common practice for chart axes, no source; worked by hand.
    expect(niceStep(28)).toBe(10); // 28 ÷ 5 = 5.6 → 10
    expect(niceStep(9)).toBe(2); // 1.8 → 2
    expect(niceStep(2)).toBe(0.5); // 0.4 → 0.5
    expect(niceStep(0)).toBe(1);
  });
});

describe('barChartLayout', () => {
  const input = {
    title: 'Deer',
    categories: ['2024–25', '2025–26'],
    series: [
      { label: 'Bucks', color: '#3F6B3A', values: [10, 20] },
      { label: 'Does', color: '#B5562B', values: [null, 5] },
    ],
    widthPt: 400,
    heightPt: 160,
  };

  it('draws bars from zero in proportion to their values', () => {
    const layout = barChartLayout(input);
    expect(layout.axisMax).toBe(20); // top 20, step 5 (20 ÷ 5 = 4 → 5), worked by hand
    const plotHeight = layout.plot.baselineY - layout.plot.topY;
    const bar = (series: number, category: number) => layout.bars.find((b) => b.series === series && b.category === category)!;
    expect(bar(0, 1).height).toBeCloseTo(plotHeight, 9);
    expect(bar(0, 0).height).toBeCloseTo(plotHeight / 2, 9); // 10 of 20, worked by hand
    expect(bar(1, 1).height).toBeCloseTo(plotHeight / 4, 9); // 5 of 20
    expect(layout.bars.some((b) => b.series === 1 && b.category === 0)).toBe(false); // null leaves a gap
    expect(layout.ticks).toEqual([0, 5, 10, 15, 20]);
  });

  it('keeps gridlines on whole numbers for counts', () => {
    const layout = barChartLayout({ ...input, series: [{ label: 'Bucks', color: '#3F6B3A', values: [1, 0] }], wholeTicks: true });
    expect(layout.ticks).toEqual([0, 1]);
  });

  it('refuses negative or non-finite values with a clear message', () => {
    expect(() => barChartLayout({ ...input, series: [{ label: 'x', color: '#000000', values: [-1] }] })).toThrow(/finite and zero or more/);
    expect(() => barChartLayout({ ...input, series: [{ label: 'x', color: '#000000', values: [Number.NaN] }] })).toThrow(/finite and zero or more/);
  });

  it('escapes text in the SVG', () => {
    const svg = barChartSvg({ ...input, title: 'Bucks & <does>' });
    expect(svg).toContain('Bucks &amp; &lt;does&gt;');
    expect(svg.match(/class="bar"/g)?.length).toBe(3);
  });
});
