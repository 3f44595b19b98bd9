import { useMemo } from 'react';
import type { PlanSummary, UnitDto } from '../../../../shared/schemas/unit';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { groupByKind } from '../lib/unit-features';
import { formatAcresShort, formatFeet } from '../lib/measure-format';
import { KindSwatch } from './kind-swatch';
import { ShareBar } from './share-bar';
import type { UnitWorkStatus } from '../../../../shared/domain/tasks';
import { UNIT_STATUS_STYLES, UNIT_WORK_STATUSES } from '../../../lib/work-status';
import type { ColourBy } from '../lib/plan-layers';

/** The "Colour by" switch of the ledger: kind (the default) or work status. */
export function ColourByToggle({ value, onChange }: { value: ColourBy; onChange: (v: ColourBy) => void }) {
  return (
    <div role="group" aria-label="Colour by" className="flex items-center gap-2 text-sm">
      <span className="text-slate">Colour by</span>
      <span className="inline-flex rounded border border-rule bg-card p-0.5">
        {(
          [
            ['kind', 'Kind'],
            ['status', 'Work status'],
          ] as const
        ).map(([v, label]) => (
          <button
            key={v}
            type="button"
            aria-pressed={value === v}
            onClick={() => onChange(v)}
            className={`rounded px-2.5 py-0.5 font-semibold ${value === v ? 'bg-moss text-white' : 'text-ink hover:bg-rule/40'}`}
          >
            {label}
          </button>
        ))}
      </span>
    </div>
  );
}

/** The work statuses with their map colours and how many units are in each. */
function StatusLegend({ units, statuses }: { units: UnitDto[]; statuses: ReadonlyMap<number, UnitWorkStatus> }) {
  const counts = new Map<UnitWorkStatus, number>();
  for (const u of units) {
    if (KIND_STYLES[u.kind].family === 'point') continue;
    const s = statuses.get(u.id) ?? 'no-work';
    counts.set(s, (counts.get(s) ?? 0) + 1);
  }
  return (
    <section aria-labelledby="ledger-status">
      <h2 id="ledger-status" className="mb-2 text-base font-bold">
        Work status
      </h2>
      <ul aria-label="Work status legend" className="flex flex-col gap-1 text-sm">
        {UNIT_WORK_STATUSES.map((s) => (
          <li key={s} data-legend-status={s} className="flex items-center gap-2">
            <span aria-hidden className="inline-block size-3.5 rounded-sm border" style={{ background: UNIT_STATUS_STYLES[s].fill, borderColor: UNIT_STATUS_STYLES[s].stroke }} />
            <span className="flex-1">{UNIT_STATUS_STYLES[s].label}</span>
            <span className="tabular-nums text-slate">
              {counts.get(s) ?? 0} unit{(counts.get(s) ?? 0) === 1 ? '' : 's'}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}

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
  colourBy = 'kind',
  onColourBy,
  statuses,
}: {
  units: UnitDto[];
  plan: PlanSummary | undefined;
  planError: unknown;
  selectedId: number | null;
  onSelect: (unitId: number) => void;
  colourBy?: ColourBy;
  onColourBy?: (by: ColourBy) => void;
  /** Each unit's work status, when the plan has tasks. */
  statuses?: ReadonlyMap<number, UnitWorkStatus>;
}) {
  const byStatus = colourBy === 'status' && statuses !== undefined;
  const groups = useMemo(() => groupByKind(units), [units]);
  const names = useMemo(() => new Map(units.map((u) => [u.id, u.name])), [units]);
  return (
    <div className="flex flex-col gap-5">
      {onColourBy ? <ColourByToggle value={colourBy} onChange={onColourBy} /> : null}
      {byStatus ? <StatusLegend units={units} statuses={statuses} /> : null}
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
                          {byStatus && style.family !== 'point' ? (
                            <span data-unit-status={statuses.get(u.id) ?? 'no-work'} className="flex shrink-0 items-center gap-1 text-xs text-slate">
                              <span aria-hidden className="inline-block size-2.5 rounded-sm" style={{ background: UNIT_STATUS_STYLES[statuses.get(u.id) ?? 'no-work'].fill }} />
                              {UNIT_STATUS_STYLES[statuses.get(u.id) ?? 'no-work'].label}
                            </span>
                          ) : null}
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
