import type { TaskStatus, TaskWarning } from '../../../../shared/domain/tasks';
import { TASK_STATUS_CLASSES, TASK_STATUS_LABELS } from '../../../lib/work-status';

/** A task's status as a small chip. */
export function TaskStatusChip({ status, className = '' }: { status: TaskStatus; className?: string }) {
  return (
    <span data-status={status} className={`inline-flex items-center whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold leading-5 ${TASK_STATUS_CLASSES[status]} ${className}`}>
      {status === 'done' ? <span aria-hidden className="mr-1">✓</span> : null}
      {TASK_STATUS_LABELS[status]}
    </span>
  );
}

/** Short names of the schedule's warnings, for icons and headings. */
export const WARNING_LABELS: Record<TaskWarning['code'], string> = {
  'window-missed': 'Window missed',
  'window-closing': 'Window closing soon',
  'outside-window': 'Set outside its window',
  'before-dependency': 'Before the step it depends on',
};

/** One clay mark per warning of a task, each named for screen readers and on hover. */
export function WarningMarks({ warnings }: { warnings: readonly TaskWarning[] }) {
  if (warnings.length === 0) return null;
  return (
    <span className="inline-flex items-center gap-0.5">
      {warnings.map((w, i) => (
        <span
          key={`${w.code}-${i}`}
          role="img"
          aria-label={WARNING_LABELS[w.code]}
          title={w.message}
          data-warning={w.code}
          className={`inline-flex size-5 items-center justify-center rounded-full text-xs font-bold ${w.code === 'window-closing' ? 'bg-ochre text-ink' : 'bg-clay text-white'}`}
        >
          !
        </span>
      ))}
    </span>
  );
}
