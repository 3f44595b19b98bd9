/**
 * A property's wind record: hourly observations from a CSV (time, direction in degrees, speed) or the
 * fixed-width ISD-Lite hourly format (NOAA NCEI, "Integrated Surface Data - Lite, Format
 * Documentation", 2006), filtered to the months and hours that matter, summed into a 16-wind rose.
 */
import { getTimes } from 'suncalc';
import { normalizeDeg } from './geodesic';
import { WIND_NAMES, windSector, type WindName } from './stand-winds';

/** One hourly observation: when (UTC), the direction the wind blows from (null when calm), speed in m/s. */
export interface WindObservation {
  at: Date;
  fromDeg: number | null;
  speedMs: number | null;
}

export type WindFileFormat = 'csv' | 'isd-lite';

export class WindFileError extends Error {}

/** Hunting months by default (September to January): common practice, no source; states differ. */
export const DEFAULT_HUNTING_MONTHS = [9, 10, 11, 12, 1] as const;
/** Legal light is commonly half an hour before sunrise to half an hour after sunset: common practice, no source; states differ. */
export const HUNTING_LIGHT_MARGIN_MIN = 30;

const ISD_LINE = /^\s*\d{4}\s+\d{1,2}\s+\d{1,2}\s+\d{1,2}(\s+-?\d+){8}\s*$/;

/** Which format a wind file is in, or null when neither. */
export function detectWindFormat(text: string): WindFileFormat | null {
  const first = text.split(/\r?\n/).find((l) => l.trim() !== '');
  if (!first) return null;
  if (ISD_LINE.test(first)) return 'isd-lite';
  if (/,/.test(first)) return 'csv';
  return null;
}

const MPH_PER_MS = 3600 / 1609.344;

/** ISD-Lite lines → observations. Direction 0 with speed 0 is calm (the format's note); -9999 is missing. */
export function parseIsdLite(text: string): { observations: WindObservation[]; skipped: number } {
  const observations: WindObservation[] = [];
  let skipped = 0;
  for (const line of text.split(/\r?\n/)) {
    if (line.trim() === '') continue;
    const f = line.trim().split(/\s+/).map(Number);
    if (f.length < 9 || f.some((v) => !Number.isFinite(v))) {
      skipped++;
      continue;
    }
    const [year, month, day, hour, , , , dir, speed10] = f as [number, number, number, number, number, number, number, number, number];
    if (month < 1 || month > 12 || day < 1 || day > 31 || hour < 0 || hour > 23 || dir === -9999) {
      skipped++;
      continue;
    }
    const speedMs = speed10 === -9999 ? null : speed10 / 10;
    const calm = dir === 0 || speedMs === 0;
    if (!calm && (dir < 1 || dir > 360)) {
      skipped++;
      continue;
    }
    observations.push({ at: new Date(Date.UTC(year, month - 1, day, hour)), fromDeg: calm ? null : normalizeDeg(dir), speedMs });
  }
  return { observations, skipped };
}

/**
 * CSV with a header naming `time`, `direction` and optionally `speed` (mph unless the header says
 * m/s). Times are ISO 8601; one without a zone is taken as UTC. Direction 0–360; speed 0 means calm.
 */
export function parseWindCsv(text: string): { observations: WindObservation[]; skipped: number } {
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '');
  const header = (lines.shift() ?? '').split(',').map((h) => h.trim().toLowerCase());
  const ti = header.findIndex((h) => /^(time|date|datetime|timestamp)/.test(h));
  const di = header.findIndex((h) => /^(direction|dir|wind_?dir)/.test(h));
  const si = header.findIndex((h) => /^(speed|wind_?speed)/.test(h));
  if (ti < 0 || di < 0) throw new WindFileError('The CSV needs a header row naming a time column and a direction column, e.g. “time,direction,speed”.');
  const speedInMs = si >= 0 && /m\/?s/.test(header[si]!);
  const observations: WindObservation[] = [];
  let skipped = 0;
  for (const line of lines) {
    const cells = line.split(',').map((c) => c.trim());
    const rawTime = cells[ti] ?? '';
    const at = new Date(/[zZ]|[+-]\d\d:?\d\d$/.test(rawTime) ? rawTime : `${rawTime.replace(' ', 'T')}Z`);
    const dir = Number(cells[di]);
    const speed = si >= 0 && cells[si] !== '' ? Number(cells[si]) : null;
    if (Number.isNaN(at.getTime()) || cells[di] === '' || !Number.isFinite(dir) || dir < 0 || dir > 360 || (speed !== null && (!Number.isFinite(speed) || speed < 0))) {
      skipped++;
      continue;
    }
    const speedMs = speed === null ? null : speedInMs ? speed : speed / MPH_PER_MS;
    observations.push({ at, fromDeg: speedMs === 0 ? null : normalizeDeg(dir), speedMs });
  }
  return { observations, skipped };
}

