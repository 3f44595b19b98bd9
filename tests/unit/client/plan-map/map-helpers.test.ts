import { describe, expect, it } from 'vitest';
import { frameStats } from '../../../../src/features/plan-map/lib/frame-stats';
import { niceScaleBar } from '../../../../src/features/plan-map/lib/scale-bar';
import { graticule } from '../../../../src/features/plan-map/lib/map-style';
import { kindMatch } from '../../../../src/features/plan-map/lib/plan-layers';
import { formatAcresShort, formatFeet, formatMiles } from '../../../../src/features/plan-map/lib/measure-format';
import { symbolPath } from '../../../../src/features/plan-map/lib/symbols';

describe('frame-time statistics', () => {
  it('gives the median and the nearest-rank 95th percentile', () => {
    const intervals = Array.from({ length: 20 }, (_, i) => i + 1); // 1..20 ms
    const s = frameStats(intervals);
    // Median of 1..20 is (10 + 11) / 2; nearest rank for p95 of 20 values is ceil(0.95 × 20) = 19th
    // (NIST/SEMATECH e-Handbook of Statistical Methods, 7.2.6.2 Percentiles, nearest-rank form).
    expect(s).toEqual({ frames: 20, medianMs: 10.5, p95Ms: 19, maxMs: 20 });
  });

  it('answers zeros for no frames', () => {
    expect(frameStats([])).toEqual({ frames: 0, medianMs: 0, p95Ms: 0, maxMs: 0 });
  });
});

describe('the printed scale bar', () => {
  it('picks the longest round length in feet that fits', () => {
    // 1 m/px × 180 px = 590.6 ft (1 ft = 0.3048 m exactly, NIST Handbook 44 App. C) → 500 ft = 152.4 px.
    const bar = niceScaleBar(1, 180);
    expect(bar.label).toBe('500 ft');
    expect(bar.px).toBeCloseTo(152.4, 6);
  });

  it('switches to miles when half a mile fits', () => {
    // 10 m/px × 180 px = 5,905 ft ≥ 1 mi (5,280 ft, NIST Handbook 44 App. C) → 1 mi = 160.93 px.
    const bar = niceScaleBar(10, 180);
    expect(bar.label).toBe('1 mi');
    expect(bar.px).toBeCloseTo(160.9344, 4);
  });
});

describe('map helpers', () => {
  it('spaces the graticule so that the box holds about six lines', () => {
    const g = graticule([-90.94, 43.266, -90.931, 43.273]);
    // Box span 0.009° → step 0.0025° (the first step with span / step ≤ 6); app rule, no source.
    const lons = g.features.filter((f) => f.geometry.coordinates[0][0] === f.geometry.coordinates[1][0]).map((f) => f.geometry.coordinates[0][0]);
    expect(lons[1] - lons[0]).toBeCloseTo(0.0025, 9);
  });

  it('colours units by kind with one match expression', () => {
    const m = kindMatch('fill', '#000000', ['food-plot', 'water']);
    // Fill colours from DESIGN.md's kind table.
    expect(m).toEqual(['match', ['get', 'kind'], 'food-plot', '#8DB255', 'water', '#7FB3CF', '#000000']);
  });

  it('writes measures in feet, miles and acres', () => {
    expect(formatFeet(1234.4)).toBe('1,234 ft');
    expect(formatMiles(0.05)).toBe('0.050 mi');
    expect(formatMiles(1.234)).toBe('1.23 mi');
    expect(formatAcresShort(40.004)).toBe('40.00 ac');
  });

  it('draws every symbol as a closed path inside its box', () => {
    for (const s of ['triangle', 'square', 'diamond', 'circle', 'bar'] as const) {
      const d = symbolPath(s, 22);
      expect(d.endsWith('Z')).toBe(true);
      const numbers = d.match(/-?\d+(\.\d+)?/g)!.map(Number);
      expect(Math.min(...numbers)).toBeGreaterThanOrEqual(0);
      expect(Math.max(...numbers)).toBeLessThanOrEqual(22);
    }
  });
});
