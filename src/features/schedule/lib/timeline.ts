/**
 * The schedule's layout maths, pure: the weeks a timeline shows, where a date falls across it
 * (as a percentage of its width), the rows by unit or by crew member, and the week list's days.
 */
import { addDays, daysBetween, formatMonthDay, type IsoDate } from '../../../../shared/domain/planting-windows';
import { weekStart } from '../../../../shared/domain/tasks';

export interface TimelineRange {
  /** The Monday the first column starts on. */
  start: IsoDate;
  /** The Sunday the last column ends on. */
  end: IsoDate;
  /** Days shown, a multiple of seven. */
  totalDays: number;
  /** The Monday of each column. */
  weeks: IsoDate[];
}

/** Whole ISO weeks (Monday to Sunday) covering `from` to `to`; at least one. */
export function timelineRange(from: IsoDate, to: IsoDate): TimelineRange {
  const start = weekStart(from);
  const lastMonday = weekStart(to < from ? from : to);
  const count = daysBetween(start, lastMonday) / 7 + 1;
  const weeks = Array.from({ length: count }, (_, i) => addDays(start, i * 7));
  return { start, end: addDays(lastMonday, 6), totalDays: count * 7, weeks };
}

/** The default timeline: two weeks back and ten ahead of today's week (twelve columns). */
export function defaultTimelineDates(today: IsoDate): { from: IsoDate; to: IsoDate } {
  const monday = weekStart(today);
  return { from: addDays(monday, -14), to: addDays(monday, 9 * 7 + 6) };
}

/** The left edge of a day across the range, in percent (0 at the range's first day, 100 past its last). */
export function dayOffsetPct(date: IsoDate, range: Pick<TimelineRange, 'start' | 'totalDays'>): number {
  return (daysBetween(range.start, date) / range.totalDays) * 100;
}

export interface SpanBox {
  leftPct: number;
  widthPct: number;
  /** The span goes on before the range's first day. */
  cutStart: boolean;
  /** The span goes on after the range's last day. */
  cutEnd: boolean;
}

/**
 * Where a span of whole days (first to last, both included) sits across the range, clipped to it;
 * null when it lies wholly outside. A one-day span is one day wide.
 */
export function spanBox(first: IsoDate, last: IsoDate, range: Pick<TimelineRange, 'start' | 'totalDays'>): SpanBox | null {
  const [a, b] = last < first ? [last, first] : [first, last];
  const startDay = daysBetween(range.start, a);
  const endDay = daysBetween(range.start, b) + 1;
  if (endDay <= 0 || startDay >= range.totalDays) return null;
  const left = Math.max(0, startDay);
  const right = Math.min(range.totalDays, endDay);
  return { leftPct: (left / range.totalDays) * 100, widthPct: ((right - left) / range.totalDays) * 100, cutStart: startDay < 0, cutEnd: endDay > range.totalDays };
}

/** "Jun 8" for a column's Monday. */
export const weekLabel = (monday: IsoDate): string => formatMonthDay(monday);

/** The fields of a task the layout needs. */
export interface LayoutTask {
  id: number;
  unitId: number | null;
  unitName: string;
  propertyName: string;
  assigneeId: number | null;
  assigneeName: string | null;
  earliest: IsoDate;
  latest: IsoDate;
  startDate: IsoDate | null;
  endDate: IsoDate | null;
  name: string;
}

export type GroupBy = 'unit' | 'crew';

export interface TimelineRow<T extends LayoutTask> {
  key: string;
  label: string;
  /** A second line: the property of a unit. */
  detail: string | null;
  tasks: T[];
}

const byStart = <T extends LayoutTask>(a: T, b: T) => (a.startDate ?? a.earliest).localeCompare(b.startDate ?? b.earliest) || a.name.localeCompare(b.name) || a.id - b.id;

/** The timeline's rows: one per unit (with its property) or per crew member, "Unassigned" last; tasks by date inside. */
export function timelineRows<T extends LayoutTask>(tasks: readonly T[], by: GroupBy): TimelineRow<T>[] {
  const rows = new Map<string, TimelineRow<T>>();
  for (const t of tasks) {
    const key = by === 'unit' ? `unit:${t.unitId ?? `none:${t.propertyName}`}` : t.assigneeId === null ? 'crew:none' : `crew:${t.assigneeId}`;
    let row = rows.get(key);
    if (!row) {
      row =
        by === 'unit'
          ? { key, label: t.unitName, detail: t.propertyName, tasks: [] }
          : { key, label: t.assigneeId === null ? 'Unassigned' : (t.assigneeName ?? 'Someone'), detail: null, tasks: [] };
      rows.set(key, row);
    }
    row.tasks.push(t);
  }
  const list = [...rows.values()];
  for (const row of list) row.tasks.sort(byStart);
  return list.sort((a, b) => {
    if (a.key === 'crew:none') return 1;
    if (b.key === 'crew:none') return -1;
    return a.label.localeCompare(b.label, 'en', { numeric: true }) || (a.detail ?? '').localeCompare(b.detail ?? '');
  });
}

export interface WeekGroup<T> {
  /** A day of the week, or null for the tasks with no date whose window touches the week. */
  date: IsoDate | null;
  tasks: T[];
}

/**
 * The week list: each day Monday to Sunday with the tasks scheduled on it (a task spanning days is
 * listed on its first day in the week), then the unscheduled tasks whose window touches the week.
 * Tasks outside the week are left out.
 */
export function weekGroups<T extends LayoutTask>(tasks: readonly T[], monday: IsoDate): WeekGroup<T>[] {
  const sunday = addDays(monday, 6);
  const days: WeekGroup<T>[] = Array.from({ length: 7 }, (_, i) => ({ date: addDays(monday, i), tasks: [] }));
  const unscheduled: T[] = [];
  for (const t of [...tasks].sort(byStart)) {
    if (t.startDate) {
      const end = t.endDate ?? t.startDate;
      if (end < monday || t.startDate > sunday) continue;
      const first = t.startDate < monday ? monday : t.startDate;
      days[daysBetween(monday, first)].tasks.push(t);
    } else if (t.earliest <= sunday && t.latest >= monday) {
      unscheduled.push(t);
    }
  }
  return [...days, { date: null, tasks: unscheduled }];
}
