import { describe, expect, it } from 'vitest';
import {
  AVERAGE_FIRST_FROST,
  BRASSICA_GRAZEABLE_DAYS,
  PLANTING_WINDOWS,
  REGIONS,
  WINDOW_KEYS,
  addDays,
  daysBetween,
  formatMonthDay,
  parseIsoDate,
  practiceWindow,
  schedulePrescription,
  defaultTargetDate,
  windowDates,
} from '../../../shared/domain/planting-windows';
import { starterPractice } from '../../../shared/domain/starter-library';
import { validationErrorOf } from './support';

const brassica = starterPractice('fall-brassica-plot');

describe('regional planting windows', () => {
  it('uses the Alabama DCNR dates for the South', () => {
    // Cook & Gray (2003), Alabama DCNR: clover Sep 1–Nov 15, rape Aug 15–Nov 1, cowpeas May 1–Jul 15, sorghum Apr 15–Jun 30
    expect(windowDates('clover', 'south', 2026)).toMatchObject({ earliest: '2026-09-01', latest: '2026-11-15' });
    expect(windowDates('brassica', 'south', 2026)).toMatchObject({ earliest: '2026-08-15', latest: '2026-11-01' });
    expect(windowDates('cowpeas', 'south', 2026)).toMatchObject({ earliest: '2026-05-01', latest: '2026-07-15' });
    expect(windowDates('sorghum', 'south', 2026)).toMatchObject({ earliest: '2026-04-15', latest: '2026-06-30' });
    expect(windowDates('clover', 'south', 2026).source).toMatch(/Alabama DCNR/);
    expect(PLANTING_WINDOWS.clover.regions.north.source).toMatch(/from memory/);
  });

  it('moves fall windows earlier and spring windows later going north (Missouri G4652)', () => {
    const dayOfYear = (md: { month: number; day: number }) => Date.UTC(2001, md.month - 1, md.day);
    for (const key of WINDOW_KEYS) {
      const w = PLANTING_WINDOWS[key];
      const starts = REGIONS.map((r) => dayOfYear(w.regions[r].start));
      for (let i = 1; i < starts.length; i++) {
        if (w.season === 'fall') expect(starts[i], `${key} ${REGIONS[i]}`).toBeLessThanOrEqual(starts[i - 1]);
        if (w.season === 'spring') expect(starts[i], `${key} ${REGIONS[i]}`).toBeGreaterThanOrEqual(starts[i - 1]);
      }
    }
    expect(windowDates('brassica', 'north', 2026).earliest < windowDates('brassica', 'south', 2026).earliest).toBe(true);
  });

  it('finds the default window of a practice by its window key', () => {
    expect(practiceWindow(starterPractice('summer-legume-plot'), 'south', 2027)).toMatchObject({ earliest: '2027-05-01', latest: '2027-07-15' }); // Alabama DCNR cowpeas May 1–Jul 15
  });

  it('runs a winter window into the next year', () => {
    expect(windowDates('dormant-season', 'south', 2026)).toMatchObject({ earliest: '2026-12-01', latest: '2027-03-01' });
  });

  it('rejects unknown regions, windows and years', () => {
    expect(validationErrorOf(() => windowDates('clover', 'tropics' as never, 2026)).field).toBe('region');
    expect(validationErrorOf(() => windowDates('moon' as never, 'south', 2026)).field).toBe('windowKey');
    expect(validationErrorOf(() => windowDates('clover', 'south', 2026.5)).field).toBe('year');
  });
});

describe('ISO date helpers', () => {
  it('adds and counts calendar days across month and year ends', () => {
    expect(addDays('2026-08-20', 80)).toBe('2026-11-08');
    expect(addDays('2024-02-28', 1)).toBe('2024-02-29'); // 2024 is a leap year (Gregorian calendar)
    expect(daysBetween('2026-12-31', '2027-01-01')).toBe(1);
    expect(formatMonthDay('2026-08-15')).toBe('Aug 15');
  });

  it('rejects dates that do not exist', () => {
    expect(validationErrorOf(() => parseIsoDate('2026-02-30', 'today')).field).toBe('today');
    expect(validationErrorOf(() => parseIsoDate('08/15/2026')).message).toMatch(/month, day and year/);
  });
});

