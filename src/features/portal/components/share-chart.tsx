import { Cell, Pie, PieChart, ResponsiveContainer } from 'recharts';
import { KIND_STYLES, isUnitKind } from '../../../../shared/domain/unit-kinds';
import type { PortalPropertyDetail } from '../../../../shared/schemas/portal';

type Row = PortalPropertyDetail['shareByKind'][number];

const colour = (kind: string) => (isUnitKind(kind) ? KIND_STYLES[kind].fill : '#E9E4D6');
const acresText = (a: number) => `${a.toLocaleString('en-US', { maximumFractionDigits: a < 10 ? 2 : 1 })} ac`;
const pctText = (p: number) => `${p.toLocaleString('en-US', { maximumFractionDigits: 1 })} %`;

/** The share of the property by kind: a ring chart in the kind colours beside a table with the numbers. */
export function ShareChart({ rows }: { rows: Row[] }) {
  const shown = rows.filter((r) => r.acres > 0);
  if (shown.length === 0) return <p className="text-sm text-slate">Your consultant has not drawn the plan yet.</p>;
  return (
    <div className="flex flex-col items-center gap-4 sm:flex-row sm:items-start">
      <div className="h-40 w-40 shrink-0" role="img" aria-label={`Share of the property by kind: ${shown.map((r) => `${r.label} ${pctText(r.pctOfProperty)}`).join(', ')}`}>
        <ResponsiveContainer width="100%" height="100%">
          <PieChart accessibilityLayer={false}>
            <Pie data={shown} dataKey="acres" nameKey="label" innerRadius="55%" outerRadius="95%" stroke="#FFFDF7" strokeWidth={2} isAnimationActive={false}>
              {shown.map((r) => (
                <Cell key={r.kind} fill={colour(r.kind)} />
              ))}
            </Pie>
          </PieChart>
        </ResponsiveContainer>
      </div>
      <table className="w-full text-sm">
        <caption className="sr-only">Acres and share of the property by kind</caption>
        <thead>
          <tr className="text-left text-xs uppercase tracking-wide text-slate">
            <th scope="col" className="py-1 font-semibold">Kind</th>
            <th scope="col" className="py-1 text-right font-semibold">Acres</th>
            <th scope="col" className="py-1 text-right font-semibold">Share</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.kind} className="border-t border-rule/60">
              <th scope="row" className="py-1 text-left font-normal">
                <span className="inline-flex items-center gap-2">
                  <span aria-hidden className="inline-block h-3 w-3 rounded-sm border border-rule" style={{ backgroundColor: colour(r.kind) }} />
                  {r.label}
                </span>
              </th>
              <td className="py-1 text-right tabular-nums">{acresText(r.acres)}</td>
              <td className="py-1 text-right tabular-nums text-slate">{pctText(r.pctOfProperty)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
