/**
 * Deer herd estimates from a trail-camera survey (camera census method of Jacobson et al. 1997,
 * Wildlife Society Bulletin 25:547–556, citation from memory) and summaries of harvest records.
 *
 * Camera census: bucks are told apart by their antlers, so the number of unique bucks is known.
 *   photos per buck = buck photos ÷ unique bucks
 *   does            = doe photos ÷ photos per buck
 *   fawns           = fawn photos ÷ photos per buck
 *   total           = unique bucks + does + fawns
 *   deer per mi²    = total ÷ (acres ÷ 640)
 * The estimates stay unrounded; `display` rounds once, half up at the precision shown: whole deer,
 * photos per buck to 0.01, does per buck to 0.1 ("1:1.4"), fawns per doe to 0.01, density to 0.1.
 * The displayed total is the rounded unrounded total, so the displayed parts may differ from it
 * by one deer.
 */
import { ACRES_PER_SQ_MI } from '../units';
import { DomainValidationError } from './errors';
import { formatDate } from './clock';

/** Acres one camera should cover at most: about one camera per 100 acres (Jacobson et al. 1997, from memory). */
export const MAX_ACRES_PER_CAMERA = 100;
/** Shortest survey the method calls for, in days: 10–14 days (Jacobson et al. 1997, from memory). */
export const MIN_SURVEY_DAYS = 10;

/** Tallies of one camera survey; dates are calendar dates "YYYY-MM-DD". */
export interface CameraSurveyInput {
  buckPhotos: number;
  uniqueBucks: number;
  doePhotos: number;
  fawnPhotos: number;
  propertyAcres: number;
  cameraCount: number;
  startDate: string;
  endDate: string;
}

/** Unrounded herd estimates. */
export interface SurveyEstimates {
  photosPerBuck: number;
  bucks: number;
  does: number;
  fawns: number;
  total: number;
  /** Does per buck; shown as "1:x". */
  buckDoeRatio: number;
  /** Fawns per doe (recruitment); null when no doe was photographed. */
  fawnDoeRatio: number | null;
  deerPerSqMi: number;
}

/** The estimates rounded for display (see the file header for the precision of each). */
export type SurveyEstimatesDisplay = Record<keyof SurveyEstimates, string>;

export type SurveyWarningCode = 'camera-density-low' | 'survey-short' | 'no-does' | 'method-undercounts' | 'baiting-rules' | 'no-area';

/** Something the reader of the estimates should know; `note`s are always shown. */
export interface SurveyWarning {
  code: SurveyWarningCode;
  severity: 'warning' | 'note';
  message: string;
}

export interface CameraSurveyResult {
  estimates: SurveyEstimates;
  display: SurveyEstimatesDisplay;
  /** Calendar days from startDate through endDate, both days counted. */
  surveyDays: number;
  acresPerCamera: number;
  warnings: SurveyWarning[];
}

const MS_PER_DAY = 86_400_000;

/** Days since 1970-01-01 of a "YYYY-MM-DD" calendar date, or a validation error naming the field. */
export function parseCalendarDate(value: unknown, field: string): number {
  const match = typeof value === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(value) : null;
  if (!match) throw new DomainValidationError(field, 'Enter the whole date: month, day and year.');
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const ms = Date.UTC(year, month - 1, day);
  const check = new Date(ms);
  if (check.getUTCFullYear() !== year || check.getUTCMonth() !== month - 1 || check.getUTCDate() !== day) {
    throw new DomainValidationError(field, `${field} ${value} is not a real calendar date.`);
  }
  return ms / MS_PER_DAY;
}

function requireCount(value: unknown, field: string, label: string): number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 0) {
    throw new DomainValidationError(field, `${label} must be a whole number, zero or more (got ${String(value)}).`);
  }
  return value;
}

