import { Link } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import type { UnitWorkStatus } from '../../../../shared/domain/tasks';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { UNIT_STATUS_STYLES } from '../../../lib/work-status';
import { paths } from '../../../config/paths';
import { usePropertyProgress } from '../api/get-property-progress';
import { useUpdateProgressSettings } from '../api/update-progress-settings';

/** A unit's work status as a swatch in its map colour and a label. */
export function UnitStatusBadge({ status }: { status: UnitWorkStatus }) {
  const s = UNIT_STATUS_STYLES[status];
  return (
    <span data-unit-status={status} className="inline-flex items-center gap-1.5 whitespace-nowrap text-xs font-semibold text-ink">
      <span aria-hidden className="inline-block size-3 rounded-sm border" style={{ background: s.fill, borderColor: s.stroke }} />
      {s.label}
    </span>
  );
}

function Meter({ label, pct, detail }: { label: string; pct: number; detail: string }) {
  return (
    <div className="min-w-0">
      <div className="flex items-baseline justify-between gap-2">
        <span className="text-xs uppercase tracking-wide text-slate">{label}</span>
        <span className="figure text-xl font-bold tabular-nums text-ink">{pct.toLocaleString('en-US', { maximumFractionDigits: 1 })} %</span>
      </div>
      <div role="meter" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="mt-1 h-2 overflow-hidden rounded-full bg-rule/60">
        <div className="h-full rounded-full bg-moss" style={{ width: `${Math.min(100, pct)}%` }} />
      </div>
      <p className="mt-0.5 text-xs text-slate">{detail}</p>
    </div>
  );
}

/** A property's work progress: the plan by count and by cost, each unit's status, and the client's e-mail setting. */
export function ProgressCard({ propertyId }: { propertyId: number }) {
  const progress = usePropertyProgress(propertyId);
  const settings = useUpdateProgressSettings(propertyId);
  const toast = useToast();
  return (
    <Card
      title="Progress"
      action={
        <Link to={paths.scheduleForProperty(propertyId)} className="text-sm text-moss-deep hover:underline">
          Open in the schedule
        </Link>
      }
    >
      {progress.isPending ? (
        <Loading label="Loading progress…" />
      ) : progress.isError ? (
        <ErrorPanel error={progress.error} onRetry={() => void progress.refetch()} />
      ) : progress.data.plan.total === 0 ? (
        <EmptyState title="No work on the schedule yet">Tasks are made from each prescription’s steps when the landowner approves a proposal.</EmptyState>
      ) : (
        <div className="flex flex-col gap-4">
          <div className="grid gap-4 sm:grid-cols-2">
            <Meter
              label="Done by count"
              pct={progress.data.plan.percentByCount}
              detail={`${progress.data.plan.done} of ${progress.data.plan.total - progress.data.plan.skipped} tasks${progress.data.plan.skipped ? ` (${progress.data.plan.skipped} skipped)` : ''}`}
            />
            <Meter label="Done by cost" pct={progress.data.plan.percentByCost} detail={`${formatCents(progress.data.plan.doneCostCents)} of ${formatCents(progress.data.plan.totalCostCents)}`} />
          </div>
          <table className="w-full text-sm tabular-nums">
            <caption className="sr-only">Progress by unit</caption>
            <thead>
              <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
                <th className="py-1.5 font-semibold">Unit</th>
                <th className="py-1.5 font-semibold">Status</th>
                <th className="hidden py-1.5 text-right font-semibold sm:table-cell">Tasks</th>
                <th className="py-1.5 text-right font-semibold">By cost</th>
              </tr>
            </thead>
            <tbody>
              {progress.data.units.map((u) => (
                <tr key={u.unitId} className="border-b border-rule/60 last:border-0">
                  <td className="py-1.5 pr-2">
                    <Link to={`${paths.scheduleForProperty(propertyId)}&view=timeline`} className="font-semibold text-ink hover:underline">
                      {u.unitName}
                    </Link>
                  </td>
                  <td className="py-1.5 pr-2">
                    <UnitStatusBadge status={u.status} />
                  </td>
                  <td className="hidden py-1.5 text-right sm:table-cell">
                    {u.done}/{u.total - u.skipped}
                  </td>
                  <td className="py-1.5 text-right">{u.percentByCost.toLocaleString('en-US', { maximumFractionDigits: 1 })} %</td>
                </tr>
              ))}
            </tbody>
          </table>
          <label className="flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              className="mt-1 size-4 accent-moss"
              checked={progress.data.notifyClientOnUnitDone}
              disabled={settings.isPending}
              onChange={(e) =>
                settings.mutate(e.target.checked, {
                  onSuccess: (d) => toast('success', d.notifyClientOnUnitDone ? 'The client will get an e-mail when a unit’s work is finished.' : 'No e-mail to the client when a unit is finished.'),
                  onError: (err) => toast('error', `The setting was not saved: ${err.message}`),
                })
              }
            />
            <span>
              E-mail the client when a unit’s work is finished
              <span className="block text-xs text-slate">One short message per unit, sent when its last task is done.</span>
            </span>
          </label>
        </div>
      )}
    </Card>
  );
}
