import type { TaskWarning } from '../../../../shared/domain/tasks';
import { WARNING_LABELS } from './task-status-chip';

/** The schedule's warnings in plain words, grouped by kind; each opens its task. */
export function WarningsPanel({ warnings, onOpen }: { warnings: readonly TaskWarning[]; onOpen: (taskId: number) => void }) {
  if (warnings.length === 0) {
    return (
      <section aria-labelledby="schedule-warnings" className="rounded-md border border-rule bg-card px-4 py-3 text-sm">
        <h2 id="schedule-warnings" className="font-bold">
          Warnings
        </h2>
        <p className="text-slate">No missed windows or steps out of order among these tasks.</p>
      </section>
    );
  }
  const codes = (Object.keys(WARNING_LABELS) as TaskWarning['code'][]).filter((c) => warnings.some((w) => w.code === c));
  return (
    <section aria-labelledby="schedule-warnings" className="rounded-md border-l-4 border-clay bg-clay/5 px-4 py-3 text-sm">
      <h2 id="schedule-warnings" className="font-bold text-[#8E3F2A]">
        Warnings ({warnings.length})
      </h2>
      {codes.map((code) => (
        <div key={code} className="mt-2">
          <h3 className="text-xs font-semibold uppercase tracking-wide text-slate">{WARNING_LABELS[code]}</h3>
          <ul className="mt-1 flex flex-col gap-1">
            {warnings
              .filter((w) => w.code === code)
              .map((w, i) => (
                <li key={`${w.taskId}-${i}`}>
                  <button type="button" className="text-left text-ink underline decoration-clay/50 underline-offset-2 hover:decoration-clay" onClick={() => onOpen(w.taskId)}>
                    {w.message}
                  </button>
                </li>
              ))}
          </ul>
        </div>
      ))}
    </section>
  );
}
