import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { addDays, formatMonthDay } from '../../../../shared/domain/planting-windows';
import { TASK_STATUSES, weekStart } from '../../../../shared/domain/tasks';
import { TASK_PAGE, TaskUpdateSchema, weekLimit, weekPerDay, WEEK_PAGE, type TaskDto } from '../../../../shared/schemas/task';
import { useUpdateTask } from '../../../features/schedule/api/update-task';
import { useAssignTasks } from '../../../features/schedule/api/assign-tasks';
import { datesText } from '../../../features/schedule/components/task-text';
import type { DraggedDates } from '../../../features/schedule/lib/timeline';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { LIST_PAGE } from '../../../../shared/schemas/common';
import { useTasks } from '../../../features/schedule/api/get-tasks';
import { useProperties } from '../../../features/properties/api/get-properties';
import { useTeam } from '../../../features/team/api/team';
import { WeekList } from '../../../features/schedule/components/week-list';
import { TimelineView } from '../../../features/schedule/components/timeline-view';
import { WarningsPanel } from '../../../features/schedule/components/warnings-panel';
import { TaskPanel, type Assignable } from '../../../features/schedule/components/task-panel';
import { readScheduleParams, taskQueryFor, todayUtc, writeScheduleParams, type ScheduleParams } from '../../../features/schedule/lib/schedule-params';
import { PageHeader } from '../../../components/ui/page-header';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { TASK_STATUS_LABELS } from '../../../lib/work-status';

type Change = Parameters<typeof writeScheduleParams>[1];

function Segmented<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: { value: T; label: string }[]; onChange: (v: T) => void }) {
  return (
    <div role="group" aria-label={label} className="inline-flex rounded border border-rule bg-card p-0.5">
      {options.map((o) => (
        <button
          key={o.value}
          type="button"
          aria-pressed={value === o.value}
          onClick={() => onChange(o.value)}
          className={`rounded px-3 py-1 text-sm font-semibold ${value === o.value ? 'bg-moss text-white' : 'text-ink hover:bg-rule/40'}`}
        >
          {o.label}
        </button>
      ))}
    </div>
  );
}

