/** Observations per month as stacked bars by kind (recharts; a lazy chunk). */
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { OBSERVATION_KINDS, OBSERVATION_KIND_STYLES } from '../../../../shared/domain/observations';
import type { ObservationSummaryDto } from '../../../../shared/schemas/observation';

export default function ObservationChart({ summary }: { summary: ObservationSummaryDto }) {
  const kinds = OBSERVATION_KINDS.filter((k) => summary.rows.some((r) => (r.byKind[k] ?? 0) > 0));
  const data = summary.rows.map((r) => ({ label: r.label, ...r.byKind }));
  return (
    <div className="h-56 w-full" aria-label="Observations per month, by kind">
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -16 }}>
          <CartesianGrid strokeDasharray="3 3" vertical={false} />
          <XAxis dataKey="label" tick={{ fontSize: 11 }} />
          <YAxis allowDecimals={false} tick={{ fontSize: 11 }} />
          <Tooltip />
          <Legend wrapperStyle={{ fontSize: 11 }} />
          {kinds.map((k) => (
            <Bar key={k} dataKey={k} name={OBSERVATION_KIND_STYLES[k].label} stackId="kinds" fill={OBSERVATION_KIND_STYLES[k].colour} isAnimationActive={false} />
          ))}
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