const formatters = new Map<number, Intl.NumberFormat>();
/** A number rounded half up to `digits` decimals, with thousands separators ("1,234.5"). */
function fixed(value: number, digits: number): string {
  let format = formatters.get(digits);
  if (!format) {
    format = new Intl.NumberFormat('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits, roundingMode: 'halfExpand' });
    formatters.set(digits, format);
  }
  return format.format(value);
}

/** Herd estimates, their display and the warnings for one camera survey (camera census method). */
export function cameraSurveyEstimates(input: CameraSurveyInput): CameraSurveyResult {
  if (!input || typeof input !== 'object') throw new DomainValidationError('survey', 'Survey tallies are missing.');
  const buckPhotos = requireCount(input.buckPhotos, 'buckPhotos', 'Buck photos');
  const uniqueBucks = requireCount(input.uniqueBucks, 'uniqueBucks', 'Unique bucks');
  const doePhotos = requireCount(input.doePhotos, 'doePhotos', 'Doe photos');
  const fawnPhotos = requireCount(input.fawnPhotos, 'fawnPhotos', 'Fawn photos');
  const cameraCount = requireCount(input.cameraCount, 'cameraCount', 'Number of cameras');
  if (uniqueBucks === 0) {
    throw new DomainValidationError(
      'uniqueBucks',
      'At least one individually recognised buck is needed: the method scales doe and fawn photos by photos per buck.',
    );
  }
  if (uniqueBucks > buckPhotos) {
    throw new DomainValidationError('uniqueBucks', `Unique bucks (${uniqueBucks}) cannot exceed buck photos (${buckPhotos}); each buck was photographed at least once.`);
  }
  if (cameraCount === 0) throw new DomainValidationError('cameraCount', 'A survey needs at least one camera.');
  if (typeof input.propertyAcres !== 'number' || !Number.isFinite(input.propertyAcres) || input.propertyAcres <= 0) {
    throw new DomainValidationError('propertyAcres', `Property area must be a positive number of acres (got ${String(input.propertyAcres)}).`);
  }
  const startDay = parseCalendarDate(input.startDate, 'startDate');
  const endDay = parseCalendarDate(input.endDate, 'endDate');
  if (endDay < startDay) {
    throw new DomainValidationError('endDate', `The survey ends (${formatDate(input.endDate)}) before it starts (${formatDate(input.startDate)}).`);
  }

  const propertyAcres = input.propertyAcres;
  const photosPerBuck = buckPhotos / uniqueBucks;
  const does = doePhotos / photosPerBuck;
  const fawns = fawnPhotos / photosPerBuck;
  const total = uniqueBucks + does + fawns;
  const estimates: SurveyEstimates = {
    photosPerBuck,
    bucks: uniqueBucks,
    does,
    fawns,
    total,
    buckDoeRatio: does / uniqueBucks,
    fawnDoeRatio: does > 0 ? fawns / does : null,
    deerPerSqMi: total / (propertyAcres / ACRES_PER_SQ_MI),
  };
  const display: SurveyEstimatesDisplay = {
    photosPerBuck: fixed(photosPerBuck, 2),
    bucks: fixed(uniqueBucks, 0),
    does: fixed(does, 0),
    fawns: fixed(fawns, 0),
    total: fixed(total, 0),
    buckDoeRatio: `1:${fixed(estimates.buckDoeRatio, 1)}`,
    fawnDoeRatio: estimates.fawnDoeRatio === null ? 'n/a' : fixed(estimates.fawnDoeRatio, 2),
    deerPerSqMi: fixed(estimates.deerPerSqMi, 1),
  };

  const surveyDays = endDay - startDay + 1;
  const acresPerCamera = propertyAcres / cameraCount;
  const warnings: SurveyWarning[] = [];
  if (acresPerCamera > MAX_ACRES_PER_CAMERA) {
    warnings.push({
      code: 'camera-density-low',
      severity: 'warning',
      message: `One camera per ${fixed(acresPerCamera, 0)} acres: the method calls for about one camera per ${MAX_ACRES_PER_CAMERA} acres (${Math.ceil(propertyAcres / MAX_ACRES_PER_CAMERA)} cameras here). Deer that never pass a camera are missed.`,
    });
  }
  if (surveyDays < MIN_SURVEY_DAYS) {
    warnings.push({
      code: 'survey-short',
      severity: 'warning',
      message: `The survey ran ${surveyDays} day${surveyDays === 1 ? '' : 's'}; the method calls for ${MIN_SURVEY_DAYS}–14 days so that most bucks are photographed.`,
    });
  }
  if (doePhotos === 0) {
    warnings.push({ code: 'no-does', severity: 'warning', message: 'No doe was photographed, so fawns per doe cannot be estimated.' });
  }
  warnings.push({
    code: 'method-undercounts',
    severity: 'note',
    message: 'Camera surveys tend to undercount deer (a field test found a mean of −32 %: Moore et al. 2014, Journal of the Southeastern Association of Fish and Wildlife Agencies 1); read the figures as a minimum and compare surveys done the same way year to year.',
  });
  warnings.push({
    code: 'baiting-rules',
    severity: 'note',
    message: 'Baiting or feeding to draw deer to cameras is illegal in some states and counties, especially where chronic wasting disease is found; check state and local rules before baiting a camera site.',
  });
  return { estimates, display, surveyDays, acresPerCamera, warnings };
}

// ---------------------------------------------------------------------------------------------
// Harvest records

/** Age classes of harvested deer (Texas A&M AgriLife): fawn, 1½, 2½, 3½, 4½, 5½ and older. */
export const AGE_CLASSES = ['fawn', '1.5', '2.5', '3.5', '4.5', '5.5+'] as const;
export type AgeClass = (typeof AGE_CLASSES)[number];
export type DeerSex = 'buck' | 'doe';

/** One harvested deer; `date` is the harvest date "YYYY-MM-DD". */
export interface HarvestRecord {
  date: string;
  sex: DeerSex;
  ageClass: AgeClass;
  dressedWeightLb?: number | null;
}

export interface AgeClassSummary {
  ageClass: AgeClass;
  bucks: number;
  does: number;
  total: number;
  /** Records in this class with a dressed weight. */
  weighed: number;
  /** Mean dressed weight of every weighed deer in the class (either sex); null when none was weighed. */
  meanDressedWeightLb: number | null;
  meanBuckDressedWeightLb: number | null;
  meanDoeDressedWeightLb: number | null;
}

/** One hunting season: season 2024 runs from 1 July 2024 to 30 June 2025 and is labelled "2024–25". */
export interface SeasonSummary {
  season: number;
  label: string;
  bucks: number;
  does: number;
  total: number;
  /** Adult deer (1½ years and older) only; fawns are left out of the ratio. */
  adultBucks: number;
  adultDoes: number;
  /** Adult does per adult buck; null when no adult buck was taken. */
  doesPerBuck: number | null;
  /** "1:x" (x to 0.1), or "no adult bucks". */
  buckDoeRatio: string;
}

export interface HarvestSummary {
  total: number;
  bucks: number;
  does: number;
  /** One entry per age class, in AGE_CLASSES order, empty classes included. */
  ageClasses: AgeClassSummary[];
  /** Seasons with at least one record, oldest first. */
  seasons: SeasonSummary[];
}

/** The hunting season (July–June) a date falls in, named by the year it starts: 2025-01-10 → 2024. */
export function huntingSeasonOf(date: string, field = 'date'): number {
  parseCalendarDate(date, field);
  const year = Number(date.slice(0, 4));
  const month = Number(date.slice(5, 7));
  return month >= 7 ? year : year - 1;
}

const mean = (values: number[]): number | null => (values.length === 0 ? null : values.reduce((s, v) => s + v, 0) / values.length);

/** Age structure by class and sex, buck:doe harvest ratio by season (July–June) and mean dressed weight by age class. */
export function harvestSummary(records: readonly HarvestRecord[]): HarvestSummary {
  if (!Array.isArray(records)) throw new DomainValidationError('records', 'Harvest records must be a list (it may be empty).');
  const classes = new Map(AGE_CLASSES.map((ageClass) => [ageClass, { ageClass, bucks: 0, does: 0, buckWeights: [] as number[], doeWeights: [] as number[] }]));
  const seasons = new Map<number, { bucks: number; does: number; adultBucks: number; adultDoes: number }>();
  let bucks = 0;
  let does = 0;

  records.forEach((record, index) => {
    const field = `records[${index}]`;
    if (!record || typeof record !== 'object') throw new DomainValidationError(field, 'Each harvest record must be an object.');
    if (record.sex !== 'buck' && record.sex !== 'doe') {
      throw new DomainValidationError(`${field}.sex`, `Sex must be "buck" or "doe" (got ${JSON.stringify(record.sex)}).`);
    }
    const ageClass = classes.get(record.ageClass);
    if (!ageClass) {
      throw new DomainValidationError(`${field}.ageClass`, `Age class must be one of ${AGE_CLASSES.join(', ')} (got ${JSON.stringify(record.ageClass)}).`);
    }
    const weight = record.dressedWeightLb;
    if (weight !== undefined && weight !== null && (typeof weight !== 'number' || !Number.isFinite(weight) || weight <= 0)) {
      throw new DomainValidationError(`${field}.dressedWeightLb`, `Dressed weight must be a positive number of pounds, or left empty (got ${String(weight)}).`);
    }
    const seasonYear = huntingSeasonOf(record.date, `${field}.date`);
    const season = seasons.get(seasonYear) ?? { bucks: 0, does: 0, adultBucks: 0, adultDoes: 0 };
    seasons.set(seasonYear, season);
    const adult = record.ageClass !== 'fawn';
    if (record.sex === 'buck') {
      bucks += 1;
      ageClass.bucks += 1;
      season.bucks += 1;
      if (adult) season.adultBucks += 1;
      if (typeof weight === 'number') ageClass.buckWeights.push(weight);
    } else {
      does += 1;
      ageClass.does += 1;
      season.does += 1;
      if (adult) season.adultDoes += 1;
      if (typeof weight === 'number') ageClass.doeWeights.push(weight);
    }
  });

  return {
    total: bucks + does,
    bucks,
    does,
    ageClasses: [...classes.values()].map((c) => ({
      ageClass: c.ageClass,
      bucks: c.bucks,
      does: c.does,
      total: c.bucks + c.does,
      weighed: c.buckWeights.length + c.doeWeights.length,
      meanDressedWeightLb: mean([...c.buckWeights, ...c.doeWeights]),
      meanBuckDressedWeightLb: mean(c.buckWeights),
      meanDoeDressedWeightLb: mean(c.doeWeights),
    })),
    seasons: [...seasons.entries()]
      .sort(([a], [b]) => a - b)
      .map(([season, s]) => {
        const doesPerBuck = s.adultBucks > 0 ? s.adultDoes / s.adultBucks : null;
        return {
          season,
          label: `${season}–${String((season + 1) % 100).padStart(2, '0')}`,
          bucks: s.bucks,
          does: s.does,
          total: s.bucks + s.does,
          adultBucks: s.adultBucks,
          adultDoes: s.adultDoes,
          doesPerBuck,
          buckDoeRatio: doesPerBuck === null ? 'no adult bucks' : `1:${fixed(doesPerBuck, 1)}`,
        };
      }),
  };
}
