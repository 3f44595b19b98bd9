/** Words the field sheet uses for a task's state and dates. */
import type { TaskDto } from '../../../../shared/schemas/task';
import type { FieldBucket } from '../../../../shared/domain/tasks';
import { formatDateRange } from '../../../lib/quantity-format';
import { firmToday } from '../../../lib/firm-clock';

export type FieldStatus = 'waiting-to-send' | TaskDto['status'];

/** The state the crew sees: a completion still on the phone counts as done, waiting to send. */
export function fieldStatus(task: Pick<TaskDto, 'status'>, waitingToSend: boolean): FieldStatus {
  return waitingToSend && task.status !== 'done' ? 'waiting-to-send' : task.status;
}

export const FIELD_STATUS_LABELS: Record<FieldStatus, string> = {
  planned: 'Not dated yet',
  scheduled: 'Scheduled',
  done: 'Done',
  skipped: 'Skipped',
  'waiting-to-send': 'Done (waiting to send)',
};

/** "Set for Jun 14, 2026" or "Set for Jun 14 – Jun 16, 2026"; null when the task has no date. */
export function plannedDates(task: Pick<TaskDto, 'startDate' | 'endDate'>): string | null {
  if (!task.startDate) return null;
  return `Set for ${formatDateRange(task.startDate, task.endDate ?? task.startDate)}`;
}

/** "Window Jul 13 – Aug 20, 2026". */
export const windowText = (task: Pick<TaskDto, 'earliest' | 'latest'>): string => `Window ${formatDateRange(task.earliest, task.latest)}`;

export const BUCKETS: { bucket: Exclude<FieldBucket, 'finished'>; title: string; empty: string }[] = [
  { bucket: 'overdue', title: 'Overdue', empty: 'Nothing overdue.' },
  { bucket: 'this-week', title: 'This week', empty: 'Nothing set for this week.' },
  { bucket: 'upcoming', title: 'Coming up', empty: 'Nothing later on your list yet.' },
];

/** Today as YYYY-MM-DD in the firm's time zone (the day the firm — and the server — is living). */
export function localToday(now: Date = new Date()): string {
  return firmToday(now);
}
