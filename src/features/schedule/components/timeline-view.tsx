import type { TaskDto } from '../../../../shared/schemas/task';
import { dayOffsetPct, spanBox, timelineRange, timelineRows, weekLabel, type GroupBy } from '../lib/timeline';
import { WarningMarks } from './task-status-chip';
import { datesText, windowText } from './task-text';

const BAR: Record<TaskDto['status'], string> = {
  planned: 'bg-slate/70',
  scheduled: 'bg-sky',
  done: 'bg-moss',
  skipped: 'bg-slate/40',
};

function TaskLane({ task, range, onOpen }: { task: TaskDto; range: ReturnType<typeof timelineRange>; onOpen: (id: number) => void }) {
  const band = spanBox(task.earliest, task.latest, range);
  const bar = task.startDate ? spanBox(task.startDate, task.endDate ?? task.startDate, range) : null;
  // Only a moment while a new range loads can a task lie wholly outside the weeks shown.
  if (!band && !bar) return null;
  const label = `${task.name} on ${task.unitName}: window ${windowText(task)}, ${task.startDate ? `set for ${datesText(task)}` : 'not scheduled'}, ${task.assigneeName ?? 'unassigned'}, ${task.status}`;
  return (
    <div className="relative h-7">
      {band ? (
        <div
          aria-hidden
          className={`absolute inset-y-1 rounded-sm border border-dashed ${task.warnings.some((w) => w.code === 'window-missed') ? 'border-clay/60 bg-clay/10' : 'border-moss/40 bg-moss/10'}`}
          style={{ left: `${band.leftPct}%`, width: `${band.widthPct}%` }}
        />
      ) : null}
      <button
        type="button"
        onClick={() => onOpen(task.id)}
        data-task-id={task.id}
        aria-label={label}
        title={label}
        className={`absolute inset-y-0.5 flex min-w-5 items-center gap-1 overflow-hidden rounded px-1 text-left text-[11px] font-semibold leading-none focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink ${
          bar ? `${BAR[task.status]} text-white shadow-sm` : 'bg-transparent text-ink hover:bg-rule/40'
        }`}
        style={bar ? { left: `${bar.leftPct}%`, width: `max(${bar.widthPct}%, 1.25rem)` } : { left: `${band?.leftPct ?? 0}%`, width: `${band?.widthPct ?? 100}%` }}
      >
        {task.status === 'done' ? <span aria-hidden>✓</span> : null}
        <span className="truncate">{task.name}</span>
      </button>
      {bar && bar.widthPct < 10 && bar.leftPct + bar.widthPct < 80 ? (
        <span aria-hidden className="pointer-events-none absolute top-1.5 truncate text-[11px] text-ink" style={{ left: `calc(${bar.leftPct + bar.widthPct}% + ${task.warnings.length > 0 ? 1.75 : 0.35}rem)`, maxWidth: '12rem' }}>
          {task.name}
        </span>
      ) : null}
      {task.warnings.length > 0 && bar ? (
        <span className="pointer-events-none absolute top-1" style={{ left: `calc(${Math.min(bar.leftPct + bar.widthPct, 97)}% + 2px)` }}>
          <WarningMarks warnings={task.warnings.slice(0, 1)} />
        </span>
      ) : null}
    </div>
  );
}

/**
 * A Gantt-like grid over whole weeks: each task's window as a pale band, its scheduled days as a
 * solid bar on top (done ones in moss with a check), rows by unit or crew member, and a line at today.
 */
export function TimelineView({ tasks, from, to, by, today, onOpen }: { tasks: readonly TaskDto[]; from: string; to: string; by: GroupBy; today: string; onOpen: (id: number) => void }) {
  const range = timelineRange(from, to);
  const rows = timelineRows(tasks, by);
  const todayPct = today >= range.start && today <= range.end ? dayOffsetPct(today, range) + 50 / range.totalDays : null;
  return (
    <div className="overflow-x-auto rounded-md border border-rule bg-card" role="region" aria-label={`Timeline by ${by === 'unit' ? 'unit' : 'crew member'}`} tabIndex={0}>
      <div className="min-w-[48rem]">
        <div className="sticky top-0 z-10 grid grid-cols-[11rem_minmax(0,1fr)] border-b border-rule bg-card text-xs text-slate">
          <div className="px-3 py-2 font-semibold uppercase tracking-wide">{by === 'unit' ? 'Unit' : 'Crew member'}</div>
          <div className="relative grid" style={{ gridTemplateColumns: `repeat(${range.weeks.length}, minmax(0, 1fr))` }}>
            {range.weeks.map((w) => (
              <div key={w} className="border-l border-rule/70 px-1 py-2 tabular-nums">
                {weekLabel(w)}
              </div>
            ))}
          </div>
        </div>
        {rows.length === 0 ? <p className="px-3 py-6 text-center text-sm text-slate">No tasks in these weeks. Widen the dates or clear a filter.</p> : null}
        {rows.map((row) => (
          <div key={row.key} role="group" aria-label={row.detail ? `${row.label}, ${row.detail}` : row.label} className="grid grid-cols-[11rem_minmax(0,1fr)] border-b border-rule/60 last:border-0">
            <div className="min-w-0 px-3 py-1.5 text-sm">
              <p className={`truncate font-semibold ${row.key === 'crew:none' ? 'italic text-slate' : 'text-ink'}`}>{row.label}</p>
              {row.detail ? <p className="truncate text-xs text-slate">{row.detail}</p> : null}
            </div>
            <div className="relative py-1">
              <div aria-hidden className="absolute inset-0 grid" style={{ gridTemplateColumns: `repeat(${range.weeks.length}, minmax(0, 1fr))` }}>
                {range.weeks.map((w) => (
                  <div key={w} className="border-l border-rule/50" />
                ))}
              </div>
              {todayPct !== null ? <div aria-hidden className="absolute inset-y-0 w-0.5 bg-clay/70" style={{ left: `${todayPct}%` }} /> : null}
              <div className="relative flex flex-col">
                {row.tasks.map((t) => (
                  <TaskLane key={t.id} task={t} range={range} onOpen={onOpen} />
                ))}
              </div>
            </div>
          </div>
        ))}
      </div>
      <ul aria-label="Timeline key" className="flex flex-wrap gap-x-4 gap-y-1 border-t border-rule px-3 py-2 text-xs text-slate">
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-6 rounded-sm border border-dashed border-moss/40 bg-moss/10" /> Window
        </li>
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-6 rounded-sm bg-slate/70" /> Planned
        </li>
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-6 rounded-sm bg-sky" /> Scheduled
        </li>
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-6 rounded-sm bg-moss" /> Done
        </li>
        <li className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-3 w-0.5 bg-clay/70" /> Today
        </li>
      </ul>
    </div>
  );
}
