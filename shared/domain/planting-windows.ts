/**
 * Planting windows by region, lead times between a practice's steps, and schedule warnings.
 *
 * South windows for clover, rape/brassicas, cowpeas and sorghum are from Cook & Gray (2003),
 * Biology and Management of White-tailed Deer in Alabama, Alabama DCNR. The other regions follow
 * the direction in Missouri Extension G4652 — fall windows earlier and spring windows later going
 * north — with day values from memory / common practice. Everything is pure: `today` is a parameter.
 */
import { DomainValidationError } from './errors';
import type { PracticeDefinition, PracticeStep } from './practice';
import { requireNumber } from './validation';
import { formatDate, formatDateSpan } from './clock';
import { formatIsoDate, formatMonthDay, MONTH_NAMES, parseIsoDate, type IsoDate } from './iso-dates';

export const REGIONS = ['south', 'midsouth', 'midwest', 'north'] as const;
export type Region = (typeof REGIONS)[number];
export const REGION_LABELS: Record<Region, string> = {
  south: 'South (Gulf states)',
  midsouth: 'Mid-South',
  midwest: 'Midwest',
  north: 'North',
};

export type Season = 'spring' | 'summer' | 'fall' | 'winter';

export interface MonthDay {
  month: number;
  day: number;
}

export interface RegionWindow {
  start: MonthDay;
  /** When `end` falls before `start` in the calendar, the window runs into the next year. */
  end: MonthDay;
  source: string;
}

export const WINDOW_KEYS = [
  'brassica',
  'clover',
  'cereal-grain',
  'cowpeas',
  'sorghum',
  'native-grass',
  'shrub-planting',
  'dormant-season',
  'invasive-foliar',
  'mock-scrape',
  'burn-season',
  'summer-work',
] as const;
export type WindowKey = (typeof WINDOW_KEYS)[number];

export interface WindowDefinition {
  key: WindowKey;
  label: string;
  season: Season;
  regions: Record<Region, RegionWindow>;
}

const ALABAMA = 'Cook & Gray (2003), Alabama DCNR';
const SHIFTED = 'from memory / common practice (direction per Missouri Extension G4652)';
const MEMORY = 'from memory / common practice';

const md = (month: number, day: number): MonthDay => ({ month, day });
const w = (start: MonthDay, end: MonthDay, source: string): RegionWindow => ({ start, end, source });

