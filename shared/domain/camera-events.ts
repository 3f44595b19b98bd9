/**
 * Trail-camera numbers: photo times from the camera's clock, independent events, camera-nights,
 * activity by hour and against sunrise and sunset, and the area a photo survey speaks for.
 *
 * Independent events: photos of one kind (deer, another species, a person) at one site belong to
 * one event while each follows the previous one within the gap (default 30 minutes). The 30-minute
 * rule is the one O'Brien, Kinnaird & Wibisono used for independent photographs (2003, Animal
 * Conservation 6:131–139; citation from memory) and is common practice in camera-trap work.
 *
 * Camera-nights: a camera set on day S and taken down on day E ran the nights that begin on S,
 * S+1 … E−1, so E − S nights (set Oct 1, pulled Oct 22 → 21 nights). A night belongs to the date of
 * its evening. Sun times come from suncalc (Vladimir Agafonkin's implementation of the formulas in
 * Astronomy Answers), checked in tests against NOAA's solar equations.
 */
import * as SunCalc from 'suncalc';
import { DomainValidationError } from './errors';
import { zonedReading } from './clock';
import { exifInstant } from './photo-exif';

/** Tags a reviewer gives a camera photo. */
export const CAMERA_TAGS = ['buck', 'doe', 'fawn', 'other-species', 'person', 'empty'] as const;
export type CameraTag = (typeof CAMERA_TAGS)[number];
/** Tags that are deer. */
export const DEER_TAGS: readonly CameraTag[] = ['buck', 'doe', 'fawn'];

/** Minutes within which photos at one site form one independent event (O'Brien et al. 2003, from memory). */
export const DEFAULT_EVENT_GAP_MINUTES = 30;
/** Days after which a running camera's card is due for a pull: common practice, no source. */
export const DEFAULT_PULL_INTERVAL_DAYS = 21;
/** Acres one camera covers in a survey: about one camera per 100 acres (Jacobson et al. 1997, from memory). */
export const ACRES_PER_SURVEY_CAMERA = 100;

const MS_PER_MINUTE = 60_000;
const MS_PER_DAY = 86_400_000;

/** Which kind of event a tag counts toward; empty photos make no event. */
export type EventKind = 'deer' | 'other-species' | 'person';
export function eventKindOf(tag: CameraTag | null): EventKind | null {
  if (tag === null || tag === 'empty') return null;
  if (DEER_TAGS.includes(tag)) return 'deer';
  return tag === 'person' ? 'person' : 'other-species';
}

/**
 * The true time of a photo: the camera's reading (EXIF DateTimeOriginal, with its offset when the
 * camera wrote one, else in the firm's zone), corrected by the deployment's clock offset (seconds to add).
 */
export function correctedPhotoTime(cameraLocal: string, cameraOffset: string | null, zone: string, clockOffsetSeconds: number): Date | null {
  const instant = exifInstant(cameraLocal, cameraOffset, zone);
  return instant ? new Date(instant.getTime() + clockOffsetSeconds * 1000) : null;
}

/** A photo as the event grouping reads it. */
export interface TaggedPhoto {
  id: number;
  takenAt: Date;
  tag: CameraTag | null;
  buckId?: number | null;
}

/** One independent event: consecutive photos of one kind at one site within the gap. */
export interface CameraEvent {
  kind: EventKind;
  startedAt: string;
  endedAt: string;
  photoIds: number[];
  /** Photos in the event by tag. */
  tags: Partial<Record<CameraTag, number>>;
  /** Identified bucks seen in the event. */
  buckIds: number[];
}

/** Groups one site's tagged photos into independent events, each kind on its own (file header). */
export function groupEvents(photos: readonly TaggedPhoto[], gapMinutes = DEFAULT_EVENT_GAP_MINUTES): CameraEvent[] {
  if (!(gapMinutes > 0 && Number.isFinite(gapMinutes))) throw new DomainValidationError('gapMinutes', 'The event gap must be a positive number of minutes.');
  const gapMs = gapMinutes * MS_PER_MINUTE;
  const sorted = photos
    .map((p) => ({ p, kind: eventKindOf(p.tag) }))
    .filter((x): x is { p: TaggedPhoto; kind: EventKind } => x.kind !== null)
    .sort((a, b) => a.p.takenAt.getTime() - b.p.takenAt.getTime() || a.p.id - b.p.id);
  const open = new Map<EventKind, { event: CameraEvent; lastMs: number }>();
  const events: CameraEvent[] = [];
  for (const { p, kind } of sorted) {
    const t = p.takenAt.getTime();
    let current = open.get(kind);
    if (!current || t - current.lastMs > gapMs) {
      current = { event: { kind, startedAt: p.takenAt.toISOString(), endedAt: p.takenAt.toISOString(), photoIds: [], tags: {}, buckIds: [] }, lastMs: t };
      open.set(kind, current);
      events.push(current.event);
    }
    current.lastMs = t;
    current.event.endedAt = p.takenAt.toISOString();
    current.event.photoIds.push(p.id);
    if (p.tag) current.event.tags[p.tag] = (current.event.tags[p.tag] ?? 0) + 1;
    if (p.buckId && !current.event.buckIds.includes(p.buckId)) current.event.buckIds.push(p.buckId);
  }
  return events;
}

function dayNumber(date: string, field: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!m) throw new DomainValidationError(field, `${field}: enter the whole date.`);
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) / MS_PER_DAY;
}

/**
 * Camera-nights a deployment ran from `startedOn` until `endOn` (its end, last pull or today),
 * counting only nights whose evening falls in [from, to] when a window is given (file header).
 */
