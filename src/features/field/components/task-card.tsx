import { Link } from 'react-router-dom';
import { isUnitKind, KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { paths } from '../../../config/paths';
import type { FieldTask } from '../api/get-my-tasks';
import { FIELD_STATUS_LABELS, fieldStatus, plannedDates, windowText } from '../lib/task-text';

const STATUS_CLASSES: Record<string, string> = {
  planned: 'border-rule text-slate',
  scheduled: 'border-moss text-moss-deep',
  done: 'border-moss bg-moss text-white',
  skipped: 'border-slate text-slate',
  'waiting-to-send': 'border-ochre bg-ochre/15 text-ink',
};

/** A task's state as a small chip. */
export function TaskStatusChip({ task, waitingToSend }: { task: Pick<FieldTask, 'status'>; waitingToSend: boolean }) {
  const status = fieldStatus(task, waitingToSend);
  return <span className={`inline-block whitespace-nowrap rounded border px-2 py-0.5 text-xs font-semibold ${STATUS_CLASSES[status]}`}>{FIELD_STATUS_LABELS[status]}</span>;
}

/** The unit's kind as a coloured chip. */
export function KindChip({ kind }: { kind: string | null }) {
  if (!kind || !isUnitKind(kind)) return null;
  const s = KIND_STYLES[kind];
  return (
    <span className="inline-flex items-center gap-1 text-xs text-slate">
      <span className="inline-block size-3 rounded-sm border" style={{ backgroundColor: s.fill, borderColor: s.stroke }} aria-hidden />
      {s.label}
    </span>
  );
}

/** One task on the field sheet: what, where, when; the whole card opens the task (its text is its name, so what is seen is what is heard). */
export function TaskCard({ task, waitingToSend }: { task: FieldTask; waitingToSend: boolean }) {
  const dates = plannedDates(task);
  return (
    <Link to={paths.fieldTask(task.id)} className="block rounded-md border border-rule bg-card p-3 hover:border-moss focus:outline-none focus:ring-2 focus:ring-moss/40">
      <div className="flex items-start justify-between gap-2">
        <span className="font-semibold text-ink">{task.name}</span>
        <TaskStatusChip task={task} waitingToSend={waitingToSend} />
      </div>
      <div className="mt-1 flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <span>{task.unitName}</span>
        <KindChip kind={task.unitKind} />
      </div>
      <p className="text-sm text-slate">{task.propertyName}</p>
      <p className="mt-1 text-sm">
        {dates ? <span className="font-semibold">{dates} · </span> : null}
        <span className="text-slate">{windowText(task)}</span>
      </p>
      {task.cautions.length > 0 ? (
        <p className="mt-1 text-xs font-semibold text-[#8E3F2A]">
          <span aria-hidden>▲ </span>
          {task.cautions.length === 1 ? '1 caution' : `${task.cautions.length} cautions`}: {task.cautions.map((c) => c.title).join(', ')}
        </p>
      ) : null}
    </Link>
  );
}