export const PLANTING_WINDOWS: Record<WindowKey, WindowDefinition> = {
  brassica: {
    key: 'brassica',
    label: 'Fall brassicas (rape, turnip, radish)',
    season: 'fall',
    regions: {
      south: w(md(8, 15), md(11, 1), ALABAMA),
      midsouth: w(md(8, 1), md(9, 30), SHIFTED),
      midwest: w(md(7, 20), md(8, 31), SHIFTED),
      north: w(md(7, 10), md(8, 15), SHIFTED),
    },
  },
  clover: {
    key: 'clover',
    label: 'Fall clover and chicory',
    season: 'fall',
    regions: {
      south: w(md(9, 1), md(11, 15), ALABAMA),
      midsouth: w(md(8, 20), md(10, 15), SHIFTED),
      midwest: w(md(8, 10), md(9, 15), SHIFTED),
      north: w(md(8, 1), md(9, 1), SHIFTED),
    },
  },
  'cereal-grain': {
    key: 'cereal-grain',
    label: 'Fall cereal grains (oats, wheat, rye)',
    season: 'fall',
    regions: {
      south: w(md(9, 15), md(11, 30), MEMORY),
      midsouth: w(md(9, 1), md(10, 31), SHIFTED),
      midwest: w(md(8, 20), md(10, 15), SHIFTED),
      north: w(md(8, 10), md(9, 30), SHIFTED),
    },
  },
  cowpeas: {
    key: 'cowpeas',
    label: 'Summer legumes (cowpeas)',
    season: 'spring',
    regions: {
      south: w(md(5, 1), md(7, 15), ALABAMA),
      midsouth: w(md(5, 10), md(7, 1), SHIFTED),
      midwest: w(md(5, 20), md(6, 30), SHIFTED),
      north: w(md(6, 1), md(6, 30), SHIFTED),
    },
  },
  sorghum: {
    key: 'sorghum',
    label: 'Grain sorghum',
    season: 'spring',
    regions: {
      south: w(md(4, 15), md(6, 30), ALABAMA),
      midsouth: w(md(5, 1), md(6, 30), SHIFTED),
      midwest: w(md(5, 15), md(6, 30), SHIFTED),
      north: w(md(5, 25), md(6, 25), SHIFTED),
    },
  },
  'native-grass': {
    key: 'native-grass',
    label: 'Native warm-season grasses',
    season: 'spring',
    regions: {
      south: w(md(3, 15), md(5, 15), MEMORY),
      midsouth: w(md(4, 1), md(5, 31), SHIFTED),
      midwest: w(md(4, 15), md(6, 15), SHIFTED),
      north: w(md(5, 1), md(6, 30), SHIFTED),
    },
  },
  'shrub-planting': {
    key: 'shrub-planting',
    label: 'Bare-root shrub and tree seedlings',
    season: 'spring',
    regions: {
      south: w(md(1, 1), md(3, 1), MEMORY),
      midsouth: w(md(1, 15), md(3, 31), SHIFTED),
      midwest: w(md(3, 1), md(4, 30), SHIFTED),
      north: w(md(4, 1), md(5, 15), SHIFTED),
    },
  },
  'dormant-season': {
    key: 'dormant-season',
    label: 'Dormant-season cutting (TSI, hinge-cutting)',
    season: 'winter',
    regions: {
      south: w(md(12, 1), md(3, 1), MEMORY),
      midsouth: w(md(12, 1), md(3, 15), MEMORY),
      midwest: w(md(12, 15), md(3, 31), MEMORY),
      north: w(md(12, 15), md(4, 15), MEMORY),
    },
  },
  'invasive-foliar': {
    key: 'invasive-foliar',
    label: 'Foliar spraying of invasive shrubs',
    season: 'fall',
    regions: {
      south: w(md(8, 15), md(11, 15), MEMORY),
      midsouth: w(md(8, 15), md(11, 1), SHIFTED),
      midwest: w(md(8, 1), md(10, 31), SHIFTED),
      north: w(md(8, 1), md(10, 15), SHIFTED),
    },
  },
  'mock-scrape': {
    key: 'mock-scrape',
    label: 'Mock scrapes before the rut',
    season: 'fall',
    regions: {
      south: w(md(10, 15), md(12, 15), MEMORY),
      midsouth: w(md(10, 1), md(11, 15), SHIFTED),
      midwest: w(md(9, 25), md(11, 1), SHIFTED),
      north: w(md(9, 20), md(10, 25), SHIFTED),
    },
  },
  'burn-season': {
    key: 'burn-season',
    label: 'Dormant-season prescribed burning',
    season: 'winter',
    regions: {
      south: w(md(1, 15), md(3, 15), MEMORY),
      midsouth: w(md(2, 1), md(3, 31), MEMORY),
      midwest: w(md(3, 1), md(4, 30), MEMORY),
      north: w(md(3, 15), md(5, 15), MEMORY),
    },
  },
  'summer-work': {
    key: 'summer-work',
    label: 'Summer work well before the hunting season',
    season: 'summer',
    regions: {
      south: w(md(6, 1), md(8, 31), MEMORY),
      midsouth: w(md(6, 1), md(8, 31), MEMORY),
      midwest: w(md(6, 1), md(8, 31), MEMORY),
      north: w(md(6, 1), md(8, 31), MEMORY),
    },
  },
};

/** Average first fall frost per region; from memory, a placeholder until the property's own date is entered. */
export const AVERAGE_FIRST_FROST: Record<Region, MonthDay> = {
  south: md(11, 15),
  midsouth: md(10, 25),
  midwest: md(10, 10),
  north: md(9, 25),
};

