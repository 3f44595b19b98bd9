import { describe, expect, it } from 'vitest';
import { BAR_MIN_PX, barLabelPlacement, dragDates, laneText, pointerDays, timelineRange, weekHeaderCells } from '../../../../src/features/schedule/lib/timeline';
import { TaskUpdateSchema } from '../../../../shared/schemas/task';

// Calendar facts: 2026-09-01 is a Tuesday; September has 30 days (Gregorian calendar, from memory,
// checked with GNU `date`). Pixel figures are layout arithmetic, common practice, no source.

describe('a bar’s label', () => {
  it('goes inside the bar only when the whole text fits', () => {
    expect(barLabelPlacement({ barLeftPx: 100, barWidthPx: 200, labelWidthPx: 60, laneWidthPx: 800 })).toMatchObject({ where: 'inside', leftPx: 106 });
  });

  it('goes after a narrow bar (a one-day task over two years of weeks), never over it, and after its warning mark', () => {
    const p = barLabelPlacement({ barLeftPx: 300, barWidthPx: 1.1, labelWidthPx: 60, laneWidthPx: 800, markWidthPx: 22 });
    expect(p.where).toBe('after');
    // The bar is drawn at least BAR_MIN_PX wide; the label starts past it and the mark.
    expect(p.leftPx).toBeGreaterThanOrEqual(300 + BAR_MIN_PX + 22);
    expect(p.maxWidthPx).toBeGreaterThanOrEqual(60);
  });

  it('goes before a bar near the lane’s right edge, whole', () => {
    const p = barLabelPlacement({ barLeftPx: 770, barWidthPx: 20, labelWidthPx: 90, laneWidthPx: 800 });
    expect(p.where).toBe('before');
    expect(p.leftPx + 90).toBeLessThanOrEqual(770);
    expect(p.maxWidthPx).toBeGreaterThanOrEqual(90);
  });
});

describe('the by-crew view', () => {
  it('names the unit beside the step, since a crew member’s row holds several units', () => {
    expect(laneText({ name: 'Soil test', unitName: 'Ridge clover plot' }, 'crew')).toBe('Soil test · Ridge clover plot');
    expect(laneText({ name: 'Soil test', unitName: 'Ridge clover plot' }, 'unit')).toBe('Soil test');
  });
});

describe('dragging a bar', () => {
  const task = { earliest: '2026-09-01', latest: '2026-09-30', startDate: '2026-09-10', endDate: '2026-09-12' };

  it('moves both dates by whole days, keeping the length', () => {
    expect(dragDates(task, 5)).toEqual({ days: 5, startDate: '2026-09-15', endDate: '2026-09-17' });
    expect(TaskUpdateSchema.safeParse({ startDate: '2026-09-15', endDate: '2026-09-17' }).success).toBe(true);
  });

  it('stops at the window’s edges', () => {
    expect(dragDates(task, -30)).toEqual({ days: -9, startDate: '2026-09-01', endDate: '2026-09-03' });
    expect(dragDates(task, 40)).toEqual({ days: 18, startDate: '2026-09-28', endDate: '2026-09-30' });
  });

  it('does not move a task with no dates or one longer than its window', () => {
    expect(dragDates({ ...task, startDate: null, endDate: null }, 3)).toBeNull();
    expect(dragDates({ ...task, startDate: '2026-08-20', endDate: '2026-10-10' }, 3)).toBeNull();
  });

  it('snaps the pointer to the nearest day', () => {
    const range = timelineRange('2026-08-31', '2026-10-25'); // eight weeks: 56 days
    expect(range.totalDays).toBe(56);
    expect(pointerDays(0.4 * (560 / 56), 560, 56)).toBe(0);
    expect(pointerDays(2.6 * (560 / 56), 560, 56)).toBe(3);
    expect(pointerDays(-31, 560, 56)).toBe(-3);
  });
});

describe('the header’s week labels', () => {
  it('labels every week when there is room and every n-th week over a long range, covering all weeks', () => {
    const twelve = timelineRange('2026-11-16', '2027-02-07').weeks;
    expect(weekHeaderCells(twelve, 960).map((c) => c.span)).toEqual(Array(12).fill(1));
    const twoYears = timelineRange('2026-01-05', '2027-12-27').weeks; // 104 ISO weeks
    expect(twoYears.length).toBe(104);
    const cells = weekHeaderCells(twoYears, 620);
    // 620 px / 104 weeks ≈ 6 px a week: one label every 9 weeks (48 px each), spans adding up to every week.
    expect(cells[0].span).toBe(9);
    expect(cells.reduce((n, c) => n + c.span, 0)).toBe(104);
    expect(cells.every((c) => (c.span / 104) * 620 >= 48 || c === cells[cells.length - 1])).toBe(true);
  });
});
