import { useMemo } from 'react';
import type { PlanSummary, UnitDto } from '../../../../shared/schemas/unit';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { groupByKind } from '../lib/unit-features';
import { formatAcresShort, formatFeet } from '../lib/measure-format';
import { KindSwatch } from './kind-swatch';
import { ShareBar } from './share-bar';

function unitMeasure(u: UnitDto): string {
  if (u.family === 'area' || KIND_STYLES[u.kind].family === 'area') return formatAcresShort(u.acres ?? 0);
  if (u.family === 'line' || KIND_STYLES[u.kind].family === 'line') return formatFeet(u.lengthFt ?? 0);
  return '';
}

/**
 * The plan ledger: acres by kind as a stacked bar and a table, the units grouped by kind with their
 * acres or length, and the plan's warnings in clay. A click on a unit selects it.
 */
export function PlanLedger({
  units,
  plan,
  planError,
  selectedId,
  onSelect,
}: {
  units: UnitDto[];
  plan: PlanSummary | undefined;
  planError: unknown;
  selectedId: number | null;
  onSelect: (unitId: number) => void;
}) {
  const groups = useMemo(() => groupByKind(units), [units]);
  const names = useMemo(() => new Map(units.map((u) => [u.id, u.name])), [units]);
  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="ledger-share">
        <h2 id="ledger-share" className="mb-2 text-base font-bold">
          Acres by kind
          {plan?.boundaryAcres ? <span className="figure ml-2 text-sm font-normal text-slate">of {formatAcresShort(plan.boundaryAcres)}</span> : null}
        </h2>
        {plan ? <ShareBar rows={plan.shareByKind} boundaryAcres={plan.boundaryAcres} /> : planError ? <ErrorPanel error={planError} /> : <Loading />}
      </section>

      {plan && plan.warnings.length > 0 ? (
        <section aria-labelledby="ledger-warnings" className="rounded-md border-l-4 border-clay bg-clay/5 px-3 py-2">
          <h2 id="ledger-warnings" className="mb-1 text-sm font-bold text-clay">
            Plan warnings ({plan.warnings.length})
          </h2>
          <ul className="flex flex-col gap-1.5 text-sm text-ink">
            {plan.warnings.map((w, i) => (
              <li key={`${w.code}-${i}`}>
                {w.unitIds.length > 0 && names.has(w.unitIds[0]) ? (
                  <button type="button" className="text-left hover:underline" onClick={() => onSelect(w.unitIds[0])}>
                    {w.message}
                  </button>
                ) : (
                  w.message
                )}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="ledger-units">
        <h2 id="ledger-units" className="mb-2 text-base font-bold">
          Units <span className="text-sm font-normal text-slate">({units.length})</span>
        </h2>
        {units.length === 0 ? (
          <EmptyState title="No units yet">Choose a kind along the top of the map and draw it, or import a file.</EmptyState>
        ) : (
          <div className="flex flex-col gap-3">
            {groups.map((g) => {
              const style = KIND_STYLES[g.kind];
              const total =
                style.family === 'area'
                  ? formatAcresShort(g.units.reduce((s, u) => s + (u.acres ?? 0), 0))
                  : style.family === 'line'
                    ? formatFeet(g.units.reduce((s, u) => s + (u.lengthFt ?? 0), 0))
                    : `${g.units.length}`;
              return (
                <div key={g.kind}>
                  <h3 className="flex items-center gap-2 border-b border-rule pb-1 font-sans text-sm font-semibold">
                    <KindSwatch kind={g.kind} size={14} />
                    <span className="flex-1">{style.label}</span>
                    <span className="tabular-nums text-slate">{total}</span>
                  </h3>
                  <ul aria-label={style.label} className="mt-1 flex flex-col">
                    {g.units.map((u) => (
                      <li key={u.id}>
                        <button
                          type="button"
                          aria-current={u.id === selectedId ? 'true' : undefined}
                          onClick={() => onSelect(u.id)}
                          className={`flex w-full items-baseline justify-between gap-2 rounded px-2 py-1 text-left text-sm ${u.id === selectedId ? 'bg-moss/10 font-semibold text-moss-deep' : 'hover:bg-rule/40'}`}
                        >
                          <span className="truncate">{u.name}</span>
                          <span className="shrink-0 tabular-nums text-slate">{unitMeasure(u)}</span>
                        </button>
                      </li>
                    ))}
                  </ul>
                </div>
              );
            })}
          </div>
        )}
      </section>
    </div>
  );
}