/** Brassicas are grazeable 80–150 days after seeding (Penn State Extension, Hall & Jung). */
export const BRASSICA_GRAZEABLE_DAYS = { min: 80, max: 150 } as const;
/** "Plant brassicas 60–90 days before first frost": common practice, no source. */
export const BRASSICA_DAYS_BEFORE_FROST = { min: 60, max: 90 } as const;

// ---- ISO dates (UTC calendar days): in iso-dates.ts, re-exported here ----

export { addDays, daysBetween, formatIsoDate, formatMonthDay, parseIsoDate, type IsoDate } from './iso-dates';
const DAY_MS = 86_400_000;

function isoFromMonthDay(year: number, value: MonthDay): IsoDate {
  return formatIsoDate(Math.round(Date.UTC(year, value.month - 1, value.day) / DAY_MS));
}

function requireMonthDay(value: MonthDay, field: string): MonthDay {
  requireNumber(`${field}.month`, value?.month, { label: 'Month', min: 1, max: 12, integer: true });
  requireNumber(`${field}.day`, value.day, { label: 'Day', min: 1, max: 31, integer: true });
  const probe = new Date(Date.UTC(2001, value.month - 1, value.day));
  if (probe.getUTCDate() !== value.day) {
    throw new DomainValidationError(field, `${MONTH_NAMES[value.month - 1]} has no day ${value.day}.`);
  }
  return value;
}

function requireYear(year: number): number {
  return requireNumber('year', year, { label: 'Year', min: 1900, max: 2200, integer: true });
}

function requireRegion(region: string): Region {
  if (!(REGIONS as readonly string[]).includes(region)) {
    throw new DomainValidationError('region', `Region must be one of ${REGIONS.join(', ')} (got ${JSON.stringify(region)}).`);
  }
  return region as Region;
}

function requireWindowKey(key: string): WindowKey {
  if (!(WINDOW_KEYS as readonly string[]).includes(key)) {
    throw new DomainValidationError('windowKey', `Unknown planting window ${JSON.stringify(key)}; use one of ${WINDOW_KEYS.join(', ')}.`);
  }
  return key as WindowKey;
}

export interface DateWindow {
  earliest: IsoDate;
  latest: IsoDate;
}

/** The region's window for a practice's anchor step in a year (it starts in that year and may run into the next). */
export function windowDates(windowKey: WindowKey, region: Region, year: number): DateWindow & { source: string } {
  const definition = PLANTING_WINDOWS[requireWindowKey(windowKey)];
  const regional = definition.regions[requireRegion(region)];
  requireYear(year);
  const earliest = isoFromMonthDay(year, regional.start);
  let latest = isoFromMonthDay(year, regional.end);
  if (latest < earliest) latest = isoFromMonthDay(year + 1, regional.end);
  return { earliest, latest, source: regional.source };
}

/** The default window of a practice's main step (seeding, planting or work) for a region and year. */
export function practiceWindow(practice: Pick<PracticeDefinition, 'windowKey'>, region: Region, year: number): DateWindow & { source: string } {
  return windowDates(practice.windowKey, region, year);
}

// ---- Schedules ----

export type ScheduleWarningCode =
  | 'window-passed'
  | 'target-outside-window'
  | 'scheduled-outside-window'
  | 'dependency-order'
  | 'frost-too-close';

export interface ScheduleWarning {
  code: ScheduleWarningCode;
  severity: 'warning' | 'info';
  stepKey?: string;
  message: string;
}

export interface StepWindow extends DateWindow {
  stepKey: string;
  name: string;
  kind: PracticeStep['kind'];
  isAnchor: boolean;
  scheduled: IsoDate | null;
  done: boolean;
}

