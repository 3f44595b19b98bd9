/** This season and last, unit by unit: what the checks found, the soil-test pH and the work done. Read-only; stacks on a phone. */
import type { SeasonCell, SeasonComparisonRow } from '../../../../shared/domain/season-comparison';
import type { SeasonComparisonDto } from '../../../../shared/schemas/season-comparison';
import { PLOT_STATUS_LABELS } from '../../../../shared/schemas/checks';
import { formatAcres } from '../../../lib/format';

const TONE: Record<string, string> = {
  established: 'border-moss text-moss-deep bg-card',
  thin: 'border-ochre text-ink bg-card',
  failed: 'border-clay text-clay bg-card',
  'browsed-hard': 'border-clay text-clay bg-card',
  'over-target': 'border-ochre text-ink bg-card',
  checked: 'border-rule text-slate bg-card',
};

function Status({ status }: { status: SeasonCell['status'] }) {
  if (!status) return <span className="text-xs text-slate">Not checked</span>;
  return <span className={`inline-block self-start rounded border px-2 py-0.5 text-xs font-semibold ${TONE[status] ?? ''}`}>{PLOT_STATUS_LABELS[status]}</span>;
}

function Cell({ label, cell }: { label: string; cell: SeasonCell }) {
  return (
    <div className="flex min-w-0 flex-col gap-1 text-sm">
      <p className="text-xs font-semibold uppercase tracking-wide text-slate">{label}</p>
      <Status status={cell.status} />
      {cell.checks.length ? (
        <ul className="text-xs text-slate">
          {cell.checks.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      ) : null}
      <p>
        <span className="text-slate">Soil pH </span>
        <span className="font-semibold tabular-nums">{cell.soilPh === null ? '—' : cell.soilPh.toFixed(1)}</span>
      </p>
      <p>
        <span className="text-slate">Work done </span>
        <span className="font-semibold tabular-nums">{cell.tasksTotal === 0 ? '—' : `${cell.tasksDone} of ${cell.tasksTotal}`}</span>
      </p>
      {cell.workDone.length ? <p className="text-xs text-slate">{cell.workDone.join(' · ')}</p> : null}
    </div>
  );
}

function Row({ row, season, previousSeason }: { row: SeasonComparisonRow; season: number; previousSeason: number }) {
  return (
    <li className="rounded-md border border-rule bg-card p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-bold">{row.unitName}</h3>
        <span className="text-xs text-slate">
          {row.kind.replace(/-/g, ' ')} · {formatAcres(row.acres)}
        </span>
      </div>
      <div className="mt-2 grid grid-cols-2 gap-3">
        <Cell label={String(previousSeason)} cell={row.previous} />
        <Cell label={String(season)} cell={row.current} />
      </div>
      {row.phChange !== null && row.phChange !== 0 ? (
        <p className="mt-2 text-xs text-slate">
          pH {row.phChange > 0 ? 'up' : 'down'} {Math.abs(row.phChange).toFixed(1)} since {previousSeason}
        </p>
      ) : null}
    </li>
  );
}

/** The comparison as cards, one per unit, the two seasons in two columns. */
export function SeasonComparisonList({ data }: { data: SeasonComparisonDto }) {
  if (data.rows.length === 0) {
    return <p className="text-sm text-slate">Nothing was recorded on this land in {data.previousSeason} or {data.season} yet: checks, soil tests and finished work will show here as your consultant records them.</p>;
  }
  return (
    <ul className="flex flex-col gap-3">
      {data.rows.map((row) => (
        <Row key={row.unitId} row={row} season={data.season} previousSeason={data.previousSeason} />
      ))}
    </ul>
  );
}
