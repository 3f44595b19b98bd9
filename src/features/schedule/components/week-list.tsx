import type { TaskDto, TaskListDto } from '../../../../shared/schemas/task';
import { Button } from '../../../components/ui/button';
import { dayCountText, weekGroups } from '../lib/timeline';
import { TaskStatusChip, WarningMarks } from './task-status-chip';
import { datesText, dayHeading, windowText } from './task-text';

function TaskRow({ task, onOpen }: { task: TaskDto; onOpen: (id: number) => void }) {
  return (
    <li>
      <button
        type="button"
        onClick={() => onOpen(task.id)}
        data-task-id={task.id}
        className="grid w-full grid-cols-1 gap-x-4 gap-y-0.5 rounded px-2 py-2 text-left text-sm hover:bg-rule/30 focus-visible:outline focus-visible:outline-2 focus-visible:outline-moss sm:grid-cols-[minmax(0,1.3fr)_minmax(0,1.2fr)_minmax(0,0.8fr)_auto]"
      >
        <span className="min-w-0">
          <span className="block truncate font-semibold text-ink">{task.unitName}</span>
          <span className="block truncate text-xs text-slate">{task.propertyName}</span>
        </span>
        <span className="min-w-0">
          <span className="block truncate text-ink">{task.name}</span>
          <span className="block text-xs text-slate">
            window {windowText(task)}
            {task.startDate && task.endDate && task.endDate !== task.startDate ? ` · ${datesText(task)}` : ''}
          </span>
        </span>
        <span className={`truncate ${task.assigneeName ? 'text-ink' : 'italic text-slate'}`}>{task.assigneeName ?? 'Unassigned'}</span>
        <span className="flex items-center gap-1.5 sm:justify-end">
          <WarningMarks warnings={task.warnings} />
          {task.photos.length > 0 ? (
            <span className="text-xs text-slate">
              {task.photos.length} photo{task.photos.length === 1 ? '' : 's'}
            </span>
          ) : null}
          <TaskStatusChip status={task.status} />
        </span>
      </button>
    </li>
  );
}

/**
 * The week list: each day's tasks, then the week's unscheduled tasks whose window is open. With
 * `dayTotals` (the answer's `groups`, asked with `perDay`) a day that holds more than it shows says
 * so and offers "Show more" (`onShowMore`), so no day looks emptier than it is.
 */
export function WeekList({
  tasks,
  monday,
  today,
  onOpen,
  dayTotals,
  onShowMore,
}: {
  tasks: readonly TaskDto[];
  monday: string;
  today: string;
  onOpen: (id: number) => void;
  dayTotals?: TaskListDto['groups'];
  onShowMore?: () => void;
}) {
  const groups = weekGroups(tasks, monday);
  const totalOf = new Map((dayTotals ?? []).map((g) => [g.date, g.total]));
  return (
    <div className="flex flex-col gap-3">
      {groups.map((g) => {
        const heading = g.date ? dayHeading(g.date) : 'Not scheduled, window open this week';
        const id = `day-${g.date ?? 'unscheduled'}`;
        const total = totalOf.get(g.date) ?? g.tasks.length;
        if (!g.date && total === 0) return null;
        return (
          <section key={id} aria-labelledby={id} className={`rounded-md border bg-card px-3 py-2 ${g.date === today ? 'border-moss' : 'border-rule'}`}>
            <h3 id={id} className="flex items-baseline gap-2 border-b border-rule/70 pb-1 text-sm font-bold">
              {heading}
              {g.date === today ? <span className="text-xs font-semibold text-moss-deep">today</span> : null}
              <span className="ml-auto text-xs font-normal text-slate tabular-nums">{dayCountText(g.tasks.length, total)}</span>
            </h3>
            {g.tasks.length === 0 && total === 0 ? (
              <p className="px-2 py-1.5 text-xs text-slate">Nothing scheduled.</p>
            ) : (
              <ul className="divide-y divide-rule/60">
                {g.tasks.map((t) => (
                  <TaskRow key={t.id} task={t} onOpen={onOpen} />
                ))}
              </ul>
            )}
            {total > g.tasks.length ? (
              <p className="flex flex-wrap items-center gap-2 px-2 pb-1 pt-1.5 text-xs text-slate">
                <span>
                  {total - g.tasks.length} more on this {g.date ? 'day' : 'list'}.
                </span>
                {onShowMore ? (
                  <Button variant="ghost" size="sm" onClick={onShowMore}>
                    Show more
                  </Button>
                ) : (
                  <span>Narrow the filters to see them.</span>
                )}
              </p>
            ) : null}
          </section>
        );
      })}
    </div>
  );
}
