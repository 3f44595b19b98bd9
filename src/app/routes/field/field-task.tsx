import { Suspense, useEffect, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { parseId } from '../../../lib/route-params';
import { ApiError } from '../../../lib/api-client';
import { formatDateRange, formatQuantity } from '../../../lib/quantity-format';
import { OfflineNotice } from '../../../components/ui/offline-notice';
import { Card, CautionBox, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { useTask } from '../../../features/field/api/get-task';
import type { FieldTask } from '../../../features/field/api/get-my-tasks';
import { useCompletionQueue } from '../../../features/field/hooks/use-completion-queue';
import { KindChip, TaskStatusChip } from '../../../features/field/components/task-card';
import { QueueNotice } from '../../../features/field/components/queue-notice';
import { plannedDates, windowText } from '../../../features/field/lib/task-text';
import { OFFLINE_MESSAGE } from '../../../features/field/lib/completion-queue';
import { offersChecks } from '../../../features/field/lib/check-offer';
import { useMe } from '../../../features/auth/api/get-me';
import { CodeBoundary, retryableLazy } from '../../../components/ui/code-boundary';

// The forms (and the shared zod schemas they check with) are not in the page's first load (its 150 KB budget).
// They are fetched when a task opens (the route waits for them: taskFormsLoaded) and by the field sheet while
// idle (field-home.tsx), and precached for no signal (OFFLINE_PAGES in bundle-budgets.ts). The unit's small map (with the
// directions) draws through d3-geo. Should a form still be missing with no signal, the page says so and opens it
// when the signal is back (CodeBoundary).
const loadCompleteForm = () => import('../../../features/field/components/complete-form');
const loadSkipForm = () => import('../../../features/field/components/skip-form');
const loadCheckForm = () => import('../../../features/field/components/check-form');
const loadUnitMap = () => import('../../../features/field/components/unit-map');
const loadDirections = () => import('../../../features/field/components/directions');

/** How long opening a task waits for its forms' code before showing the page anyway (a slow phone, a direct link). */
const TASK_FORMS_WAIT_MS = 2500;

let forms: Promise<void> | null = null;

/**
 * Starts fetching every form of a task page (once; again after a failure) and answers when they are
 * all in memory, or when one could not load. Never rejects: the page shows a notice for a missing form.
 */
function preloadTaskForms(): Promise<void> {
  forms ??= Promise.all([loadCompleteForm(), loadSkipForm(), loadCheckForm(), loadUnitMap(), loadDirections()]).then(
    () => undefined,
    () => {
      forms = null;
    },
  );
  return forms;
}

/**
 * Fetches the forms and answers once they are in memory, or after `TASK_FORMS_WAIT_MS` at most: the route shows
 * the page then (router.tsx), so "Mark done" opens even if the signal goes as soon as the task shows. The field
 * sheet calls it while idle (field-home.tsx), so a task opened from there usually waits for nothing.
 */
export function taskFormsLoaded(): Promise<void> {
  return Promise.race([preloadTaskForms(), new Promise<void>((resolve) => setTimeout(resolve, TASK_FORMS_WAIT_MS))]);
}

const UnitMap = retryableLazy(() => loadUnitMap().then((m) => m.UnitMap));
const CompleteForm = retryableLazy(() => loadCompleteForm().then((m) => m.CompleteForm));
const SkipForm = retryableLazy(() => loadSkipForm().then((m) => m.SkipForm));
const CheckForm = retryableLazy(() => loadCheckForm().then((m) => m.CheckForm));
// The directions come in the same small file as the unit's map, so the task's words paint without waiting for them.
const Directions = retryableLazy(() => loadDirections().then((m) => m.Directions));
const retryPlace = () => {
  UnitMap.retry();
  Directions.retry();
};

function BackLink() {
  return (
    <Link to={paths.field} className="self-start text-sm font-semibold text-moss-deep underline">
      ← Field sheet
    </Link>
  );
}

/** What to apply: each material or service with its amount and the rate as written. */
function QuantitiesCard({ task }: { task: FieldTask }) {
  if (task.quantities.length === 0) return null;
  return (
    <Card title="What to apply">
      <ul className="flex flex-col divide-y divide-rule">
        {task.quantities.map((q) => (
          <li key={q.key} className="flex flex-col py-2 first:pt-0 last:pb-0">
            <span className="flex items-baseline justify-between gap-3">
              <span className="font-semibold">{q.label}</span>
              <span className="figure whitespace-nowrap tabular-nums">
                {formatQuantity(q.amount)} {q.unit}
              </span>
            </span>
            {q.rateText ? <span className="text-sm text-slate">Rate: {q.rateText}</span> : null}
          </li>
        ))}
      </ul>
    </Card>
  );
}

/** What was recorded when the task was done or skipped. */
function RecordCard({ task }: { task: FieldTask }) {
  if (task.status === 'skipped') {
    return (
      <Card title="Skipped">
        <p>{task.skipReason}</p>
      </Card>
    );
  }
  if (task.status !== 'done') return null;
  return (
    <Card title="Done">
      <p>
        Done on <span className="font-semibold">{task.doneOn ? formatDateRange(task.doneOn, task.doneOn) : '—'}</span>
        {task.completedByName ? ` by ${task.completedByName}` : ''}
        {task.hours !== null ? `, ${formatQuantity(task.hours)} h` : ''}.
      </p>
      {task.notes ? <p className="mt-1 text-sm">“{task.notes}”</p> : null}
      {task.quantitiesUsed.length > 0 ? (
        <ul className="mt-2 text-sm">
          {task.quantitiesUsed.map((q) => (
            <li key={q.key}>
              {q.label}: <span className="tabular-nums">{formatQuantity(q.amount)}</span> {q.unit}
            </li>
          ))}
        </ul>
      ) : null}
      {task.photos.length > 0 ? (
        <ul className="mt-3 grid grid-cols-3 gap-2" aria-label="Photos of the work">
          {task.photos.map((p, i) => (
            <li key={p.id}>
              <a href={p.url} target="_blank" rel="noreferrer">
                <img src={p.url} alt={`Photo ${i + 1} of ${task.name}`} className="aspect-square w-full rounded border border-rule object-cover" />
              </a>
            </li>
          ))}
        </ul>
      ) : null}
    </Card>
  );
}

/** One task on the phone: the unit's map and a maps-app link, what to apply, cautions, and Mark done / Skip. */
export function FieldTaskPage() {
  const id = parseId(useParams().id) ?? 0;
  const task = useTask(id);
  const me = useMe();
  const queue = useCompletionQueue();
  const [mode, setMode] = useState<'view' | 'done' | 'skip' | 'check'>('view');
  useEffect(() => {
    void preloadTaskForms();
  }, []);
  if (!id || (task.isError && task.error instanceof ApiError && task.error.status === 404)) {
    return (
      <div className="flex flex-col gap-3">
        <BackLink />
        <div role="alert" className="rounded-md border border-rule bg-card px-4 py-6 text-center">
          <h1 className="text-lg font-bold">This task is not on your list</h1>
          <p className="text-sm text-slate">It may have been given to someone else or removed. Ask your consultant.</p>
        </div>
      </div>
    );
  }
  if (task.isPending) return <Loading />;
  if (task.isError && !task.data) return <ErrorPanel error={task.error} onRetry={() => task.refetch()} />;
  const t = task.data;
  const waiting = queue.waitingFor(t.id);
  const open = (t.status === 'planned' || t.status === 'scheduled') && !waiting;
  const dates = plannedDates(t);
  return (
    <div className="flex flex-col gap-4">
      <BackLink />
      <OfflineNotice updatedAt={task.dataUpdatedAt} refreshFailed={task.isRefetchError} />
      <QueueNotice showWaiting={false} />
      <div>
        <TaskStatusChip task={t} waitingToSend={Boolean(waiting)} />
        <h1 className="mt-1 break-words text-2xl font-bold">{t.name}</h1>
        <p className="flex flex-wrap items-center gap-x-3">
          <span className="font-semibold">{t.unitName}</span>
          <KindChip kind={t.unitKind} />
        </p>
        <p className="text-sm text-slate">
          {t.propertyName} · {t.practiceName}
        </p>
        <p className="mt-1 text-sm">
          {dates ? <span className="block font-semibold">{dates}</span> : null}
          <span className="text-slate">{windowText(t)}</span>
        </p>
      </div>
      {waiting ? (
        <div role="status" className="rounded-md border border-ochre bg-ochre/10 px-4 py-3 text-sm">
          <p className="font-semibold">Done on {formatDateRange(waiting.fields.doneOn, waiting.fields.doneOn)} — waiting to send</p>
          <p>{queue.online ? 'Sending now; it stays on this phone until Browseline has it.' : OFFLINE_MESSAGE}</p>
        </div>
      ) : null}
      {t.warnings.length > 0 && open ? (
        <ul className="flex flex-col gap-1 rounded-md border border-ochre/70 bg-ochre/10 px-4 py-2 text-sm" aria-label="Schedule warnings">
          {t.warnings.map((w, i) => (
            <li key={i}>{w.message}</li>
          ))}
        </ul>
      ) : null}
      <CodeBoundary what="The unit’s map" onRetry={retryPlace}>
        <Suspense fallback={<div className="aspect-[8/5] w-full rounded border border-rule bg-paper" aria-hidden />}>
          <UnitMap geometry={t.unitGeometry} kind={t.unitKind} name={t.unitName} photos={t.photos} />
          <Directions location={t.location} label={t.unitName} />
        </Suspense>
      </CodeBoundary>
      <QuantitiesCard task={t} />
      {t.cautions.map((c) => (
        <CautionBox key={c.id} title={c.title}>
          <p>{c.text}</p>
        </CautionBox>
      ))}
      <RecordCard task={t} />
      {open && mode === 'view' ? (
        <div className="flex flex-col gap-2">
          <Button className="min-h-14 text-lg" onClick={() => setMode('done')}>
            Mark done
          </Button>
          <Button variant="secondary" className="min-h-12" onClick={() => setMode('skip')}>
            Skip with a reason
          </Button>
        </div>
      ) : null}
      {offersChecks(t) && mode === 'view' ? (
        <Button variant="secondary" className="min-h-12" onClick={() => setMode('check')}>
          Record an establishment or browse check
        </Button>
      ) : null}
      {mode === 'check' ? (
        <Card title="Check this plot">
          <CodeBoundary what="The check form" onRetry={CheckForm.retry}>
            <Suspense fallback={<Loading />}>
              <CheckForm task={t} userId={me.data?.id ?? 0} onDone={() => setMode('view')} />
            </Suspense>
          </CodeBoundary>
        </Card>
      ) : null}
      {open && mode === 'done' ? (
        <Card title="Mark done">
          <CodeBoundary what="The Mark done form" onRetry={CompleteForm.retry}>
            <Suspense fallback={<Loading />}>
              <CompleteForm task={t} onCancel={() => setMode('view')} />
            </Suspense>
          </CodeBoundary>
        </Card>
      ) : null}
      {open && mode === 'skip' ? (
        <Card title="Skip this task">
          <CodeBoundary what="The Skip form" onRetry={SkipForm.retry}>
            <Suspense fallback={<Loading />}>
              <SkipForm task={t} onCancel={() => setMode('view')} />
            </Suspense>
          </CodeBoundary>
        </Card>
      ) : null}
    </div>
  );
}
