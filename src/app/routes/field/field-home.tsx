import { lazy, Suspense, useEffect } from 'react';
import { useFieldHome } from '../../../features/field/api/get-field-home';
import { useMe } from '../../../features/auth/api/get-me';
import { useMyTasks } from '../../../features/field/api/get-my-tasks';
import { useCompletionQueue } from '../../../features/field/hooks/use-completion-queue';
import { TaskCard } from '../../../features/field/components/task-card';
import { QueueNotice } from '../../../features/field/components/queue-notice';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { BUCKETS } from '../../../features/field/lib/task-text';
import { OfflineNotice } from '../../../components/ui/offline-notice';
import { Card, CautionBox, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { formatDateWithWeekday, todayIn } from '../../../../shared/domain/clock';

// Loaded after the sheet shows: the field sheet's first load is at its 150 KB budget.
const DuePullsCard = lazy(() => import('../../../features/cameras/components/due-pulls-card').then((m) => ({ default: m.DuePullsCard })));

/**
 * Once the list shows and the phone is idle, fetches the task page's code, which fetches its forms as it starts
 * (field-task.tsx): a task opened from here can be marked done even if the signal goes before the service
 * worker has kept them. Answers a function that cancels it.
 */
function preloadTaskPageWhenIdle(): () => void {
  const preload = () => void import('./field-task').then((m) => m.taskFormsLoaded()).catch(() => undefined);
  if (typeof window.requestIdleCallback === 'function') {
    const id = window.requestIdleCallback(preload, { timeout: 2000 });
    return () => window.cancelIdleCallback(id);
  }
  const timer = window.setTimeout(preload, 300);
  return () => window.clearTimeout(timer);
}

// Below the fold and rarely used: its code loads after the sheet shows (kept in the offline shell).
const CalendarFeedsCard = lazy(() => import('../../../features/field/components/calendar-feeds-card').then((m) => ({ default: m.CalendarFeedsCard })));

/** The assigned tasks grouped Overdue, This week, Coming up. */
function TaskBuckets({ me }: { me: { id: number; role: string } }) {
  const tasks = useMyTasks(me);
  const queue = useCompletionQueue();
  const shown = Boolean(tasks.data);
  useEffect(() => (shown ? preloadTaskPageWhenIdle() : undefined), [shown]);
  if (tasks.isPending) return <Loading label="Loading your tasks…" />;
  if (tasks.isError && !tasks.data) return <ErrorPanel error={tasks.error} onRetry={() => tasks.refetch()} />;
  const open = tasks.data.tasks.filter((t) => t.bucket !== 'finished' || queue.waitingFor(t.id));
  const done = tasks.data.tasks.filter((t) => t.bucket === 'finished' && !queue.waitingFor(t.id));
  return (
    <>
      {open.length === 0 ? (
        <Card title="This week">
          <EmptyState title={done.length ? 'Nothing open on your list' : 'No tasks assigned to you'}>When your consultant assigns work from the schedule, it shows here with the map, the rates to apply and a “Mark done” button.</EmptyState>
        </Card>
      ) : (
        BUCKETS.map(({ bucket, title, empty }) => {
          const list = open.filter((t) => t.bucket === bucket);
          if (list.length === 0 && bucket !== 'this-week') return null;
          return (
            <section key={bucket} aria-labelledby={`bucket-${bucket}`} className="flex flex-col gap-2">
              <h2 id={`bucket-${bucket}`} className={`text-base font-bold ${bucket === 'overdue' ? 'text-[#8E3F2A]' : 'text-ink'}`}>
                {title} <span className="font-normal text-slate">({list.length})</span>
              </h2>
              {list.length === 0 ? (
                <p className="text-sm text-slate">{empty}</p>
              ) : (
                <ul className="flex flex-col gap-2">
                  {list.map((t) => (
                    <li key={t.id}>
                      <TaskCard task={t} waitingToSend={Boolean(queue.waitingFor(t.id))} />
                    </li>
                  ))}
                </ul>
              )}
            </section>
          );
        })
      )}
      {done.length > 0 ? (
        <details className="rounded-md border border-rule bg-card p-3">
          <summary className="cursor-pointer text-sm font-semibold">Finished ({done.length})</summary>
          <ul className="mt-2 flex flex-col gap-2">
            {done.map((t) => (
              <li key={t.id}>
                <TaskCard task={t} waitingToSend={false} />
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </>
  );
}

/** The crew's field sheet: assigned work by week, what waits to send, who to call, the calendar feed and the safety rules. */
export function FieldHomePage() {
  const me = useMe();
  const home = useFieldHome();
  const tasks = useMyTasks(me.data ?? { id: 0, role: 'crew' }, Boolean(me.data));
  if (home.isPending || !me.data) return <Loading />;
  if (home.isError && !home.data) return <ErrorPanel error={home.error} />;
  // Today in the firm's time zone, whatever zone the phone is set to.
  const todayIso = todayIn(me.data.firmTimezone, new Date());
  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-sm text-slate" data-firm-today={todayIso}>
          {formatDateWithWeekday(todayIso)}
        </p>
        <h1 className="text-2xl font-bold">Field sheet</h1>
        <p className="text-slate">{me.data.name} · {home.data.firm.name}</p>
      </div>
      <OfflineNotice updatedAt={tasks.dataUpdatedAt || home.dataUpdatedAt} refreshFailed={tasks.isRefetchError || home.isRefetchError} />
      <QueueNotice />
      <Link to={paths.fieldLog} className="rounded-md border border-moss bg-card px-4 py-3 text-center font-semibold text-moss-deep">
        Log sign
      </Link>
      <TaskBuckets me={me.data} />
      <Suspense fallback={null}>
        <DuePullsCard />
      </Suspense>
      <Card title="Who to call">
        <ul className="flex flex-col gap-3">
          {home.data.contacts.map((c) => (
            <li key={c.email} className="flex items-center justify-between gap-3">
              <span>
                <span className="block font-semibold">{c.name}</span>
                <span className="block text-xs capitalize text-slate">{c.role}</span>
              </span>
              {c.phone ? (
                <a className="rounded border border-moss px-3 py-2 text-sm font-semibold text-moss-deep" href={`tel:${c.phone.replace(/[^0-9+]/g, '')}`}>
                  Call {c.phone}
                </a>
              ) : (
                <a className="text-sm text-moss-deep underline" href={`mailto:${c.email}`}>{c.email}</a>
              )}
            </li>
          ))}
        </ul>
      </Card>
      <CautionBox title="Before you start any job">
        <ul className="list-disc pl-5">
          <li>Herbicides: the product label is the law. Restricted-use products need a certified applicator. Mind drift, water setbacks and protective equipment.</li>
          <li>Chainsaw and hinge-cutting work: chaps, eye, ear and head protection; never cut alone.</li>
          <li>Tree stands: wear a full-body harness and stay connected from the ground up.</li>
          <li>Follow local codes, state wildlife rules and licensed practice; ask your consultant when unsure.</li>
        </ul>
      </CautionBox>
      <Suspense fallback={null}>
        <CalendarFeedsCard />
      </Suspense>
    </div>
  );
}