export interface ScheduleInput {
  practice: PracticeDefinition;
  region: Region;
  /** Season year: the anchor window starts in this year. */
  year: number;
  /** Target date of the anchor step (seeding); default `defaultTargetDate` (today when the window is open). */
  targetDate?: IsoDate;
  today: IsoDate;
  /** Dates the consultant has put steps on, by step key. */
  scheduledDates?: Record<string, IsoDate>;
  doneStepKeys?: string[];
  /** The property's average first frost, if known; otherwise the region's. */
  firstFrost?: MonthDay;
}

export interface ScheduleResult {
  region: Region;
  windowKey: WindowKey;
  /** The anchor step's seasonal window (e.g. the seeding window). */
  anchorWindow: DateWindow & { source: string };
  targetDate: IsoDate;
  steps: StepWindow[];
  warnings: ScheduleWarning[];
  /** For brassicas: when the plot is grazeable (80–150 days after seeding, Penn State Extension). */
  grazeable: DateWindow | null;
  firstFrostDate: IsoDate | null;
  daysBeforeFirstFrost: number | null;
}

function stepTiming(step: PracticeStep, practice: PracticeDefinition): { earliest: number; latest: number } {
  if (step.key === practice.anchorStepKey) return { earliest: 0, latest: 0 };
  if (!step.timing) {
    throw new DomainValidationError(`steps.${step.key}.timing`, `Step "${step.name}" needs a lead time relative to the ${practice.anchorStepKey} step.`);
  }
  const { offsetEarliestDays, offsetLatestDays } = step.timing;
  requireNumber(`steps.${step.key}.timing.offsetEarliestDays`, offsetEarliestDays, { label: 'Earliest offset', unit: 'days', min: -1000, max: 1000, integer: true });
  requireNumber(`steps.${step.key}.timing.offsetLatestDays`, offsetLatestDays, { label: 'Latest offset', unit: 'days', min: -1000, max: 1000, integer: true });
  if (offsetEarliestDays > offsetLatestDays) {
    throw new DomainValidationError(`steps.${step.key}.timing`, `Step "${step.name}": the earliest offset must not come after the latest.`);
  }
  return { earliest: offsetEarliestDays, latest: offsetLatestDays };
}

/**
 * The target date a new prescription gets when none is chosen: today when today falls inside the
 * window (its first day may have passed), otherwise the window's first day.
 */
export function defaultTargetDate(window: DateWindow, today: IsoDate): IsoDate {
  return today >= window.earliest && today <= window.latest ? today : window.earliest;
}

