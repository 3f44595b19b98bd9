import { describe, expect, it } from 'vitest';
import { readScheduleParams, taskQueryFor, writeScheduleParams } from '../../../../src/features/schedule/lib/schedule-params';

// 2026-06-10 is a Wednesday; its ISO 8601 week starts Monday 2026-06-08 (checked with GNU `date`).
const TODAY = '2026-06-10';

describe('the schedule’s address', () => {
  it('defaults to this week’s list, by unit, with no filters', () => {
    const p = readScheduleParams(new URLSearchParams(''), TODAY);
    expect(p).toMatchObject({ view: 'week', by: 'unit', week: '2026-06-08', propertyId: null, assignee: null, status: null, task: null });
    expect(taskQueryFor(p)).toEqual({ from: '2026-06-08', to: '2026-06-14' });
  });

  it('reads filters, unassigned, the timeline’s dates and the open task', () => {
    const p = readScheduleParams(new URLSearchParams('view=timeline&by=crew&property=12&assignee=none&status=scheduled&from=2026-07-01&to=2026-09-30&task=5'), TODAY);
    expect(p).toMatchObject({ view: 'timeline', by: 'crew', propertyId: 12, assignee: 'none', status: 'scheduled', from: '2026-07-01', to: '2026-09-30', task: 5 });
    expect(taskQueryFor(p)).toEqual({ propertyId: 12, assigneeId: 'none', status: 'scheduled', from: '2026-07-01', to: '2026-09-30' });
  });

  it('ignores what does not parse instead of failing the page', () => {
    // 2026-02-30 is no calendar date (February 2026 has 28 days; 2026 is not a leap year).
    const p = readScheduleParams(new URLSearchParams('view=gantt&property=abc&assignee=-3&status=finished&week=2026-02-30&task=0'), TODAY);
    expect(p).toMatchObject({ view: 'week', propertyId: null, assignee: null, status: null, week: '2026-06-08', task: null });
    // A week given on a Thursday snaps to its Monday.
    expect(readScheduleParams(new URLSearchParams('week=2026-06-18'), TODAY).week).toBe('2026-06-15');
    // "to" before "from" is replaced by twelve weeks from "from".
    const swapped = readScheduleParams(new URLSearchParams('from=2026-08-01&to=2026-07-01'), TODAY);
    expect(swapped.to > swapped.from).toBe(true);
  });

  it('writes changes and drops cleared values', () => {
    const next = writeScheduleParams(new URLSearchParams('property=3&task=9'), { task: null, view: 'timeline' });
    expect(next.toString()).toBe('property=3&view=timeline');
  });
});