export function cameraNights(startedOn: string, endOn: string, window?: { from: string; to: string }): number {
  let first = dayNumber(startedOn, 'startedOn');
  let last = dayNumber(endOn, 'endOn') - 1;
  if (window) {
    first = Math.max(first, dayNumber(window.from, 'from'));
    last = Math.min(last, dayNumber(window.to, 'to'));
  }
  return Math.max(0, last - first + 1);
}

/** Events per 100 camera-nights (null when the camera ran no night). */
export function eventsPer100CameraNights(events: number, nights: number): number | null {
  return nights > 0 ? (events / nights) * 100 : null;
}

/** Where an instant falls against the sun at a place. */
export type SunPeriod = 'night' | 'dawn' | 'day' | 'dusk';
export const SUN_PERIODS: readonly SunPeriod[] = ['dawn', 'day', 'dusk', 'night'];
/** Dawn and dusk: within this many minutes of sunrise or sunset (common practice, no source). */
export const TWILIGHT_WINDOW_MINUTES = 60;

/** Sunrise and sunset (upper limb, refraction allowed: the Sun's centre 0.833° below the horizon) on the local day around `instant`. */
export function sunTimes(instant: Date, lat: number, lon: number): { sunrise: Date | null; sunset: Date | null } {
  // suncalc takes any instant of the day and computes for the solar day at that longitude.
  const t = SunCalc.getTimes(instant, lat, lon);
  const valid = (d: Date | null) => (d instanceof Date && !Number.isNaN(d.getTime()) ? d : null);
  return { sunrise: valid(t.sunrise), sunset: valid(t.sunset) };
}

/** Minutes from sunrise and from sunset (negative before) and the period of the day at a place. */
export function sunRelation(instant: Date, lat: number, lon: number): { minutesFromSunrise: number | null; minutesFromSunset: number | null; period: SunPeriod; daylight: boolean } {
  const { sunrise, sunset } = sunTimes(instant, lat, lon);
  if (!sunrise || !sunset) {
    const up = SunCalc.getPosition(instant, lat, lon).altitude > 0;
    return { minutesFromSunrise: null, minutesFromSunset: null, period: up ? 'day' : 'night', daylight: up };
  }
  const fromRise = (instant.getTime() - sunrise.getTime()) / MS_PER_MINUTE;
  const fromSet = (instant.getTime() - sunset.getTime()) / MS_PER_MINUTE;
  const daylight = fromRise >= 0 && fromSet < 0;
  let period: SunPeriod = daylight ? 'day' : 'night';
  if (Math.abs(fromRise) <= TWILIGHT_WINDOW_MINUTES) period = 'dawn';
  else if (Math.abs(fromSet) <= TWILIGHT_WINDOW_MINUTES) period = 'dusk';
  return { minutesFromSunrise: Math.round(fromRise), minutesFromSunset: Math.round(fromSet), period, daylight };
}

/** Activity of a site's deer events: by hour of the firm's day, by period of the sun, and the share in daylight. */
export interface ActivitySummary {
  /** Deer events starting in each hour 0–23 (firm's time zone). */
  byHour: number[];
  bySun: Record<SunPeriod, number>;
  /** Share (0–1) of deer events that started between sunrise and sunset; null without deer events. */
  daylightShare: number | null;
}

/** Counts deer events by hour (in `zone`) and against the sun at the site. */
export function activitySummary(events: readonly CameraEvent[], zone: string, lat: number | null, lon: number | null): ActivitySummary {
  const byHour = Array.from({ length: 24 }, () => 0);
  const bySun: Record<SunPeriod, number> = { dawn: 0, day: 0, dusk: 0, night: 0 };
  let deer = 0;
  let daylight = 0;
  for (const e of events) {
    if (e.kind !== 'deer') continue;
    deer += 1;
    const at = new Date(e.startedAt);
    byHour[zonedReading(at, zone).hour % 24] += 1;
    if (lat !== null && lon !== null) {
      const rel = sunRelation(at, lat, lon);
      bySun[rel.period] += 1;
      if (rel.daylight) daylight += 1;
    }
  }
  return { byHour, bySun, daylightShare: deer > 0 && lat !== null ? daylight / deer : null };
}

/** Tallies a camera survey reads from tagged photos (the camera census method's inputs). */
export interface PhotoTallies {
  buckPhotos: number;
  uniqueBucks: number;
  doePhotos: number;
  fawnPhotos: number;
}

/** Buck, doe and fawn photos and the identified bucks among them. */
export function talliesFromPhotos(photos: readonly Pick<TaggedPhoto, 'tag' | 'buckId'>[]): PhotoTallies {
  const bucks = new Set<number>();
  let buckPhotos = 0;
  let doePhotos = 0;
  let fawnPhotos = 0;
  for (const p of photos) {
    if (p.tag === 'buck') {
      buckPhotos += 1;
      if (p.buckId) bucks.add(p.buckId);
    } else if (p.tag === 'doe') doePhotos += 1;
    else if (p.tag === 'fawn') fawnPhotos += 1;
  }
  return { buckPhotos, uniqueBucks: bucks.size, doePhotos, fawnPhotos };
}

/** The area a photo survey's density refers to: about 100 acres per camera, never more than the property. */
export function surveyAreaAcres(cameraCount: number, propertyAcres: number): number {
  if (!(cameraCount > 0)) throw new DomainValidationError('cameraCount', 'A survey needs at least one camera.');
  return Math.min(cameraCount * ACRES_PER_SURVEY_CAMERA, propertyAcres);
}

/** Whole days from `from` to `to` ("YYYY-MM-DD"); negative when `to` is earlier. */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to, 'to') - dayNumber(from, 'from');
}
