/**
 * A season's results put together: the hunting season's dates, the acres established by finished
 * work, and camera surveys compared season over season. Pure functions over plain data.
 *
 * A season is the hunting season named by the year it starts, July through June
 * (`huntingSeasonOf` in survey-estimates.ts): season 2025 runs 2025-07-01 to 2026-06-30.
 */
import { DomainValidationError } from './errors';
import { huntingSeasonOf, type DeerSex, type SurveyEstimates } from './survey-estimates';
import { progressByUnit, type ProgressInput } from './tasks';

export interface SeasonRange {
  season: number;
  /** "2025–26". */
  label: string;
  startsOn: string;
  endsOn: string;
}

/** The dates and label of a hunting season (July–June) named by the year it starts. */
export function seasonRange(season: number): SeasonRange {
  if (!Number.isInteger(season) || season < 1900 || season > 2999) {
    throw new DomainValidationError('season', `Season must be a year such as 2025 (got ${String(season)}).`);
  }
  return {
    season,
    label: `${season}–${String((season + 1) % 100).padStart(2, '0')}`,
    startsOn: `${season}-07-01`,
    endsOn: `${season + 1}-06-30`,
  };
}

/** True when a "YYYY-MM-DD" date falls in the season. */
export function inSeason(date: string, season: number): boolean {
  return huntingSeasonOf(date) === season;
}

/** The harvest record's sex in the API ('male' | 'female') as the harvest summary counts it. */
export function deerSexOf(sex: 'male' | 'female'): DeerSex {
  return sex === 'male' ? 'buck' : 'doe';
}

export interface EstablishedUnitInput {
  id: number;
  acres: number | null;
}

export interface EstablishedTaskInput extends ProgressInput {
  doneOn: string | null;
}

/**
 * Units established in a season: every task of the unit is done or skipped, at least one is done,
 * and the last one was finished within the season. Answers their ids and the sum of their acres
 * (units without an area, such as camera sites or trails, add nothing).
 */
export function acresEstablished(units: readonly EstablishedUnitInput[], tasks: readonly EstablishedTaskInput[], season: number): { unitIds: number[]; acres: number } {
  const range = seasonRange(season);
  const progress = progressByUnit(tasks);
  const lastDone = new Map<number, string>();
  for (const t of tasks) {
    if (t.unitId === null || t.status !== 'done' || !t.doneOn) continue;
    const prev = lastDone.get(t.unitId);
    if (!prev || t.doneOn > prev) lastDone.set(t.unitId, t.doneOn);
  }
  const unitIds: number[] = [];
  let acres = 0;
  for (const unit of units) {
    const p = progress.get(unit.id);
    const last = lastDone.get(unit.id);
    if (!p || p.status !== 'done' || !last || last < range.startsOn || last > range.endsOn) continue;
    unitIds.push(unit.id);
    acres += unit.acres ?? 0;
  }
  return { unitIds, acres };
}

export interface TrendSurveyInput {
  id: number;
  name: string;
  startDate: string;
  endDate: string;
  estimates: SurveyEstimates | null;
}

export interface SurveyTrendRow {
  season: number;
  label: string;
  surveyId: number;
  surveyName: string;
  bucks: number;
  does: number;
  fawns: number;
  total: number;
  deerPerSqMi: number;
  buckDoeRatio: number;
  fawnDoeRatio: number | null;
}

/**
 * Surveys compared season over season, oldest first: one row per season, from the season's latest
 * survey (by end date, then id). Surveys without estimates are left out.
 */
export function surveyTrend(surveys: readonly TrendSurveyInput[]): SurveyTrendRow[] {
  const bySeason = new Map<number, TrendSurveyInput & { estimates: SurveyEstimates }>();
  for (const s of surveys) {
    if (!s.estimates) continue;
    const season = huntingSeasonOf(s.startDate, 'startDate');
    const prev = bySeason.get(season);
    if (!prev || s.endDate > prev.endDate || (s.endDate === prev.endDate && s.id > prev.id)) bySeason.set(season, { ...s, estimates: s.estimates });
  }
  return [...bySeason.entries()]
    .sort(([a], [b]) => a - b)
    .map(([season, s]) => ({
      season,
      label: seasonRange(season).label,
      surveyId: s.id,
      surveyName: s.name,
      bucks: s.estimates.bucks,
      does: s.estimates.does,
      fawns: s.estimates.fawns,
      total: s.estimates.total,
      deerPerSqMi: s.estimates.deerPerSqMi,
      buckDoeRatio: s.estimates.buckDoeRatio,
      fawnDoeRatio: s.estimates.fawnDoeRatio,
    }));
}

/** What a season has to report: finished work, camera surveys and harvest records, counted. */
export interface SeasonContents {
  work: number;
  surveys: number;
  harvests: number;
}

/**
 * The sentence refusing a season report with nothing in it (no finished work, survey or harvest
 * record in the season), or null when there is something to report.
 */
export function emptySeasonReason(contents: SeasonContents, seasonLabel: string): string | null {
  if (contents.work > 0 || contents.surveys > 0 || contents.harvests > 0) return null;
  return `There is nothing to report for the ${seasonLabel} season yet: no finished work, camera survey or harvest record falls in it. Record one, or pick another season, then make the report.`;
}

/** The acres line of a season report: the established units, or what there is when none is finished. */
export function establishedText(acres: number, units: readonly { name: string; acresText: string | null }[], workCount: number): string {
  if (units.length === 0 || acres <= 0) {
    return workCount > 0
      ? `${workCount} ${workCount === 1 ? 'task was' : 'tasks were'} finished this season; no unit has all of its work finished yet, so no acres are counted as established.`
      : 'No unit has all of its work finished yet, so no acres are counted as established.';
  }
  return `established this season: ${units.map((u) => (u.acresText ? `${u.name} (${u.acresText})` : u.name)).join(', ')}.`;
}

/** True when a chart would show at least one bar (a chart of zeros tells the reader nothing). */
export function hasBars(series: readonly { values: readonly (number | null)[] }[]): boolean {
  return series.some((s) => s.values.some((v) => v !== null && v > 0));
}
