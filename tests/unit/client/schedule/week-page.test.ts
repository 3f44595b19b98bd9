import { describe, expect, it } from 'vitest';
import { dayCountText } from '../../../../src/features/schedule/lib/timeline';
import { LIST_PAGE } from '../../../../shared/schemas/common';
import { TaskListQuerySchema, WEEK_PAGE, weekLimit, weekPerDay } from '../../../../shared/schemas/task';

// Check values: the week list's own rules (common practice, no source).
describe('the week list page by day', () => {
  it('asks a few tasks a day first, more with each "Show more", never past one list page', () => {
    expect(weekPerDay(1)).toBe(WEEK_PAGE.perDay);
    expect(weekPerDay(2)).toBe(WEEK_PAGE.perDay + WEEK_PAGE.step);
    expect(weekPerDay(10_000)).toBe(WEEK_PAGE.max);
    // Eight groups (seven days and the unscheduled) fit the list's limit at every step.
    for (const pages of [1, 2, 5, 10_000]) expect(8 * weekPerDay(pages)).toBeLessThanOrEqual(weekLimit(weekPerDay(pages)));
    expect(weekLimit(WEEK_PAGE.max)).toBeLessThanOrEqual(LIST_PAGE.maxLimit);
  });

  it('says how many of a day it shows', () => {
    expect(dayCountText(0, 0)).toBe('');
    expect(dayCountText(1, 1)).toBe('1 task');
    expect(dayCountText(3, 3)).toBe('3 tasks');
    expect(dayCountText(3, 17)).toBe('3 of 17 tasks');
    // A total older than the rows never shows fewer than are listed.
    expect(dayCountText(4, 2)).toBe('4 tasks');
  });

  it('refuses perDay without the first day it counts from', () => {
    const r = TaskListQuerySchema.safeParse({ perDay: '3' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toBe('perDay needs "from": the days are counted from it');
    expect(TaskListQuerySchema.parse({ from: '2026-09-07', perDay: '3' }).perDay).toBe(3);
  });
});
