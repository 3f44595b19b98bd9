import { describe, expect, it } from 'vitest';
import { schedulePrescription } from '../../../shared/domain/planting-windows';
import { formatDollars, joinWithAnd, summarizePrescription } from '../../../shared/domain/prescription-summary';
import { STARTER_MATERIALS, starterPractice } from '../../../shared/domain/starter-library';

describe('summarizePrescription', () => {
  it('says what, why and when in plain words', () => {
    const text = summarizePrescription({
      practice: starterPractice('fall-brassica-plot'),
      unit: { acres: 2.4 },
      materials: STARTER_MATERIALS,
      window: { earliest: '2026-08-15', latest: '2026-09-15' },
      totalCents: 166362,
    });
    expect(text).toBe(
      'Plant 2.4 acres of fall brassicas (forage radish, turnip and rape) between Aug 15 and Sep 15 to give deer a high-energy food source in late fall and winter. The estimated cost is $1,663.62.',
    );
  });

  it('adds when preparation starts and when deer can graze brassicas, from the schedule', () => {
    const practice = starterPractice('fall-brassica-plot');
    const schedule = schedulePrescription({ practice, region: 'south', year: 2026, targetDate: '2026-08-20', today: '2026-01-10' });
    const text = summarizePrescription({ practice, unit: { acres: 0.75 }, materials: STARTER_MATERIALS, schedule });
    expect(text).toMatch(/^Plant 0\.75 acres of fall brassicas .* between Aug 15 and Nov 1 to /);
    expect(text).toMatch(/Preparation starts on or after Aug 20, 2025: soil test\./);
    expect(text).toMatch(/Deer can graze it from about Nov 8\./); // 80 days after Aug 20 (Penn State Extension)
  });

  it('speaks in feet for lines and in counts for points', () => {
    expect(summarizePrescription({ practice: starterPractice('access-route-clearing'), unit: { lengthFt: 1250 } })).toMatch(/^Clear 1,250 ft of low-impact access route to stand sites to let hunters/);
    expect(summarizePrescription({ practice: starterPractice('mock-scrape'), unit: { count: 1 } })).toMatch(/^Build a mock scrape under a licking branch/);
    expect(summarizePrescription({ practice: starterPractice('mock-scrape'), unit: { count: 3 } })).toMatch(/^Build 3 mock scrapes under licking branches/);
  });

  it('leaves out the species list when the subject already names it', () => {
    const text = summarizePrescription({ practice: starterPractice('switchgrass-screen'), unit: { acres: 1 }, materials: STARTER_MATERIALS });
    expect(text).toMatch(/^Plant 1 acre of switchgrass screen to /);
  });
});

describe('summary helpers', () => {
  it('formats dollars and joins lists', () => {
    expect(formatDollars(166362)).toBe('$1,663.62');
    expect(formatDollars(5)).toBe('$0.05');
    expect(joinWithAnd(['a', 'b', 'c'])).toBe('a, b and c');
    expect(joinWithAnd(['a'])).toBe('a');
  });
});
