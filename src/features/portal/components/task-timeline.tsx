import type { PortalTask } from '../../../../shared/schemas/portal';
import { dayText } from './dates';

const STATUS: Record<PortalTask['status'], { label: string; mark: string; className: string }> = {
  done: { label: 'Done', mark: '✓', className: 'border-moss bg-moss text-white' },
  scheduled: { label: 'Scheduled', mark: '•', className: 'border-moss bg-moss/15 text-moss-deep' },
  planned: { label: 'Planned', mark: '', className: 'border-slate bg-card text-slate' },
  skipped: { label: 'Skipped', mark: '–', className: 'border-rule bg-rule text-slate' },
};

/** When a task happened or will happen, in words. */
export function taskWhen(t: PortalTask): string {
  if (t.status === 'done') return `Done ${dayText(t.doneOn)}`;
  if (t.status === 'skipped') return 'Skipped this season';
  if (t.startDate) return `Set for ${dayText(t.startDate)}${t.endDate && t.endDate !== t.startDate ? ` to ${dayText(t.endDate)}` : ''}`;
  return `Between ${dayText(t.earliest)} and ${dayText(t.latest)}`;
}

/** The month a task sits in on the timeline: when it was done, is set for, or its window opens. */
const monthOf = (t: PortalTask) => (t.status === 'done' && t.doneOn ? t.doneOn : (t.startDate ?? t.earliest)).slice(0, 7);
const monthText = (ym: string) => new Date(`${ym}-01T00:00:00Z`).toLocaleDateString('en-US', { timeZone: 'UTC', month: 'long', year: 'numeric' });

/** The season's tasks in date order, grouped by month, with each task's status and the crew's photos. */
export function TaskTimeline({ tasks }: { tasks: PortalTask[] }) {
  const sorted = [...tasks].sort((a, b) => (monthOf(a) + (a.doneOn ?? a.startDate ?? a.earliest)).localeCompare(monthOf(b) + (b.doneOn ?? b.startDate ?? b.earliest)));
  const months = [...new Set(sorted.map(monthOf))];
  return (
    <div className="flex flex-col gap-4">
      {months.map((m) => (
        <section key={m} aria-label={monthText(m)}>
          <h3 className="mb-2 text-sm font-bold uppercase tracking-wide text-slate">{monthText(m)}</h3>
          <ol className="flex flex-col gap-3 border-l-2 border-rule pl-4">
            {sorted
              .filter((t) => monthOf(t) === m)
              .map((t) => {
                const s = STATUS[t.status];
                return (
                  <li key={t.id} className="relative" data-status={t.status}>
                    <span aria-hidden className={`absolute -left-[1.65rem] top-0.5 flex h-5 w-5 items-center justify-center rounded-full border-2 text-xs font-bold ${s.className}`}>
                      {s.mark}
                    </span>
                    <p className="font-semibold leading-snug">
                      {t.name} <span className="font-normal text-slate">· {t.unitName}</span>
                    </p>
                    <p className="text-sm text-slate">
                      <span className="sr-only">{s.label}. </span>
                      {taskWhen(t)} · {t.practiceName}
                    </p>
                    {t.photos.length ? (
                      <ul className="mt-2 flex flex-wrap gap-2">
                        {t.photos.map((p) => (
                          <li key={p.id}>
                            <a href={p.url} target="_blank" rel="noreferrer" className="block rounded focus:outline-none focus:ring-2 focus:ring-moss">
                              <img src={p.url} alt={`Crew photo: ${t.name} on ${t.unitName}`} loading="lazy" className="h-20 w-28 rounded border border-rule object-cover" />
                            </a>
                          </li>
                        ))}
                      </ul>
                    ) : null}
                  </li>
                );
              })}
          </ol>
        </section>
      ))}
    </div>
  );
}
