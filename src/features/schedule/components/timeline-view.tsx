import { useEffect, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import type { TaskDto } from '../../../../shared/schemas/task';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { barLabelPlacement, dayOffsetPct, dragDates, laneText, pointerDays, spanBox, timelineRange, timelineRows, weekHeaderCells, weekLabel, BAR_MIN_PX, type DraggedDates, type GroupBy } from '../lib/timeline';
import { WarningMarks } from './task-status-chip';
import { datesText, windowText } from './task-text';
import type { Assignable } from './task-panel';

const BAR: Record<TaskDto['status'], string> = {
  planned: 'bg-slate/70',
  scheduled: 'bg-sky',
  done: 'bg-moss',
  skipped: 'bg-slate/40',
};
/** The warning mark's width plus its margin, in px (size-5 and 2 px). */
const MARK_PX = 22;
/** A pointer that moves less than this is a click, not a drag. */
const DRAG_THRESHOLD_PX = 4;
const LABEL_FONT = '600 11px "Source Sans 3", system-ui, sans-serif';

let measureContext: CanvasRenderingContext2D | null | undefined;
/** The width of a label in the bar's font, in px (an estimate where no canvas is available). */
function textWidthPx(text: string): number {
  if (measureContext === undefined) measureContext = typeof document === 'undefined' ? null : document.createElement('canvas').getContext('2d');
  if (!measureContext) return text.length * 6;
  measureContext.font = LABEL_FONT;
  return Math.ceil(measureContext.measureText(text).width);
}

/** An element's width in px, kept up to date as the page resizes. */
function useWidth<T extends HTMLElement>(): [React.RefObject<T | null>, number] {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(el.getBoundingClientRect().width);
    const observer = new ResizeObserver((entries) => setWidth(entries[0]?.contentRect.width ?? 0));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}

const movable = (task: TaskDto) => task.startDate !== null && task.status !== 'done' && task.status !== 'skipped';

interface LaneProps {
  task: TaskDto;
  by: GroupBy;
  range: ReturnType<typeof timelineRange>;
  laneWidthPx: number;
  selected: boolean;
  onSelect: (id: number, on: boolean) => void;
  onOpen: (id: number) => void;
  onMove: (task: TaskDto, dates: DraggedDates) => void;
}

function TaskLane({ task, by, range, laneWidthPx, selected, onSelect, onOpen, onMove }: LaneProps) {
  const [drag, setDrag] = useState<{ startX: number; days: number } | null>(null);
  const dragged = useRef(false);
  const band = spanBox(task.earliest, task.latest, range);
  const preview = drag ? dragDates(task, drag.days) : null;
  const start = preview?.startDate ?? task.startDate;
  const end = preview?.endDate ?? task.endDate ?? task.startDate;
  const bar = start ? spanBox(start, end ?? start, range) : null;
  // Only a moment while a new range loads can a task lie wholly outside the weeks shown.
  if (!band && !bar) return null;
  const text = laneText(task, by);
  const label = `${text}: window ${windowText(task)}, ${task.startDate ? `set for ${datesText(task)}` : 'not scheduled'}, ${task.assigneeName ?? 'unassigned'}, ${task.status}`;
  const canMove = movable(task);
  const box = bar ?? band!;
  const barLeftPx = (box.leftPct / 100) * laneWidthPx;
  const barWidthPx = Math.max((box.widthPct / 100) * laneWidthPx, BAR_MIN_PX);
  const hasMark = task.warnings.length > 0 && bar !== null;
  // An unscheduled task's button is its window band; its label is placed the same way as a bar's.
  const place = barLabelPlacement({ barLeftPx, barWidthPx, labelWidthPx: textWidthPx(text) + (task.status === 'done' ? 12 : 0), laneWidthPx, markWidthPx: hasMark ? MARK_PX : 0 });
  const inside = laneWidthPx === 0 || place.where === 'inside';

  const onPointerDown = (e: PointerEvent<HTMLButtonElement>) => {
    dragged.current = false;
    if (!canMove || e.button !== 0) return;
    e.currentTarget.setPointerCapture?.(e.pointerId);
    setDrag({ startX: e.clientX, days: 0 });
  };
  const onPointerMove = (e: PointerEvent<HTMLButtonElement>) => {
    if (!drag) return;
    const dx = e.clientX - drag.startX;
    if (Math.abs(dx) >= DRAG_THRESHOLD_PX) dragged.current = true;
    const days = pointerDays(dx, laneWidthPx, range.totalDays);
    if (days !== drag.days) setDrag({ ...drag, days });
  };
  const onPointerUp = () => {
    if (!drag) return;
    const moved = dragDates(task, drag.days);
    setDrag(null);
    if (dragged.current && moved && moved.days !== 0) onMove(task, moved);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLButtonElement>) => {
    // Alt + ← / → moves a scheduled task a day, for those who do not drag.
    if (!canMove || !e.altKey || (e.key !== 'ArrowLeft' && e.key !== 'ArrowRight')) return;
    e.preventDefault();
    const moved = dragDates(task, e.key === 'ArrowLeft' ? -1 : 1);
    if (moved && moved.days !== 0) onMove(task, moved);
  };

  return (
    <div className="relative h-7">
      {!['done', 'skipped'].includes(task.status) ? (
        <input
          type="checkbox"
          aria-label={`Select ${text}`}
          checked={selected}
          onChange={(e) => onSelect(task.id, e.target.checked)}
          className="absolute top-1.5 size-4 accent-moss"
          style={{ left: '-1.6rem' }}
        />
      ) : null}
      {band ? (
        <div
          aria-hidden
          className={`absolute inset-y-1 rounded-sm border border-dashed ${task.warnings.some((w) => w.code === 'window-missed') ? 'border-clay/60 bg-clay/10' : 'border-moss/40 bg-moss/10'}`}
          style={{ left: `${band.leftPct}%`, width: `${band.widthPct}%` }}
        />
      ) : null}
      <button
        type="button"
        onClick={() => {
          if (dragged.current) {
            dragged.current = false;
            return;
          }
          onOpen(task.id);
        }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerCancel={() => setDrag(null)}
        onKeyDown={onKeyDown}
        data-task-id={task.id}
        data-dragging={drag ? 'true' : undefined}
        aria-label={label}
        aria-keyshortcuts={canMove ? 'Alt+ArrowLeft Alt+ArrowRight' : undefined}
        title={canMove ? `${label}. Drag, or Alt + arrow keys, to move it inside its window.` : label}
        className={`absolute inset-y-0.5 flex items-center gap-1 overflow-hidden rounded text-left text-[11px] font-semibold leading-none focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-ink ${
          bar ? `${BAR[task.status]} text-white shadow-sm ${inside ? 'px-1.5' : 'justify-center px-0'}` : `bg-transparent text-ink hover:bg-rule/40 ${inside ? 'px-1.5' : 'px-0'}`
        } ${canMove ? 'cursor-grab touch-none active:cursor-grabbing' : ''} ${drag ? 'ring-2 ring-ink/60' : ''}`}
        style={{ left: `${box.leftPct}%`, width: `max(${box.widthPct}%, ${BAR_MIN_PX}px)` }}
      >
        {task.status === 'done' ? <span aria-hidden>✓</span> : null}
        {inside ? <span className="whitespace-nowrap">{text}</span> : null}
      </button>
      {!inside ? (
        <span
          aria-hidden
          data-bar-label={place.where}
          className="pointer-events-none absolute top-1.5 truncate whitespace-nowrap text-[11px] font-semibold text-ink"
          style={{ left: `${place.leftPx}px`, maxWidth: `${place.maxWidthPx}px`, textAlign: place.where === 'before' ? 'right' : 'left' }}
        >
          {text}
        </span>
      ) : null}
      {hasMark ? (
        <span className="pointer-events-none absolute top-1" style={{ left: `${barLeftPx + barWidthPx + 2}px` }}>
          <WarningMarks warnings={task.warnings.slice(0, 1)} />
        </span>
      ) : null}
      {preview && preview.days !== 0 ? (
        <span role="status" className="pointer-events-none absolute -top-5 z-20 whitespace-nowrap rounded bg-ink px-1.5 py-0.5 text-[11px] text-white" style={{ left: `${barLeftPx}px` }}>
          {datesText({ startDate: preview.startDate, endDate: preview.endDate } as TaskDto)}
        </span>
      ) : null}
    </div>
  );
}

/** The bar above the timeline while tasks are selected: assign them all to one person at once. */
function SelectionBar({ count, people, busy, onAssign, onClear }: { count: number; people: readonly Assignable[]; busy: boolean; onAssign: (assigneeId: number | null) => void; onClear: () => void }) {
  const [who, setWho] = useState('');
  return (
    <div role="region" aria-label="Selected tasks" className="flex flex-wrap items-end gap-3 border-b border-rule bg-moss/5 px-3 py-2">
      <p className="self-center text-sm font-semibold">
        {count} {count === 1 ? 'task' : 'tasks'} selected
      </p>
      <SelectField label="Assign to" value={who} onChange={(e) => setWho(e.target.value)} className="min-w-[12rem]">
        <option value="">Pick someone…</option>
        <option value="none">Nobody (unassigned)</option>
        {people.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </SelectField>
      <Button size="sm" disabled={who === ''} busy={busy} onClick={() => onAssign(who === 'none' ? null : Number(who))}>
        Assign selected
      </Button>
      <Button size="sm" variant="ghost" onClick={onClear}>
        Clear selection
      </Button>
    </div>
  );
}

/**
 * A Gantt-like grid over whole weeks: each task's window as a pale band, its scheduled days as a
 * solid bar on top (done ones in moss with a check), rows by unit or crew member, and a line at today.
 * A scheduled bar drags (or Alt + arrows) to new days inside its window; ticked tasks can be
 * assigned together.
 */
export function TimelineView({
  tasks,
  from,
  to,
  by,
  today,
  people = [],
  assigning = false,
  onOpen,
  onMove,
  onAssign,
}: {
  tasks: readonly TaskDto[];
  from: string;
  to: string;
  by: GroupBy;
  today: string;
  people?: readonly Assignable[];
  assigning?: boolean;
  onOpen: (id: number) => void;
  onMove?: (task: TaskDto, dates: DraggedDates) => void;
  /** Assigns the tasks; resolves true when they were saved (the selection is then cleared). */
  onAssign?: (taskIds: number[], assigneeId: number | null) => Promise<boolean>;
}) {
  const range = timelineRange(from, to);
  const rows = timelineRows(tasks, by);
  const todayPct = today >= range.start && today <= range.end ? dayOffsetPct(today, range) + 50 / range.totalDays : null;
  const [lanesRef, laneWidthPx] = useWidth<HTMLDivElement>();
  const [selected, setSelected] = useState<ReadonlySet<number>>(new Set());
  // Tasks that left the list (a filter changed) leave the selection too.
  const visible = new Set(tasks.map((t) => t.id));
  const chosen = [...selected].filter((id) => visible.has(id));
  const select = (id: number, on: boolean) =>
    setSelected((cur) => {
      const next = new Set(cur);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });
  return (
    <div className="overflow-x-auto rounded-md border border-rule bg-card" role="region" aria-label={`Timeline by ${by === 'unit' ? 'unit' : 'crew member'}`} tabIndex={0}>
      {chosen.length > 0 && onAssign ? (
        <SelectionBar
          count={chosen.length}
          people={people}
          busy={assigning}
          onAssign={(assigneeId) => void onAssign(chosen, assigneeId).then((ok) => ok && setSelected(new Set()))}
          onClear={() => setSelected(new Set())}
        />
      ) : null}
      <div className="min-w-[48rem]">
        <div className="sticky top-0 z-10 grid grid-cols-[11rem_minmax(0,1fr)] border-b border-rule bg-card text-xs text-slate">
          <div className="px-3 py-2 font-semibold uppercase tracking-wide">{by === 'unit' ? 'Unit' : 'Crew member'}</div>
          <div ref={lanesRef} className="relative grid" style={{ gridTemplateColumns: `repeat(${range.weeks.length}, minmax(0, 1fr))` }}>
            {weekHeaderCells(range.weeks, laneWidthPx).map((c) => (
              <div key={c.monday} className="whitespace-nowrap border-l border-rule/70 px-1 py-2 tabular-nums" style={{ gridColumn: `span ${c.span}` }}>
                {weekLabel(c.monday)}
              </div>
            ))}
          </div>
        </div>
        {rows.length === 0 ? <p className="px-3 py-6 text-center text-sm text-slate">No tasks in these weeks. Widen the dates or clear a filter.</p> : null}
        {rows.map((row) => (
          <div key={row.key} role="group" aria-label={row.detail ? `${row.label}, ${row.detail}` : row.label} className="grid grid-cols-[11rem_minmax(0,1fr)] border-b border-rule/60 last:border-0">
            <div className="min-w-0 py-1.5 pl-3 pr-8 text-sm">
              <p className={`break-words font-semibold leading-snug ${row.key === 'crew:none' ? 'italic text-slate' : 'text-ink'}`}>{row.label}</p>
              {row.detail ? <p className="break-words text-xs text-slate">{row.detail}</p> : null}
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
                  <TaskLane key={t.id} task={t} by={by} range={range} laneWidthPx={laneWidthPx} selected={selected.has(t.id)} onSelect={select} onOpen={onOpen} onMove={onMove ?? (() => undefined)} />
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
        <li>Drag a scheduled bar (or Alt + ← →) to move it inside its window; tick tasks to assign them together.</li>
      </ul>
    </div>
  );
}
