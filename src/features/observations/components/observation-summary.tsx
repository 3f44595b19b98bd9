/** Counts of observations per unit and per month, as tables, with the months also as a chart (lazy). */
import { lazy, Suspense, useState } from 'react';
import { Loading } from '../../../components/ui/card';
import { OBSERVATION_KINDS, OBSERVATION_KIND_STYLES } from '../../../../shared/domain/observations';
import { useObservationSummary } from '../api/get-observation-summary';

const ObservationChart = lazy(() => import('./observation-chart'));

export function ObservationSummary({ propertyId }: { propertyId: number }) {
  const [by, setBy] = useState<'unit' | 'month'>('unit');
  const summary = useObservationSummary(propertyId, by);
  if (summary.isPending) return <Loading label="Counting observations…" />;
  if (!summary.data || summary.data.total === 0) return <p className="text-sm text-slate">No observations yet. Log the first sign from the field sheet or with “Log sign” here.</p>;
  const kinds = OBSERVATION_KINDS.filter((k) => summary.data.rows.some((r) => (r.byKind[k] ?? 0) > 0));
  return (
    <div className="flex flex-col gap-2">
      <div role="group" aria-label="Count by" className="flex gap-2 text-sm">
        {(['unit', 'month'] as const).map((b) => (
          <button key={b} type="button" aria-pressed={by === b} onClick={() => setBy(b)} className={`rounded border px-2 py-0.5 ${by === b ? 'border-moss bg-moss/10 font-semibold' : 'border-rule'}`}>
            By {b}
          </button>
        ))}
      </div>
      {by === 'month' ? (
        <Suspense fallback={<Loading label="Drawing the chart…" />}>
          <ObservationChart summary={summary.data} />
        </Suspense>
      ) : null}
      <div className="overflow-x-auto">
        <table className="w-full text-sm" aria-label={`Observations by ${by}`}>
          <thead>
            <tr className="border-b border-rule text-left">
              <th className="py-1 pr-2">{by === 'unit' ? 'Unit' : 'Month'}</th>
              {kinds.map((k) => (
                <th key={k} className="px-1 py-1 text-right font-semibold">
                  {OBSERVATION_KIND_STYLES[k].label}
                </th>
              ))}
              <th className="py-1 pl-2 text-right">Total</th>
            </tr>
          </thead>
          <tbody>
            {summary.data.rows.map((r) => (
              <tr key={r.key} className="border-b border-rule/50">
                <td className="py-1 pr-2">{r.label}</td>
                {kinds.map((k) => (
                  <td key={k} className="figure px-1 py-1 text-right">
                    {r.byKind[k] || ''}
                  </td>
                ))}
                <td className="figure py-1 pl-2 text-right font-semibold">{r.total}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