/** Parses a wind file of either format; throws WindFileError naming the problem when it has no usable rows. */
export function parseWindFile(text: string): { format: WindFileFormat; observations: WindObservation[]; skipped: number } {
  const format = detectWindFormat(text);
  if (!format) throw new WindFileError('The file is neither a CSV with a header (time,direction,speed) nor ISD-Lite hourly lines (year month day hour … wind direction, wind speed).');
  const parsed = format === 'isd-lite' ? parseIsdLite(text) : parseWindCsv(text);
  if (parsed.observations.length === 0) throw new WindFileError(`The file has no usable wind rows (${parsed.skipped} skipped): each row needs a time and a direction from 0 to 360.`);
  return { format, ...parsed };
}

/** The months and hours that count. `hours: 'hunting'` keeps 30 min before sunrise to 30 min after sunset at the property. */
export interface WindFilter {
  months: number[];
  hours: 'hunting' | 'all';
  lat: number;
  lon: number;
  /** IANA zone the months are read in (the firm's). */
  timeZone: string;
}

/** Sunrise and sunset (suncalc, V. Agafonkin; the tests hold it to NOAA's solar calculator) for the solar day around `at` at a place. */
export function sunTimes(at: Date, lat: number, lon: number): { sunrise: Date | null; sunset: Date | null } {
  const t = getTimes(at, lat, lon);
  return { sunrise: t.sunrise ?? null, sunset: t.sunset ?? null };
}

/** True when `at` falls between 30 minutes before sunrise and 30 minutes after sunset at the place. */
export function inHuntingLight(at: Date, lat: number, lon: number): boolean {
  const { sunrise, sunset } = sunTimes(at, lat, lon);
  if (!sunrise || !sunset) return false;
  const m = HUNTING_LIGHT_MARGIN_MIN * 60_000;
  return at.getTime() >= sunrise.getTime() - m && at.getTime() <= sunset.getTime() + m;
}

const monthIn = (at: Date, timeZone: string) => Number(new Intl.DateTimeFormat('en-US', { timeZone, month: 'numeric' }).format(at));

/** The observations within the filter's months and hours. */
export function filterObservations(observations: readonly WindObservation[], filter: WindFilter): WindObservation[] {
  const months = new Set(filter.months);
  return observations.filter((o) => months.has(monthIn(o.at, filter.timeZone)) && (filter.hours === 'all' || inHuntingLight(o.at, filter.lat, filter.lon)));
}

export interface RoseShare {
  from: WindName;
  share: number;
}

/** The 16-wind rose: each wind's share of the hours with a direction (calm hours counted apart), shares to 4 places. */
export function windRose(observations: readonly WindObservation[]): { rose: RoseShare[]; hours: number; calmHours: number } {
  const counts = new Map<WindName, number>(WIND_NAMES.map((n) => [n, 0]));
  let calmHours = 0;
  for (const o of observations) {
    if (o.fromDeg === null) calmHours++;
    else counts.set(windSector(o.fromDeg), counts.get(windSector(o.fromDeg))! + 1);
  }
  const directional = observations.length - calmHours;
  const rose = WIND_NAMES.map((from) => ({ from, share: directional === 0 ? 0 : Math.round((counts.get(from)! / directional) * 10000) / 10000 }));
  return { rose, hours: observations.length, calmHours };
}

/** A typed rose: every wind's share normalised to sum to 1 (winds not given are 0). Throws when the shares sum to 0. */
export function normalizeSectors(sectors: readonly RoseShare[]): RoseShare[] {
  const total = sectors.reduce((s, x) => s + x.share, 0);
  if (!(total > 0)) throw new WindFileError('Give at least one wind a share above 0.');
  const byName = new Map<WindName, number>();
  for (const s of sectors) byName.set(s.from, (byName.get(s.from) ?? 0) + s.share);
  return WIND_NAMES.map((from) => ({ from, share: Math.round(((byName.get(from) ?? 0) / total) * 10000) / 10000 }));
}

/** Miles per hour from metres per second (1 mi = 1,609.344 m, NIST Handbook 44, App. C). */
export function msToMph(ms: number): number {
  return ms * MPH_PER_MS;
}
