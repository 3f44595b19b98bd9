import { useEffect, useId, useRef, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { TaskUpdateSchema, type TaskDto } from '../../../../shared/schemas/task';
import { formatCents } from '../../../../shared/domain/money';
import { formatMonthDay } from '../../../../shared/domain/planting-windows';
import { isHerbicideTask } from '../../../../shared/domain/spray-records';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { CautionBox, ErrorPanel, Loading } from '../../../components/ui/card';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { useTask } from '../api/get-task';
import { useUpdateTask } from '../api/update-task';
import { useReopenTask } from '../api/reopen-task';
import { TaskStatusChip, WARNING_LABELS } from './task-status-chip';
import { datesText, windowText } from './task-text';
import { taskChanges } from '../lib/task-changes';

/** Someone a task can be given to. */
export interface Assignable {
  id: number;
  name: string;
  role: string;
}

type Values = z.input<typeof TaskUpdateSchema>;
const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v);
const idOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

/** The scheduling form of an open task: crew member, dates and notes; the server's refusal shows inline. */
function ScheduleForm({ task, people }: { task: TaskDto; people: readonly Assignable[] }) {
  const update = useUpdateTask();
  const toast = useToast();
  const [serverError, setServerError] = useState<string | null>(null);
  const form = useForm<Values, unknown, z.output<typeof TaskUpdateSchema>>({
    resolver: zodResolver(TaskUpdateSchema),
    // `values`, not defaults: a kept copy shown at once after a reload is replaced by the server's answer
    // when it arrives, while a field the person has already changed keeps what they typed.
    values: { assigneeId: task.assigneeId, startDate: task.startDate, endDate: task.endDate, notes: task.notes },
    resetOptions: { keepDirtyValues: true },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((values) => {
    const input = taskChanges(task, values);
    if (Object.keys(input).length === 0) {
      setServerError('Nothing changed: pick a crew member, a date or write a note first.');
      return;
    }
    setServerError(null);
    update.mutate(
      { taskId: task.id, input },
      {
        onSuccess: (saved) => {
          form.reset({ assigneeId: saved.assigneeId, startDate: saved.startDate, endDate: saved.endDate, notes: saved.notes });
          toast('success', `${saved.name} on ${saved.unitName}: ${saved.status === 'scheduled' ? `scheduled for ${datesText(saved)} with ${saved.assigneeName}` : 'saved'}.`);
        },
        onError: (e) => setServerError(e instanceof ApiError ? e.message : 'The task was not saved. Check your connection and try again.'),
      },
    );
  });
  const crew = people.filter((p) => p.role === 'crew');
  const staff = people.filter((p) => p.role !== 'crew');
  // A form error on the whole object (an empty edit) has no field of its own.
  const rootMessage = (errors as { message?: string }).message ?? errors.root?.message;
  return (
    <form onSubmit={submit} noValidate aria-label="Schedule this task" className="flex flex-col gap-3">
      {/* Controlled, so the saved crew member shows even when the team list arrives after the task. */}
      <Controller
        control={form.control}
        name="assigneeId"
        render={({ field }) => (
          <SelectField label="Crew member" error={errors.assigneeId?.message} name={field.name} ref={field.ref} onBlur={field.onBlur} value={field.value === null || field.value === undefined ? '' : String(field.value)} onChange={(e) => field.onChange(idOrNull(e.target.value))}>
            <option value="">Unassigned</option>
            {task.assigneeId !== null && !people.some((p) => p.id === task.assigneeId) ? <option value={task.assigneeId}>{task.assigneeName ?? 'The crew member now assigned'}</option> : null}
            {crew.length > 0 ? (
              <optgroup label="Crew">
                {crew.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </optgroup>
            ) : null}
            {staff.length > 0 ? (
              <optgroup label="Consultants">
                {staff.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </optgroup>
            ) : null}
          </SelectField>
        )}
      />
      <div className="grid grid-cols-1 gap-3 min-[420px]:grid-cols-2">
        <TextField label="Start date" type="date" hint={`Window ${windowText(task)}`} error={errors.startDate?.message} {...form.register('startDate', { setValueAs: blankToNull })} />
        <TextField label="End date" type="date" hint="Leave empty for a one-day task." error={errors.endDate?.message} {...form.register('endDate', { setValueAs: blankToNull })} />
      </div>
      <TextAreaField label="Notes for the crew" rows={3} error={errors.notes?.message} {...form.register('notes', { setValueAs: blankToNull })} />
      {serverError || rootMessage ? (
        <p role="alert" className="rounded border-l-4 border-clay bg-clay/5 px-3 py-2 text-sm text-ink">
          {serverError ?? rootMessage}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={update.isPending}>
          Save
        </Button>
      </div>
    </form>
  );
}

function Completion({ task }: { task: TaskDto }) {
  const planned = new Map(task.quantities.map((q) => [q.key, q]));
  return (
    <section aria-labelledby="completion-heading" className="flex flex-col gap-2 rounded-md border border-moss/40 bg-moss/5 px-3 py-2 text-sm">
      <h3 id="completion-heading" className="font-bold text-moss-deep">
        Done {task.doneOn ? formatMonthDay(task.doneOn) : ''}
        {task.completedByName ? ` by ${task.completedByName}` : ''}
      </h3>
      {isHerbicideTask(task) && task.doneOn ? (
        <Link to={`${paths.sprayRecords}?season=${task.doneOn.slice(0, 4)}&propertyId=${task.propertyId}&task=${task.id}`} className="font-semibold text-moss underline">
          Spray record of this application
        </Link>
      ) : null}
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        <dt className="text-slate">Hours</dt>
        <dd className="tabular-nums">{task.hours ?? '—'}</dd>
        <dt className="text-slate">Crew notes</dt>
        <dd className="whitespace-pre-line">{task.notes ?? '—'}</dd>
      </dl>
      {task.quantitiesUsed.length > 0 ? (
        <table className="w-full text-sm tabular-nums">
          <caption className="sr-only">Quantities used against planned</caption>
          <thead>
            <tr className="text-left text-xs uppercase tracking-wide text-slate">
              <th className="py-1 font-semibold">Material</th>
              <th className="py-1 text-right font-semibold">Planned</th>
              <th className="py-1 text-right font-semibold">Used</th>
            </tr>
          </thead>
          <tbody>
            {task.quantitiesUsed.map((u) => {
              const plan = planned.get(u.key);
              return (
                <tr key={u.key} className="border-t border-rule/60">
                  <td className="py-1">{u.label}</td>
                  <td className="py-1 text-right">{plan ? `${plan.amount} ${plan.unit}` : '—'}</td>
                  <td className="py-1 text-right font-semibold">
                    {u.amount} {u.unit}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
      {task.photos.length > 0 ? (
        <ul aria-label="Photos" className="grid grid-cols-2 gap-2 min-[420px]:grid-cols-3">
          {task.photos.map((p, i) => (
            <li key={p.id} className="flex flex-col gap-0.5">
              <a href={p.url} target="_blank" rel="noreferrer" className="block overflow-hidden rounded border border-rule">
                <img src={p.url} alt={`Photo ${i + 1} of ${task.name} on ${task.unitName}`} loading="lazy" className="aspect-square w-full object-cover" />
              </a>
              <span className="text-xs text-slate">
                {p.latitude !== null && p.longitude !== null ? `at ${p.latitude.toFixed(5)}, ${p.longitude.toFixed(5)}` : 'no position in the photo'}
              </span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-slate">No photos.</p>
      )}
    </section>
  );
}

function Details({ task, people, onShowWeek }: { task: TaskDto; people: readonly Assignable[]; onShowWeek?: (date: string) => void }) {
  const reopen = useReopenTask();
  const toast = useToast();
  const finished = task.status === 'done' || task.status === 'skipped';
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="text-slate">Status</dt>
        <dd>
          <TaskStatusChip status={task.status} />
        </dd>
        <dt className="text-slate">Practice</dt>
        <dd>{task.practiceName}</dd>
        <dt className="text-slate">Window</dt>
        <dd className="tabular-nums">{windowText(task)}</dd>
        <dt className="text-slate">Set for</dt>
        <dd className="tabular-nums">
          {datesText(task)}
          {task.startDate && onShowWeek ? (
            <button type="button" className="ml-2 text-sm font-semibold text-moss-deep underline" onClick={() => onShowWeek(task.startDate as string)}>
              Show its week
            </button>
          ) : null}
        </dd>
        <dt className="text-slate">Crew member</dt>
        <dd>{task.assigneeName ?? 'Unassigned'}</dd>
        {task.costCents !== null ? (
          <>
            <dt className="text-slate">Cost share</dt>
            <dd className="figure tabular-nums">{formatCents(task.costCents)}</dd>
          </>
        ) : null}
      </dl>
      {task.warnings.length > 0 ? (
        <ul aria-label="Warnings for this task" className="flex flex-col gap-1 rounded-md border-l-4 border-clay bg-clay/5 px-3 py-2 text-sm">
          {task.warnings.map((w, i) => (
            <li key={i}>
              <span className="font-semibold text-[#8E3F2A]">{WARNING_LABELS[w.code]}:</span> {w.message}
            </li>
          ))}
        </ul>
      ) : null}
      {task.quantities.length > 0 ? (
        <section aria-label="To apply">
          <h3 className="mb-1 text-sm font-bold">To apply</h3>
          <ul className="flex flex-col gap-0.5 text-sm">
            {task.quantities.map((q) => (
              <li key={q.key} className="flex flex-wrap justify-between gap-x-3">
                <span>{q.label}</span>
                <span className="tabular-nums text-slate">
                  <span className="font-semibold text-ink">
                    {q.amount} {q.unit}
                  </span>
                  {q.rateText ? ` · ${q.rateText}` : ''}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {task.cautions.length > 0 ? (
        <CautionBox title="Cautions">
          <ul className="flex list-disc flex-col gap-1 pl-4">
            {task.cautions.map((c) => (
              <li key={c.id}>
                <span className="font-semibold">{c.title}</span> {c.text}
              </li>
            ))}
          </ul>
        </CautionBox>
      ) : null}
      {task.status === 'done' ? <Completion task={task} /> : null}
      {task.status === 'skipped' ? (
        <p className="rounded-md border border-dashed border-slate px-3 py-2 text-sm">
          <span className="font-semibold">Skipped:</span> {task.skipReason}
        </p>
      ) : null}
      {finished ? (
        <div>
          <Button
            variant="secondary"
            busy={reopen.isPending}
            onClick={() =>
              reopen.mutate(task.id, {
                onSuccess: (t) => toast('success', `${t.name} on ${t.unitName} is open again.`),
                onError: (e) => toast('error', `Not reopened: ${e.message}`),
              })
            }
          >
            Reopen task
          </Button>
          <p className="mt-1 text-xs text-slate">Reopening clears the {task.status === 'done' ? 'completion (its photos stay on file)' : 'reason'} and puts the task back on the schedule.</p>
        </div>
      ) : (
        <ScheduleForm key={`${task.id}-${task.status}`} task={task} people={people} />
      )}
    </div>
  );
}

/** A side panel over the schedule for one task: its details, the scheduling form or its completion, and Reopen. */
export function TaskPanel({
  taskId,
  fallback,
  people,
  onClose,
  onShowWeek,
}: {
  taskId: number | null;
  fallback: TaskDto | undefined;
  people: readonly Assignable[];
  onClose: () => void;
  /** Opens the week list on the week holding a date. */
  onShowWeek?: (date: string) => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const task = useTask(taskId);
  const open = taskId !== null;
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal?.();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  const shown = task.data ?? fallback;
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onClick={(e) => {
        if (e.target === ref.current) onClose();
      }}
      className="m-0 ml-auto h-dvh max-h-none w-full max-w-[30rem] border-l border-rule bg-card p-0 text-ink shadow-lg backdrop:bg-ink/30"
    >
      {open ? (
        <div className="flex min-h-full flex-col gap-4 p-4 sm:p-5">
          <header className="flex items-start gap-3">
            <div className="min-w-0 flex-1">
              <h2 id={titleId} className="text-lg font-bold leading-snug">
                {shown ? shown.name : 'Task'}
              </h2>
              {shown ? (
                <p className="text-sm text-slate">
                  {shown.unitName} · {shown.propertyName}
                </p>
              ) : null}
            </div>
            <Button variant="secondary" size="sm" onClick={onClose} aria-label="Close the task panel">
              Close
            </Button>
          </header>
          {shown ? <Details key={shown.id} task={shown} people={people} onShowWeek={onShowWeek} /> : task.isError ? <ErrorPanel error={task.error} onRetry={() => void task.refetch()} /> : <Loading label="Loading the task…" />}
        </div>
      ) : null}
    </dialog>
  );
}