/** Each step's window (earliest, latest ISO dates) from a target anchor date, with warnings for passed windows, out-of-order steps and late brassicas. */
export function schedulePrescription(input: ScheduleInput): ScheduleResult {
  const { practice } = input;
  const region = requireRegion(input.region);
  const year = requireYear(input.year);
  const today = parseIsoDate(input.today, 'today');
  const anchorWindow = windowDates(practice.windowKey, region, year);
  const anchorStep = practice.steps.find((s) => s.key === practice.anchorStepKey);
  if (!anchorStep) {
    throw new DomainValidationError('practice.anchorStepKey', `Practice "${practice.name}" has no step "${practice.anchorStepKey}" to time the others from.`);
  }
  const targetDate = input.targetDate ?? defaultTargetDate(anchorWindow, input.today);
  const target = parseIsoDate(targetDate, 'targetDate');
  const scheduledDates = input.scheduledDates ?? {};
  const stepKeys = new Set(practice.steps.map((s) => s.key));
  for (const key of Object.keys(scheduledDates)) {
    if (!stepKeys.has(key)) throw new DomainValidationError(`scheduledDates.${key}`, `Practice "${practice.name}" has no step "${key}".`);
    parseIsoDate(scheduledDates[key], `scheduledDates.${key}`);
  }
  const done = new Set(input.doneStepKeys ?? []);
  const warnings: ScheduleWarning[] = [];

  if (target < parseIsoDate(anchorWindow.earliest) || target > parseIsoDate(anchorWindow.latest)) {
    warnings.push({
      code: 'target-outside-window',
      severity: 'warning',
      stepKey: anchorStep.key,
      message: `${anchorStep.name} on ${formatMonthDay(targetDate)} falls outside the ${REGION_LABELS[region]} window of ${formatMonthDay(anchorWindow.earliest)}–${formatMonthDay(anchorWindow.latest)}.`,
    });
  }

  const steps: StepWindow[] = practice.steps.map((step) => {
    const isAnchor = step.key === practice.anchorStepKey;
    const offsets = stepTiming(step, practice);
    const earliest = isAnchor ? anchorWindow.earliest : formatIsoDate(target + offsets.earliest);
    const latest = isAnchor ? anchorWindow.latest : formatIsoDate(target + offsets.latest);
    return { stepKey: step.key, name: step.name, kind: step.kind, isAnchor, earliest, latest, scheduled: scheduledDates[step.key] ?? null, done: done.has(step.key) };
  });
  const byKey = new Map(steps.map((s) => [s.stepKey, s] as const));

  for (const step of steps) {
    if (!step.done && parseIsoDate(step.latest) < today) {
      warnings.push({
        code: 'window-passed',
        severity: 'warning',
        stepKey: step.stepKey,
        message: `The window for "${step.name}" closed on ${formatDate(step.latest)} and the step is not done; move the target date or plan it for next season.`,
      });
    }
    if (step.scheduled && (step.scheduled < step.earliest || step.scheduled > step.latest)) {
      warnings.push({
        code: 'scheduled-outside-window',
        severity: 'info',
        stepKey: step.stepKey,
        message: `"${step.name}" is scheduled for ${formatDate(step.scheduled)}, outside its window ${formatDateSpan(step.earliest, step.latest)}.`,
      });
    }
  }

  for (const step of practice.steps) {
    const own = byKey.get(step.key) as StepWindow;
    for (const depKey of step.dependsOn ?? []) {
      const dep = byKey.get(depKey);
      if (!dep) {
        throw new DomainValidationError(`steps.${step.key}.dependsOn`, `Step "${step.name}" depends on "${depKey}", which is not a step of "${practice.name}".`);
      }
      // Scheduled dates when known; otherwise the step's latest possible day against the dependency's earliest.
      const outOfOrder = (own.scheduled ?? own.latest) < (dep.scheduled ?? dep.earliest);
      if (outOfOrder) {
        warnings.push({
          code: 'dependency-order',
          severity: 'warning',
          stepKey: step.key,
          message: `"${own.name}" comes before "${dep.name}", which it depends on; schedule "${dep.name}" first.`,
        });
      }
    }
  }

  let grazeable: DateWindow | null = null;
  let firstFrostDate: IsoDate | null = null;
  let daysBeforeFirstFrost: number | null = null;
  if (practice.windowKey === 'brassica') {
    grazeable = {
      earliest: formatIsoDate(target + BRASSICA_GRAZEABLE_DAYS.min),
      latest: formatIsoDate(target + BRASSICA_GRAZEABLE_DAYS.max),
    };
    const frost = input.firstFrost ?? AVERAGE_FIRST_FROST[region];
    firstFrostDate = isoFromMonthDay(Number(formatIsoDate(target).slice(0, 4)), requireMonthDay(frost, 'firstFrost'));
    daysBeforeFirstFrost = parseIsoDate(firstFrostDate) - target;
    if (daysBeforeFirstFrost < BRASSICA_DAYS_BEFORE_FROST.max) {
      const tooFew = daysBeforeFirstFrost < BRASSICA_DAYS_BEFORE_FROST.min;
      warnings.push({
        code: 'frost-too-close',
        severity: tooFew ? 'warning' : 'info',
        stepKey: anchorStep.key,
        message: `Seeding on ${formatMonthDay(targetDate)} leaves ${daysBeforeFirstFrost} days before the average first frost (${formatMonthDay(firstFrostDate)}); brassicas are commonly planted 60–90 days before first frost.`,
      });
    }
  }

  return { region, windowKey: practice.windowKey, anchorWindow, targetDate: formatIsoDate(target), steps, warnings, grazeable, firstFrostDate, daysBeforeFirstFrost };
}