describe('schedulePrescription', () => {
  const base = { practice: brassica, region: 'south' as const, year: 2026, targetDate: '2026-08-20', today: '2026-01-10' };

  it('times each step from the target seeding date', () => {
    const s = schedulePrescription(base);
    const step = (key: string) => s.steps.find((x) => x.stepKey === key);
    expect(step('seed')).toMatchObject({ isAnchor: true, earliest: '2026-08-15', latest: '2026-11-01' }); // Alabama DCNR rape window
    expect(step('burn-down')).toMatchObject({ earliest: '2026-08-06', latest: '2026-08-13' }); // 7–14 days before seeding (common practice, no source)
    expect(step('lime')).toMatchObject({ earliest: '2026-02-21', latest: '2026-05-22' }); // 3–6 months before (common practice, no source)
    expect(step('soil-test')?.earliest).toBe('2025-08-20');
    expect(step('topdress')).toMatchObject({ earliest: '2026-09-19', latest: '2026-10-04' }); // 30–45 days after seeding (common practice, no source)
    expect(s.warnings.map((w) => w.code)).toEqual(['frost-too-close']); // only the 87-days-before-frost note
  });

  it('gives the brassica grazing window 80–150 days after seeding (Penn State Extension)', () => {
    const s = schedulePrescription(base);
    expect(BRASSICA_GRAZEABLE_DAYS).toEqual({ min: 80, max: 150 }); // Penn State Extension (Hall & Jung)
    expect(s.grazeable).toEqual({ earliest: '2026-11-08', latest: '2027-01-17' }); // Aug 20 + 80 and + 150 days
  });

  it('warns when a step window has passed, unless the step is done', () => {
    const s = schedulePrescription({ ...base, today: '2026-05-01' });
    const passed = s.warnings.filter((w) => w.code === 'window-passed').map((w) => w.stepKey);
    expect(passed).toEqual(['soil-test']); // soil test closes 120 days before Aug 20 = Apr 22
    const done = schedulePrescription({ ...base, today: '2026-05-01', doneStepKeys: ['soil-test'] });
    expect(done.warnings.some((w) => w.code === 'window-passed')).toBe(false);
    const late = schedulePrescription({ ...base, today: '2027-01-01' });
    expect(late.warnings.filter((w) => w.code === 'window-passed')).toHaveLength(brassica.steps.length);
  });

  it('warns when a step is scheduled before a step it depends on', () => {
    const s = schedulePrescription({ ...base, scheduledDates: { disc: '2026-08-19', seed: '2026-08-18' } });
    const order = s.warnings.filter((w) => w.code === 'dependency-order');
    expect(order.map((w) => w.stepKey)).toEqual(['seed']);
    expect(order[0].message).toMatch(/schedule "Disc and prepare the seedbed" first/);
  });

  it('notes a scheduled date outside its window and a target outside the season', () => {
    const s = schedulePrescription({ ...base, scheduledDates: { 'burn-down': '2026-07-01' } });
    expect(s.warnings.map((w) => w.code)).toContain('scheduled-outside-window');
    const late = schedulePrescription({ ...base, targetDate: '2026-12-01' });
    expect(late.warnings.map((w) => w.code)).toContain('target-outside-window');
  });

  it('warns when brassicas go in too close to the first frost (60–90 days: common practice, no source)', () => {
    expect(AVERAGE_FIRST_FROST.south).toEqual({ month: 11, day: 15 }); // from memory
    const early = schedulePrescription({ ...base, targetDate: '2026-08-15' });
    expect(early.daysBeforeFirstFrost).toBe(92);
    expect(early.warnings.some((w) => w.code === 'frost-too-close')).toBe(false);
    const mid = schedulePrescription(base);
    expect(mid.daysBeforeFirstFrost).toBe(87);
    expect(mid.warnings.find((w) => w.code === 'frost-too-close')?.severity).toBe('info');
    const late = schedulePrescription({ ...base, targetDate: '2026-10-01' });
    const warning = late.warnings.find((w) => w.code === 'frost-too-close');
    expect(warning?.severity).toBe('warning');
    expect(warning?.message).toMatch(/45 days before the average first frost \(Nov 15\)/);
    const ownFrost = schedulePrescription({ ...base, targetDate: '2026-08-15', firstFrost: { month: 10, day: 1 } });
    expect(ownFrost.daysBeforeFirstFrost).toBe(47);
  });

  it('has no frost check for practices that are not brassicas', () => {
    const s = schedulePrescription({ ...base, practice: starterPractice('perennial-clover-chicory'), targetDate: '2026-09-10' });
    expect(s.grazeable).toBeNull();
    expect(s.daysBeforeFirstFrost).toBeNull();
  });

  it('defaults the target to the first day of the window and is a pure function of its inputs', () => {
    const a = schedulePrescription({ practice: brassica, region: 'midwest', year: 2026, today: '2026-06-01' });
    const b = schedulePrescription({ practice: brassica, region: 'midwest', year: 2026, today: '2026-06-01' });
    expect(a.targetDate).toBe('2026-07-20');
    expect(a).toEqual(b);
  });

  it('rejects unknown steps and bad dates with the field named', () => {
    expect(validationErrorOf(() => schedulePrescription({ ...base, scheduledDates: { nosuch: '2026-08-01' } })).field).toBe('scheduledDates.nosuch');
    expect(validationErrorOf(() => schedulePrescription({ ...base, scheduledDates: { seed: '2026-13-01' } })).field).toBe('scheduledDates.seed');
    expect(validationErrorOf(() => schedulePrescription({ ...base, today: 'tomorrow' })).field).toBe('today');
    expect(validationErrorOf(() => schedulePrescription({ ...base, firstFrost: { month: 2, day: 30 } })).field).toBe('firstFrost');
  });
});

