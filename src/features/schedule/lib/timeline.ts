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

/** A day's heading count: "3 tasks", or "3 of 17 tasks" when the answer holds only the first of the day's tasks. */
export function dayCountText(shown: number, total: number): string {
  const all = Math.max(shown, total);
  if (all === 0) return '';
  const noun = `task${all === 1 ? '' : 's'}`;
  return shown < all ? `${shown} of ${all} ${noun}` : `${all} ${noun}`;
}

/** The text a task's bar carries: its step, and in the by-crew view the unit too (a crew member's row holds several units). */
export function laneText(task: Pick<LayoutTask, 'name' | 'unitName'>, by: GroupBy): string {
  return by === 'crew' ? `${task.name} · ${task.unitName}` : task.name;
}

/** Where a bar's label goes: inside the bar when it fits whole, else beside it where there is room. */
export interface LabelPlacement {
  where: 'inside' | 'after' | 'before';
  /** The label's left edge across the lane, in px (for 'before', its right edge sits just left of the bar). */
  leftPx: number;
  /** The room the label may take, in px (it is truncated only when neither side has room for it). */
  maxWidthPx: number;
}

/** The bar's inner padding and the gap between a bar (or its warning mark) and a label beside it, in px. */
export const LABEL_PAD_PX = 6;
export const LABEL_GAP_PX = 6;
/** The narrowest a bar is drawn, in px, so a one-day task can still be seen and clicked. */
export const BAR_MIN_PX = 20;

/**
 * Places a bar's label so that it is always readable, whatever the date range: inside the bar
 * when the whole text fits, otherwise after the bar (and after its warning mark), or before it when
 * the bar sits near the lane's right edge. Never on top of the bar, so nothing covers a letter.
 */
export function barLabelPlacement(input: { barLeftPx: number; barWidthPx: number; labelWidthPx: number; laneWidthPx: number; markWidthPx?: number }): LabelPlacement {
  const width = Math.max(input.barWidthPx, BAR_MIN_PX);
  if (input.labelWidthPx + 2 * LABEL_PAD_PX <= width) return { where: 'inside', leftPx: input.barLeftPx + LABEL_PAD_PX, maxWidthPx: width - 2 * LABEL_PAD_PX };
  const afterLeft = input.barLeftPx + width + (input.markWidthPx ?? 0) + LABEL_GAP_PX;
  const roomAfter = Math.max(0, input.laneWidthPx - afterLeft);
  const roomBefore = Math.max(0, input.barLeftPx - LABEL_GAP_PX);
  if (roomAfter >= input.labelWidthPx || roomAfter >= roomBefore) return { where: 'after', leftPx: afterLeft, maxWidthPx: roomAfter };
  const shown = Math.min(input.labelWidthPx, roomBefore);
  return { where: 'before', leftPx: input.barLeftPx - LABEL_GAP_PX - shown, maxWidthPx: roomBefore };
}

/** The dates a drag would give a task. */
export interface DraggedDates {
  /** Whole days moved, after keeping the task inside its window (0: it stays where it is). */
  days: number;
  startDate: IsoDate;
  endDate: IsoDate;
}

/**
 * A scheduled task moved by whole days, kept inside its window (earliest to latest): the move is
 * cut short at the window's edge, and the task's length never changes. Null for a task with no
 * dates, or one longer than its window (it cannot be moved without leaving it).
 */
export function dragDates(task: Pick<LayoutTask, 'earliest' | 'latest' | 'startDate' | 'endDate'>, days: number): DraggedDates | null {
  if (!task.startDate) return null;
  const end = task.endDate ?? task.startDate;
  const length = daysBetween(task.startDate, end);
  if (daysBetween(task.earliest, task.latest) < length) return null;
  // The furthest the task may go each way while staying in the window (zero when it sits outside it already).
  const maxBack = Math.max(0, daysBetween(task.earliest, task.startDate));
  const maxForward = Math.max(0, daysBetween(end, task.latest));
  const moved = Math.round(Math.max(-maxBack, Math.min(maxForward, days)));
  return { days: moved, startDate: addDays(task.startDate, moved), endDate: addDays(end, moved) };
}

/** Whole days a pointer moved across a lane of `laneWidthPx` showing `totalDays` days (snapped to the nearest day). */
export function pointerDays(dxPx: number, laneWidthPx: number, totalDays: number): number {
  if (laneWidthPx <= 0 || totalDays <= 0) return 0;
  const days = Math.round(dxPx / (laneWidthPx / totalDays));
  return Object.is(days, -0) ? 0 : days;
}

/** The narrowest room a week's label ("Dec 28") needs in the header, in px. */
export const WEEK_LABEL_MIN_PX = 48;

/**
 * The header's week labels at any range: every week when there is room, otherwise every n-th week
 * (n chosen so each label has WEEK_LABEL_MIN_PX), each spanning the weeks up to the next label.
 */
export function weekHeaderCells(weeks: readonly IsoDate[], laneWidthPx: number): { monday: IsoDate; span: number }[] {
  const perWeek = weeks.length > 0 && laneWidthPx > 0 ? laneWidthPx / weeks.length : WEEK_LABEL_MIN_PX;
  const step = Math.max(1, Math.ceil(WEEK_LABEL_MIN_PX / perWeek));
  const cells: { monday: IsoDate; span: number }[] = [];
  for (let i = 0; i < weeks.length; i += step) cells.push({ monday: weeks[i], span: Math.min(step, weeks.length - i) });
  return cells;
}
