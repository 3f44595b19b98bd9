import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { formatDay } from '../../../lib/firm-clock';
import { formatNumber } from '../../../lib/format';
import { TASK_STATUS_LABELS } from '../../../lib/work-status';
import { formatCents } from '../../../../shared/domain/money';
import { CHECK_KIND_LABELS, PLOT_STATUS_LABELS } from '../../../../shared/schemas/checks';
import type { TaskStatus } from '../../../../shared/domain/tasks';
import { useUnitHistory } from '../api/get-unit-history';

/** A unit's record per season, newest first: what was prescribed, the work done and what it used, checks and soil tests. */
export function UnitHistoryCard({ unitId }: { unitId: number }) {
  const history = useUnitHistory(unitId);
  return (
    <Card title="Season by season">
      {history.isPending ? (
        <Loading label="Loading the unit’s history…" />
      ) : history.isError ? (
        <ErrorPanel error={history.error} onRetry={() => void history.refetch()} />
      ) : history.data.seasons.length === 0 ? (
        <p className="text-sm text-slate">Nothing recorded on this unit yet: its prescriptions, work, checks and soil tests will gather here by season.</p>
      ) : (
        <ol className="flex flex-col gap-4 text-sm" aria-label="Seasons">
          {history.data.seasons.map((s) => (
            <li key={s.season} aria-labelledby={`season-${s.season}`}>
              <h3 id={`season-${s.season}`} className="border-b border-rule pb-1 font-serif text-base font-bold">
                {s.season}
              </h3>
              <dl className="mt-2 grid grid-cols-[8rem_1fr] gap-x-3 gap-y-2">
                {s.prescriptions.length ? (
                  <>
                    <dt className="text-slate">Prescribed</dt>
                    <dd>
                      {s.prescriptions.map((p) => (
                        <p key={p.id}>
                          <strong>{p.practiceName}</strong> ({formatCents(p.totalCents)}). {p.summary}
                        </p>
                      ))}
                    </dd>
                  </>
                ) : null}
                {s.work.length ? (
                  <>
                    <dt className="text-slate">Work</dt>
                    <dd>
                      <ul>
                        {s.work.map((w) => (
                          <li key={w.taskId}>
                            {w.name}: {TASK_STATUS_LABELS[w.status as TaskStatus] ?? w.status}
                            {w.doneOn ? ` ${formatDay(w.doneOn)}` : ''}
                            {w.quantitiesUsed.length ? ` — used ${w.quantitiesUsed.map((q) => `${formatNumber(q.amount, q.amount % 1 === 0 ? 0 : 2)} ${q.unit} ${q.label}`).join(', ')}` : ''}
                          </li>
                        ))}
                      </ul>
                    </dd>
                  </>
                ) : null}
                {s.checks.length ? (
                  <>
                    <dt className="text-slate">Checks</dt>
                    <dd>
                      <ul>
                        {s.checks.map((c) => (
                          <li key={c.id}>
                            {CHECK_KIND_LABELS[c.kind]} {formatDay(c.checkedOn)}: {PLOT_STATUS_LABELS[c.status]}
                          </li>
                        ))}
                      </ul>
                    </dd>
                  </>
                ) : null}
                {s.observations ? (
                  <>
                    <dt className="text-slate">Observations</dt>
                    <dd>{s.observations === 1 ? '1 observation logged' : `${s.observations} observations logged`}</dd>
                  </>
                ) : null}
                {s.soilTests.length ? (
                  <>
                    <dt className="text-slate">Soil tests</dt>
                    <dd>
                      <ul>
                        {s.soilTests.map((t) => (
                          <li key={t.id}>
                            {formatDay(t.sampledOn)}, {t.lab}: pH {t.ph}; lime {t.lime.tonsPerAcre} t/acre, P2O5 {t.nutrients.p2o5LbPerAcre}, K2O {t.nutrients.k2oLbPerAcre} lb/acre
                          </li>
                        ))}
                      </ul>
                    </dd>
                  </>
                ) : null}
              </dl>
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
