/**
 * Hunting pressure per stand from the sit log: sits, hours, days rested since the last sit, deer seen
 * per hour, sits made on a wind the stand does not suit, and sits in the last seven days against the
 * firm's limit. Dates are the firm's calendar dates ("today" in its zone).
 */
import { todayIn, type IsoDate } from './clock';
import type { WindJudgement, WindName } from './stand-winds';

export interface PressureSit {
  standUnitId: number;
  startedAt: Date;
  endedAt: Date;
  windFrom: WindName | null;
  bucks: number;
  does: number;
  fawns: number;
}

export interface PressureStand {
  unitId: number;
  name: string;
  winds: readonly Pick<WindJudgement, 'from' | 'suitable'>[];
}

export interface StandPressure {
  unitId: number;
  name: string;
  sits: number;
  hours: number;
  lastSitOn: IsoDate | null;
  daysSinceLastSit: number | null;
  deerPerHour: number | null;
  sitsOnUnsuitableWind: number;
  sitsThisWeek: number;
  overPressured: boolean;
}

const dayNumber = (d: IsoDate) => Date.UTC(Number(d.slice(0, 4)), Number(d.slice(5, 7)) - 1, Number(d.slice(8, 10))) / 86400000;
const round = (v: number, places: number) => Math.round(v * 10 ** places) / 10 ** places;

/** Whole days from `from` to `to` (both YYYY-MM-DD). */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return Math.round(dayNumber(to) - dayNumber(from));
}

/** Whether a stand suits a wind (null when the wind is not given). */
export function suitsWind(stand: PressureStand, wind: WindName | null): boolean | null {
  if (!wind) return null;
  return stand.winds.find((w) => w.from === wind)?.suitable ?? null;
}

/** Pressure on every stand (stands without sits included) as of `today` in `zone`. */
export function standPressure(stands: readonly PressureStand[], sits: readonly PressureSit[], today: IsoDate, zone: string, maxSitsPerWeek: number): StandPressure[] {
  return stands.map((stand) => {
    const mine = sits.filter((s) => s.standUnitId === stand.unitId);
    const hours = mine.reduce((sum, s) => sum + (s.endedAt.getTime() - s.startedAt.getTime()) / 3600_000, 0);
    const deer = mine.reduce((sum, s) => sum + s.bucks + s.does + s.fawns, 0);
    const days = mine.map((s) => todayIn(zone, s.startedAt)).sort();
    const lastSitOn = days.length ? days[days.length - 1]! : null;
    const sitsThisWeek = days.filter((d) => {
      const ago = daysBetween(d, today);
      return ago >= 0 && ago < 7;
    }).length;
    return {
      unitId: stand.unitId,
      name: stand.name,
      sits: mine.length,
      hours: round(hours, 2),
      lastSitOn,
      daysSinceLastSit: lastSitOn ? daysBetween(lastSitOn, today) : null,
      deerPerHour: hours > 0 ? round(deer / hours, 2) : null,
      sitsOnUnsuitableWind: mine.filter((s) => suitsWind(stand, s.windFrom) === false).length,
      sitsThisWeek,
      overPressured: sitsThisWeek > maxSitsPerWeek,
    };
  });
}