describe('a new prescription’s default dates', () => {
  // Alabama DCNR (Cook & Gray 2003) south rape/brassica window: Aug 15 – Nov 1.
  const base = { practice: brassica, region: 'south' as const, year: 2026 };

  it('targets today when today is inside the window that is still open, not the window’s passed first day', () => {
    const s = schedulePrescription({ ...base, today: '2026-09-10' });
    expect(s.anchorWindow).toMatchObject({ earliest: '2026-08-15', latest: '2026-11-01' });
    expect(s.targetDate).toBe('2026-09-10');
    // Every step is timed from today, so nothing lands before today because of the default.
    const topdress = s.steps.find((x) => x.stepKey === 'topdress')!;
    expect(topdress.earliest >= '2026-09-10').toBe(true);
    expect(s.warnings.some((w) => w.code === 'target-outside-window')).toBe(false);
  });

  it('targets the window’s first day when the window has not opened yet, and on its last day keeps today', () => {
    expect(schedulePrescription({ ...base, today: '2026-03-01' }).targetDate).toBe('2026-08-15');
    expect(schedulePrescription({ ...base, today: '2026-08-15' }).targetDate).toBe('2026-08-15');
    expect(schedulePrescription({ ...base, today: '2026-11-01' }).targetDate).toBe('2026-11-01');
  });

  it('keeps a chosen target date as it is', () => {
    expect(schedulePrescription({ ...base, today: '2026-09-10', targetDate: '2026-08-20' }).targetDate).toBe('2026-08-20');
  });

  it('picks inside the window in the pure helper too', () => {
    const w = { earliest: '2026-08-15', latest: '2026-11-01' };
    expect(defaultTargetDate(w, '2026-08-14')).toBe('2026-08-15');
    expect(defaultTargetDate(w, '2026-10-31')).toBe('2026-10-31');
    expect(defaultTargetDate(w, '2026-11-02')).toBe('2026-08-15'); // closed: the caller plans next season's window
  });

  it('writes the dates of its warnings as people write them', () => {
    const s = schedulePrescription({ ...base, targetDate: '2026-08-20', today: '2026-05-01' });
    const passed = s.warnings.find((w) => w.code === 'window-passed')!;
    expect(passed.message).toContain('closed on Apr 22, 2026');
    expect(passed.message).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });
});
