import { describe, expect, it } from 'vitest';
import { dayOffsetPct, defaultTimelineDates, spanBox, timelineRange, timelineRows, weekGroups, type LayoutTask } from '../../../../src/features/schedule/lib/timeline';

// Weekdays below: ISO 8601 weeks start on Monday; 2026-06-08 is a Monday and 2026-06-14 a Sunday
// (Gregorian calendar, checked with GNU `date -d 2026-06-08 +%A`). 2024 is a leap year (29 Feb).

const task = (over: Partial<LayoutTask> & { id: number }): LayoutTask => ({
  unitId: 1,
  unitName: 'North plot',
  propertyName: 'Test farm',
  assigneeId: null,
  assigneeName: null,
  earliest: '2026-06-01',
  latest: '2026-06-30',
  startDate: null,
  endDate: null,
  name: 'Seed',
  ...over,
});

describe('the timeline’s range', () => {
  it('covers whole Monday-to-Sunday weeks around the dates asked for', () => {
    const r = timelineRange('2026-06-10', '2026-06-20');
    expect(r.start).toBe('2026-06-08'); // the Monday of Wednesday 10 June 2026 (ISO 8601)
    expect(r.end).toBe('2026-06-21'); // the Sunday of Saturday 20 June
    expect(r.totalDays).toBe(14);
    expect(r.weeks).toEqual(['2026-06-08', '2026-06-15']);
  });

  it('crosses a leap day without losing a day', () => {
    // 2024-02-26 is a Monday; with 29 Feb the next Monday is 4 March (Gregorian leap-year rule).
    const r = timelineRange('2024-02-26', '2024-03-03');
    expect(r.weeks).toEqual(['2024-02-26']);
    expect(timelineRange('2024-02-26', '2024-03-04').weeks).toEqual(['2024-02-26', '2024-03-04']);
  });

  it('defaults to two weeks back and ten weeks ahead: twelve columns', () => {
    const d = defaultTimelineDates('2026-06-10');
    const r = timelineRange(d.from, d.to);
    expect(r.weeks.length).toBe(12); // common practice, no source: a season's quarter at a glance
    expect(r.weeks[2]).toBe('2026-06-08');
  });
});

describe('date to x', () => {
  const range = timelineRange('2026-06-08', '2026-06-21'); // 14 days

  it('puts a day at its share of the days shown', () => {
    expect(dayOffsetPct('2026-06-08', range)).toBe(0);
    expect(dayOffsetPct('2026-06-15', range)).toBe(50); // day 7 of 14
    expect(dayOffsetPct('2026-06-22', range)).toBe(100);
  });

  it('draws a span of whole days, both ends included', () => {
    // 10 → 12 June: days 2, 3 and 4 of 14 → left 2/14, width 3/14.
    const box = spanBox('2026-06-10', '2026-06-12', range)!;
    expect(box.leftPct).toBeCloseTo((2 / 14) * 100, 10);
    expect(box.widthPct).toBeCloseTo((3 / 14) * 100, 10);
    expect(box).toMatchObject({ cutStart: false, cutEnd: false });
    // A one-day task is one day wide.
    expect(spanBox('2026-06-21', '2026-06-21', range)!.widthPct).toBeCloseTo(100 / 14, 10);
  });

  it('clips spans at the edges and drops those wholly outside', () => {
    const clipped = spanBox('2026-06-01', '2026-06-09', range)!;
    expect(clipped).toMatchObject({ leftPct: 0, cutStart: true, cutEnd: false });
    expect(clipped.widthPct).toBeCloseTo((2 / 14) * 100, 10);
    const after = spanBox('2026-06-20', '2026-07-30', range)!;
    expect(after.cutEnd).toBe(true);
    expect(after.leftPct + after.widthPct).toBeCloseTo(100, 10);
    expect(spanBox('2026-05-01', '2026-06-07', range)).toBeNull();
    expect(spanBox('2026-06-22', '2026-06-30', range)).toBeNull();
  });
});

describe('rows and the week list', () => {
  const tasks = [
    task({ id: 1, unitId: 2, unitName: 'Oak slope', assigneeId: 7, assigneeName: 'Rosa', startDate: '2026-06-12', endDate: '2026-06-12' }),
    task({ id: 2, unitId: 1, unitName: 'North plot', startDate: null }),
    task({ id: 3, unitId: 1, unitName: 'North plot', assigneeId: 7, assigneeName: 'Rosa', startDate: '2026-06-05', endDate: '2026-06-09', name: 'Spray' }),
    task({ id: 4, unitId: 1, unitName: 'North plot', startDate: '2026-06-20', endDate: '2026-06-20' }),
    task({ id: 5, unitId: 3, unitName: 'Far plot', earliest: '2026-07-01', latest: '2026-07-30' }),
  ];

  it('groups by unit, names sorted, tasks by date; by crew with Unassigned last', () => {
    const units = timelineRows(tasks, 'unit');
    expect(units.map((r) => r.label)).toEqual(['Far plot', 'North plot', 'Oak slope']);
    // An unscheduled task sorts by its window's first day (1 June), before one set for 5 June.
    expect(units[1].tasks.map((t) => t.id)).toEqual([2, 3, 4]);
    const crew = timelineRows(tasks, 'crew');
    expect(crew.map((r) => r.label)).toEqual(['Rosa', 'Unassigned']);
    expect(crew[0].tasks.map((t) => t.id)).toEqual([3, 1]);
  });

  it('lists a week by day, a span on its first day in the week, then the unscheduled whose window touches the week', () => {
    const groups = weekGroups(tasks, '2026-06-08');
    expect(groups).toHaveLength(8);
    expect(groups[0]).toEqual({ date: '2026-06-08', tasks: [tasks[2]] }); // 5–9 June reaches into the week
    expect(groups[4]).toEqual({ date: '2026-06-12', tasks: [tasks[0]] }); // Friday
    expect(groups[6].date).toBe('2026-06-14'); // Sunday
    expect(groups.flatMap((g) => g.tasks).some((t) => t.id === 4)).toBe(false); // next week
    expect(groups[7]).toEqual({ date: null, tasks: [tasks[1]] }); // window 1–30 June; task 5's July window does not touch
  });
});