function Filters({ params, onChange, people, properties }: { params: ScheduleParams; onChange: (c: Change) => void; people: readonly Assignable[]; properties: readonly { id: number; name: string }[] }) {
  return (
    <div className="grid grid-cols-1 gap-3 min-[480px]:grid-cols-2 lg:grid-cols-4">
      <SelectField label="Property" value={params.propertyId ?? ''} onChange={(e) => onChange({ property: e.target.value || null })}>
        <option value="">All properties</option>
        {properties.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Crew member" value={params.assignee ?? ''} onChange={(e) => onChange({ assignee: e.target.value || null })}>
        <option value="">Everyone</option>
        <option value="none">Unassigned</option>
        {people.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Status" value={params.status ?? ''} onChange={(e) => onChange({ status: e.target.value || null })}>
        <option value="">Any status</option>
        {TASK_STATUSES.map((s) => (
          <option key={s} value={s}>
            {TASK_STATUS_LABELS[s]}
          </option>
        ))}
      </SelectField>
      {params.view === 'timeline' ? (
        <div className="grid grid-cols-2 gap-2">
          <TextField label="From" type="date" value={params.from} onChange={(e) => e.target.value && onChange({ from: e.target.value })} />
          <TextField label="To" type="date" value={params.to} onChange={(e) => e.target.value && onChange({ to: e.target.value })} />
        </div>
      ) : null}
    </div>
  );
}

/** The consultant's schedule: a week list and a timeline of the firm's tasks, filters in the address, a panel to assign and move a task. */
export function SchedulePage() {
  const [search, setSearch] = useSearchParams();
  const today = todayUtc();
  const params = readScheduleParams(search, today);
  // Query keys compare by value, so a fresh object each render asks for nothing new.
  const filter = taskQueryFor(params);
  // The list is paged: "Show more" asks for a longer page; a new filter starts again at one page.
  const filterKey = JSON.stringify(filter);
  const [more, setMore] = useState<{ key: string; pages: number }>({ key: filterKey, pages: 1 });
  const pages = more.key === filterKey ? more.pages : 1;
  // The week list asks for a few tasks of each day (about one screen for the week) with every day's
  // total; "Show more" raises that. The timeline asks for pages of its own, longer size.
  const perDay = params.view === 'week' ? weekPerDay(pages) : undefined;
  const query = perDay !== undefined ? { ...filter, perDay, limit: weekLimit(perDay) } : { ...filter, limit: Math.min(LIST_PAGE.maxLimit, pages * TASK_PAGE.timelineLimit) };
  const tasks = useTasks(query);
  const team = useTeam();
  const properties = useProperties();
  const people = useMemo<Assignable[]>(
    () => (team.data ?? []).filter((m) => m.status === 'active' && (m.role === 'crew' || m.role === 'consultant' || m.role === 'owner')).map((m) => ({ id: m.id, name: m.name, role: m.role })),
    [team.data],
  );
  const update = useUpdateTask();
  const assign = useAssignTasks();
  const toast = useToast();
  const failure = (e: unknown, what: string) => (e instanceof ApiError ? e.message : `${what} Check your connection and try again.`);
  // A dragged bar: the same schema as the panel's form, then the same route (the server's checks apply).
  const move = (task: TaskDto, dates: DraggedDates) => {
    const parsed = TaskUpdateSchema.safeParse({ startDate: dates.startDate, endDate: dates.endDate });
    if (!parsed.success) {
      toast('error', `${task.name} was not moved: ${parsed.error.issues[0]?.message ?? 'the dates are not valid'}.`);
      return;
    }
    update.mutate(
      { taskId: task.id, input: parsed.data },
      {
        onSuccess: (saved) => toast('success', `${saved.name} on ${saved.unitName} moved to ${datesText(saved)}.`),
        onError: (e) => toast('error', `${task.name} was not moved: ${failure(e, 'The new dates were not saved.')}`),
      },
    );
  };
  const assignSelected = (taskIds: number[], assigneeId: number | null) =>
    assign.mutateAsync({ taskIds, assigneeId }).then(
      (saved) => {
        const who = assigneeId === null ? 'nobody' : (people.find((p) => p.id === assigneeId)?.name ?? 'the crew member');
        toast('success', `${saved.length} ${saved.length === 1 ? 'task' : 'tasks'} assigned to ${who}.`);
        return true;
      },
      (e: unknown) => {
        toast('error', `Nothing was assigned: ${failure(e, 'The tasks were not saved.')}`);
        return false;
      },
    );
  const change = (c: Change, replace = false) => setSearch((cur) => writeScheduleParams(cur, c), { replace });
  const open = (taskId: number) => change({ task: taskId });
  const list = tasks.data?.tasks ?? [];
  const showMore = () => setMore({ key: filterKey, pages: pages + 1 });
  const sunday = addDays(params.week, 6);
  const thisWeek = weekStart(today);

  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Schedule">Assign crew, move dates inside each step’s window, and see what is done.</PageHeader>
      <div className="flex flex-wrap items-center gap-3">
        <Segmented
          label="View"
          value={params.view}
          options={[
            { value: 'week', label: 'Week list' },
            { value: 'timeline', label: 'Timeline' },
          ]}
          onChange={(v) => change({ view: v === 'week' ? null : v })}
        />
        {params.view === 'timeline' ? (
          <Segmented
            label="Rows"
            value={params.by}
            options={[
              { value: 'unit', label: 'By unit' },
              { value: 'crew', label: 'By crew member' },
            ]}
            onChange={(v) => change({ by: v === 'unit' ? null : v })}
          />
        ) : (
          <div className="flex flex-wrap items-center gap-2">
            <Button variant="secondary" size="sm" onClick={() => change({ week: addDays(params.week, -7) })} aria-label="Previous week">
              ← Previous
            </Button>
            <Button variant="secondary" size="sm" onClick={() => change({ week: null })} disabled={params.week === thisWeek}>
              This week
            </Button>
            <Button variant="secondary" size="sm" onClick={() => change({ week: addDays(params.week, 7) })} aria-label="Next week">
              Next →
            </Button>
            <h2 className="text-base font-bold tabular-nums" aria-live="polite">
              Week of {formatMonthDay(params.week)} – {formatMonthDay(sunday)}, {sunday.slice(0, 4)}
            </h2>
          </div>
        )}
        {params.view === 'timeline' && (search.get('from') || search.get('to')) ? (
          <Button variant="ghost" size="sm" onClick={() => change({ from: null, to: null })}>
            Back to the usual twelve weeks
          </Button>
        ) : null}
      </div>
      <Filters params={params} onChange={change} people={people} properties={properties.data ?? []} />
      <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0" aria-busy={tasks.isFetching || undefined}>
          {tasks.data?.page && tasks.data.page.total > list.length ? (
            <p className="mb-2 flex flex-wrap items-center gap-3 text-sm text-slate" role="status">
              <span className="tabular-nums">
                Showing {list.length.toLocaleString('en-US')} of {tasks.data.page.total.toLocaleString('en-US')} tasks
              </span>
              {perDay !== undefined ? (
                perDay < WEEK_PAGE.max ? (
                  <Button variant="secondary" size="sm" onClick={showMore}>
                    Show more
                  </Button>
                ) : (
                  <span>Narrow the filters to see the rest.</span>
                )
              ) : query.limit < LIST_PAGE.maxLimit ? (
                <Button variant="secondary" size="sm" onClick={showMore}>
                  Show more
                </Button>
              ) : (
                <span>Narrow the dates or filters to see the rest.</span>
              )}
            </p>
          ) : null}
          {tasks.isPending ? (
            <Loading label="Loading the schedule…" />
          ) : tasks.isError ? (
            <ErrorPanel error={tasks.error} onRetry={() => void tasks.refetch()} />
          ) : list.length === 0 && params.view === 'week' ? (
            <EmptyState title="No tasks this week">
              Tasks appear when a landowner approves a proposal. Try another week, the timeline, or clear a filter.
            </EmptyState>
          ) : params.view === 'week' ? (
            <WeekList tasks={list} monday={params.week} today={today} onOpen={open} dayTotals={tasks.data?.groups} onShowMore={perDay !== undefined && perDay < WEEK_PAGE.max ? showMore : undefined} />
          ) : (
            <TimelineView tasks={list} from={params.from} to={params.to} by={params.by} today={today} people={people} assigning={assign.isPending} onOpen={open} onMove={move} onAssign={assignSelected} />
          )}
        </div>
        {tasks.data ? <WarningsPanel warnings={tasks.data.warnings} onOpen={open} /> : null}
      </div>
      <TaskPanel
        taskId={params.task}
        fallback={list.find((t) => t.id === params.task)}
        people={people}
        onClose={() => change({ task: null })}
        onShowWeek={(date) => change({ view: null, week: weekStart(date), task: null })}
      />
    </div>
  );
}
