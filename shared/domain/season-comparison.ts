/**
 * Two seasons side by side for the landowner: per unit, what the checks found, the soil-test pH and
 * the work done, this season against last. Pure; the server gathers the records, the portal and the
 * season report read the same rows.
 */
import { PLOT_STATUS_LABELS } from '../schemas/checks';
import type { PlotCheckStatus } from './plot-checks';
import { formatDate } from './clock';

/** A check as the comparison needs it: its kind, date, status and computed figures. */
export interface ComparisonCheck {
  kind: 'establishment' | 'browse' | 'timber';
  checkedOn: string;
  status: PlotCheckStatus;
  result: Record<string, unknown>;
}

/** Everything recorded on one unit in one season. */
export interface SeasonUnitRecord {
  unitId: number;
  unitName: string;
  kind: string;
  acres: number | null;
  season: number;
  checks: ComparisonCheck[];
  soilTests: { sampledOn: string; ph: number }[];
  tasks: { name: string; status: string }[];
}

/** One unit's season in the comparison. */
export interface SeasonCell {
  /** The latest check's plot status; null without a check that season. */
  status: PlotCheckStatus | null;
  /** One plain sentence per check, oldest first. */
  checks: string[];
  /** The latest soil-test pH of the season; null without a test. */
  soilPh: number | null;
  tasksDone: number;
  tasksTotal: number;
  /** Names of the work done, in order. */
  workDone: string[];
}

export interface SeasonComparisonRow {
  unitId: number;
  unitName: string;
  kind: string;
  acres: number | null;
  previous: SeasonCell;
  current: SeasonCell;
  /** pH this season minus last; null unless both seasons have a test. */
  phChange: number | null;
}

export interface SeasonComparison {
  season: number;
  previousSeason: number;
  rows: SeasonComparisonRow[];
}

const round1 = (n: number) => Math.round(n * 10) / 10;
const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** A check in one sentence a landowner can read: the stand's status, the share deer ate, or basal area against target. */
export function checkOutcomeText(check: ComparisonCheck): string {
  const r = check.result;
  const on = formatDate(check.checkedOn);
  if (check.kind === 'establishment') return `${PLOT_STATUS_LABELS[check.status]} (${on})`;
  if (check.kind === 'browse') {
    const use = num(r.overallUsePct);
    return use === null ? `Browse checked (${on})` : `Deer ate ${Math.round(use)} % of the forage (${on})`;
  }
  const ba = num(r.basalAreaSqFtPerAcre);
  const target = num(r.targetResidualBaSqFtPerAcre);
  if (ba === null) return `Timber cruised (${on})`;
  return `Basal area ${Math.round(ba)} ft²/acre${target === null ? '' : ` against a target of ${Math.round(target)}`} (${on})`;
}

const EMPTY: SeasonCell = { status: null, checks: [], soilPh: null, tasksDone: 0, tasksTotal: 0, workDone: [] };

/** Sums one unit's record for a season into a cell. */
export function seasonCell(record: SeasonUnitRecord | undefined): SeasonCell {
  if (!record) return { ...EMPTY, checks: [], workDone: [] };
  const checks = [...record.checks].sort((a, b) => a.checkedOn.localeCompare(b.checkedOn));
  const tests = [...record.soilTests].sort((a, b) => a.sampledOn.localeCompare(b.sampledOn));
  const done = record.tasks.filter((t) => t.status === 'done');
  const counted = record.tasks.filter((t) => t.status !== 'skipped');
  return {
    status: checks.at(-1)?.status ?? null,
    checks: checks.map(checkOutcomeText),
    soilPh: tests.at(-1)?.ph ?? null,
    tasksDone: done.length,
    tasksTotal: counted.length,
    workDone: done.map((t) => t.name),
  };
}

/** The season to show (the asked one, else the latest with any record, else `today`'s year) and the one before it. */
export function pickSeasons(recorded: readonly number[], asked: number | null, todayYear: number): { season: number; previousSeason: number } {
  const season = asked ?? (recorded.length ? Math.max(...recorded) : todayYear);
  return { season, previousSeason: season - 1 };
}

/** Rows for every unit with a record in either season, by unit name. */
export function compareSeasons(records: readonly SeasonUnitRecord[], season: number, previousSeason: number): SeasonComparison {
  const byUnit = new Map<number, { meta: SeasonUnitRecord; seasons: Map<number, SeasonUnitRecord> }>();
  for (const r of records) {
    if (r.season !== season && r.season !== previousSeason) continue;
    const entry = byUnit.get(r.unitId) ?? { meta: r, seasons: new Map() };
    entry.seasons.set(r.season, r);
    byUnit.set(r.unitId, entry);
  }
  const rows = [...byUnit.values()]
    .map(({ meta, seasons }) => {
      const previous = seasonCell(seasons.get(previousSeason));
      const current = seasonCell(seasons.get(season));
      const phChange = previous.soilPh !== null && current.soilPh !== null ? round1(current.soilPh - previous.soilPh) : null;
      return { unitId: meta.unitId, unitName: meta.unitName, kind: meta.kind, acres: meta.acres, previous, current, phChange };
    })
    .sort((a, b) => a.unitName.localeCompare(b.unitName));
  return { season, previousSeason, rows };
}
