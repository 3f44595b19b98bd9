/** The schedule page's state in the address: view, grouping, week, filters and the open task. Pure. */
import { TASK_STATUSES, weekStart, type TaskStatus } from '../../../../shared/domain/tasks';
import { addDays, parseIsoDate, type IsoDate } from '../../../../shared/domain/planting-windows';
import type { TaskListQuery } from '../../../../shared/schemas/task';
import { defaultTimelineDates, type GroupBy } from './timeline';
import { firmToday } from '../../../lib/firm-clock';

export type ScheduleView = 'week' | 'timeline';

export interface ScheduleParams {
  view: ScheduleView;
  by: GroupBy;
  /** The Monday of the week list's week. */
  week: IsoDate;
  propertyId: number | null;
  /** A user id, 'none' for unassigned tasks, or null for everyone. */
  assignee: number | 'none' | null;
  status: TaskStatus | null;
  /** The timeline's first and last day. */
  from: IsoDate;
  to: IsoDate;
  /** The task open in the panel. */
  task: number | null;
}

const isDate = (v: string | null): v is IsoDate => {
  if (!v) return false;
  try {
    parseIsoDate(v);
    return true;
  } catch {
    return false;
  }
};
const positiveId = (v: string | null): number | null => (v && /^\d{1,12}$/.test(v) && Number(v) > 0 ? Number(v) : null);

/** Reads the address; a value that does not parse falls back to its default rather than failing the page. */
export function readScheduleParams(search: URLSearchParams, today: IsoDate): ScheduleParams {
  const defaults = defaultTimelineDates(today);
  const from = isDate(search.get('from')) ? (search.get('from') as IsoDate) : defaults.from;
  let to = isDate(search.get('to')) ? (search.get('to') as IsoDate) : defaults.to;
  if (to < from) to = addDays(from, 7 * 12 - 1);
  const status = search.get('status');
  const assignee = search.get('assignee');
  return {
    view: search.get('view') === 'timeline' ? 'timeline' : 'week',
    by: search.get('by') === 'crew' ? 'crew' : 'unit',
    week: weekStart(isDate(search.get('week')) ? (search.get('week') as IsoDate) : today),
    propertyId: positiveId(search.get('property')),
    assignee: assignee === 'none' ? 'none' : positiveId(assignee),
    status: TASK_STATUSES.includes(status as TaskStatus) ? (status as TaskStatus) : null,
    from,
    to,
    task: positiveId(search.get('task')),
  };
}

/** The address's search part for a change to the state, leaving defaults out so that links stay short. */
export function writeScheduleParams(current: URLSearchParams, change: Partial<Record<'view' | 'by' | 'week' | 'property' | 'assignee' | 'status' | 'from' | 'to' | 'task', string | number | null>>): URLSearchParams {
  const next = new URLSearchParams(current);
  for (const [k, v] of Object.entries(change)) {
    if (v === null || v === undefined || v === '') next.delete(k);
    else next.set(k, String(v));
  }
  return next;
}

/** The API filter for the current view: the week's seven days, or the timeline's range. */
export function taskQueryFor(params: ScheduleParams): TaskListQuery {
  const range = params.view === 'week' ? { from: params.week, to: addDays(params.week, 6) } : { from: params.from, to: params.to };
  return {
    ...(params.propertyId ? { propertyId: params.propertyId } : {}),
    ...(params.assignee !== null ? { assigneeId: params.assignee } : {}),
    ...(params.status ? { status: params.status } : {}),
    ...range,
  };
}

/** Today's date in the firm's time zone (the server counts it the same way). */
export const todayUtc = (): IsoDate => firmToday();
