import type { PlanSummary } from '../../../../shared/schemas/unit';
import { KIND_STYLES, isUnitKind, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { formatAcresShort, formatPct } from '../lib/measure-format';
import { KindSwatch } from './kind-swatch';

type Row = PlanSummary['shareByKind'][number];

const segmentColour = (kind: string) => (isUnitKind(kind) ? KIND_STYLES[kind].fill : '#FFFDF7');

/** The property's acres by kind as one stacked bar, with the share table under it. */
export function ShareBar({ rows, boundaryAcres }: { rows: Row[]; boundaryAcres: number | null }) {
  const total = Math.max(boundaryAcres ?? 0, rows.reduce((s, r) => s + r.acres, 0));
  if (!boundaryAcres || total <= 0) {
    return <p className="text-sm text-slate">Draw or import the property boundary to see acres by kind.</p>;
  }
  return (
    <div className="flex flex-col gap-2">
      <div
        role="img"
        aria-label={`Acres by kind: ${rows.map((r) => `${r.label} ${formatAcresShort(r.acres)}`).join(', ')}`}
        className="flex h-5 w-full overflow-hidden rounded border border-rule bg-card"
      >
        {rows
          .filter((r) => r.acres > 0)
          .map((r) => (
            <div
              key={r.kind}
              title={`${r.label}: ${formatAcresShort(r.acres)} (${formatPct(r.pctOfProperty)})`}
              style={{
                width: `${(r.acres / total) * 100}%`,
                backgroundColor: segmentColour(r.kind),
                backgroundImage: r.kind === 'unassigned' ? 'repeating-linear-gradient(135deg, transparent 0 4px, #D9D3C3 4px 5px)' : undefined,
              }}
              className="h-full border-r border-card last:border-r-0"
            />
          ))}
      </div>
      <table className="w-full text-sm" aria-label="Share of the property by kind">
        <thead>
          <tr className="text-left text-xs uppercase tracking-wide text-slate">
            <th className="py-1 font-semibold">Kind</th>
            <th className="py-1 text-right font-semibold">Acres</th>
            <th className="py-1 text-right font-semibold">Share</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.kind} className="border-t border-rule/60">
              <td className="py-1">
                <span className="inline-flex items-center gap-2">
                  <KindSwatch kind={isUnitKind(r.kind) ? (r.kind as UnitKind) : 'unassigned'} size={12} />
                  {r.label}
                </span>
              </td>
              <td className="py-1 text-right tabular-nums">{formatAcresShort(r.acres)}</td>
              <td className="py-1 text-right tabular-nums text-slate">{formatPct(r.pctOfProperty)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
