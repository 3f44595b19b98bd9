/**
 * Results of a season: trail-camera surveys, harvest records and the season report. One set of
 * schemas for the server's validation, the consultant's forms and the answers' types.
 */
import { z } from 'zod';
import { IsoDateSchema, RecordIdSchema, IdSchema } from './common';
import { LIMITS } from '../limits';
import { AGE_CLASSES, type HarvestSummary, type SeasonSummary, type SurveyEstimates, type SurveyEstimatesDisplay, type SurveyWarning } from '../domain/survey-estimates';
import type { Caution } from '../domain/cautions';
import type { SurveyTrendRow } from '../domain/season-results';
import { formatDate } from '../domain/clock';

export { AGE_CLASSES };

/** Sexes a harvest record takes in the API. */
export const HARVEST_SEXES = ['male', 'female'] as const;
export type HarvestSex = (typeof HARVEST_SEXES)[number];

/** How each age class reads to people (Texas A&M AgriLife classes). */
export const AGE_CLASS_LABELS: Record<(typeof AGE_CLASSES)[number], string> = {
  fawn: 'Fawn',
  '1.5': '1½',
  '2.5': '2½',
  '3.5': '3½',
  '4.5': '4½',
  '5.5+': '5½ and older',
};

/** Longest state disease-sampling number accepted (tags and kit numbers are far shorter; common practice, no source). */
export const DISEASE_SAMPLE_NUMBER_MAX = 40;

/** Most photos one survey may tally per kind: far above any real survey, low enough to catch a typing slip. */
export const MAX_SURVEY_PHOTOS = 1_000_000;
/** Most identified bucks a survey may list. */
export const MAX_SURVEY_BUCKS = 1_000;

const count = (label: string) =>
  z
    .number({ error: `${label}: enter a whole number, zero or more` })
    .int({ message: `${label}: enter a whole number (no fractions)` })
    .min(0, { message: `${label} cannot be negative` })
    .max(MAX_SURVEY_PHOTOS, { message: `${label} cannot be more than ${MAX_SURVEY_PHOTOS.toLocaleString('en-US')}` });

const optionalNote = (max: number) =>
  z
    .string()
    .trim()
    .max(max, { message: `must be at most ${max} characters` })
    .transform((v) => (v === '' ? null : v))
    .nullish();

/** One buck told apart on the photos, by its antlers. */
export const IdentifiedBuckSchema = z.object({
  label: z.string().trim().min(1, { message: 'give each buck a name or number' }).max(60, { message: 'a buck’s label must be at most 60 characters' }),
  ageClass: z.enum(AGE_CLASSES, { error: `age class must be one of ${AGE_CLASSES.join(', ')}` }),
});
export type IdentifiedBuck = z.infer<typeof IdentifiedBuckSchema>;

/** The fields of a survey, without the checks that compare fields. */
export const SurveyFieldsSchema = z.object({
  name: z.string().trim().min(1, { message: 'name the survey, e.g. “Late-summer survey”' }).max(LIMITS.nameMax, { message: `the name must be at most ${LIMITS.nameMax} characters` }),
  startDate: IsoDateSchema,
  endDate: IsoDateSchema,
  buckPhotos: count('Buck photos'),
  uniqueBucks: count('Unique bucks'),
  doePhotos: count('Doe photos'),
  fawnPhotos: count('Fawn photos'),
  /** The identified bucks; when given, one entry per unique buck. */
  bucks: z.array(IdentifiedBuckSchema).max(MAX_SURVEY_BUCKS, { message: `list at most ${MAX_SURVEY_BUCKS} bucks` }).optional(),
  /** Camera sites (plan units of kind camera-site) of the property that were used. */
  cameraUnitIds: z.array(RecordIdSchema).max(500, { message: 'pick at most 500 camera sites' }).optional(),
  /** Cameras used, when some are not on the map; at least the number of camera sites picked. */
  cameraCount: z.number({ error: 'Cameras: enter a whole number' }).int({ message: 'Cameras: enter a whole number' }).min(1, { message: 'a survey needs at least one camera' }).max(1000).nullish(),
  notes: optionalNote(LIMITS.textMax),
});

type SurveyFields = z.output<typeof SurveyFieldsSchema>;

/** Checks between fields; each issue names the field to change and says how. */
function checkSurvey(v: Partial<SurveyFields>, ctx: z.RefinementCtx, whole: boolean): void {
  if (v.uniqueBucks === 0) {
    ctx.addIssue({ code: 'custom', path: ['uniqueBucks'], message: 'enter at least one buck you can tell apart by its antlers: the method counts does and fawns from photos per buck' });
  }
  if (typeof v.uniqueBucks === 'number' && typeof v.buckPhotos === 'number' && v.uniqueBucks > v.buckPhotos) {
    ctx.addIssue({ code: 'custom', path: ['uniqueBucks'], message: `unique bucks (${v.uniqueBucks}) cannot be more than buck photos (${v.buckPhotos}); every buck was photographed at least once` });
  }
  if (v.bucks && v.bucks.length > 0 && typeof v.uniqueBucks === 'number' && v.bucks.length !== v.uniqueBucks) {
    ctx.addIssue({ code: 'custom', path: ['bucks'], message: `list one entry per unique buck: ${v.bucks.length} listed, ${v.uniqueBucks} unique bucks entered` });
  }
  if (v.startDate && v.endDate && v.endDate < v.startDate) {
    ctx.addIssue({ code: 'custom', path: ['endDate'], message: `the survey ends (${formatDate(v.endDate)}) before it starts (${formatDate(v.startDate)})` });
  }
  const picked = v.cameraUnitIds?.length ?? 0;
  if (whole && picked === 0 && (v.cameraCount === null || v.cameraCount === undefined)) {
    ctx.addIssue({ code: 'custom', path: ['cameraCount'], message: 'pick the camera sites used, or enter how many cameras ran' });
  }
  if (picked > 0 && typeof v.cameraCount === 'number' && v.cameraCount < picked) {
    ctx.addIssue({ code: 'custom', path: ['cameraCount'], message: `${picked} camera sites are picked, so at least ${picked} cameras ran` });
  }
  if (v.cameraUnitIds && new Set(v.cameraUnitIds).size !== v.cameraUnitIds.length) {
    ctx.addIssue({ code: 'custom', path: ['cameraUnitIds'], message: 'a camera site is picked twice' });
  }
}

/** A new camera survey: dates, cameras and the tallies. */
export const SurveyCreateSchema = SurveyFieldsSchema.superRefine((v, ctx) => checkSurvey(v, ctx, true));
export type SurveyCreateInput = z.input<typeof SurveyCreateSchema>;
export type SurveyCreateValues = z.output<typeof SurveyCreateSchema>;

/** A change to a survey: any of its fields; the result is checked whole. */
export const SurveyUpdateSchema = SurveyFieldsSchema.partial().superRefine((v, ctx) => checkSurvey(v, ctx, false));
export type SurveyUpdateInput = z.input<typeof SurveyUpdateSchema>;

/** One harvested deer. */
export const HarvestFieldsSchema = z.object({
  date: IsoDateSchema,
  sex: z.enum(HARVEST_SEXES, { error: 'sex must be male or female' }),
  ageClass: z.enum(AGE_CLASSES, { error: `age class must be one of ${AGE_CLASSES.join(', ')}` }),
  dressedWeightLb: z
    .number({ error: 'dressed weight: enter pounds as a number, or leave it empty' })
    .positive({ message: 'dressed weight must be more than 0 lb' })
    .max(400, { message: 'dressed weight above 400 lb is not a white-tailed deer; check the number' })
    .nullish(),
  antlerPoints: z
    .number({ error: 'antler points: enter a whole number, or leave it empty' })
    .int({ message: 'antler points: enter a whole number' })
    .min(0, { message: 'antler points cannot be negative' })
    .max(60, { message: 'antler points above 60: check the number' })
    .nullish(),
  /** The plan unit (stand, plot) it was taken from, if any. */
  unitId: RecordIdSchema.nullish(),
  /** Where it was taken when no unit fits ("Ridge ladder stand"). */
  stand: optionalNote(LIMITS.nameMax),
  hunter: optionalNote(LIMITS.nameMax),
  notes: optionalNote(LIMITS.textMax),
  /** The stand-site unit it was taken from (hunting pressure), if any. */
  standUnitId: RecordIdSchema.nullish(),
  /** The logged sit it was taken on, if any; must be a sit of this property (and of the stand, when both are given). */
  sitId: RecordIdSchema.nullish(),
  /** The state's disease-sampling (e.g. CWD) number, as the check station or kit gives it. */
  diseaseSampleNumber: z
    .string({ error: 'disease-sampling number: enter it as text, or leave it empty' })
    .trim()
    .max(DISEASE_SAMPLE_NUMBER_MAX, { message: `disease-sampling number: at most ${DISEASE_SAMPLE_NUMBER_MAX} characters` })
    .regex(/^[A-Za-z0-9][A-Za-z0-9 ./#-]*$/, { message: 'disease-sampling number: letters, digits, spaces and - . / # only, as printed on the tag or kit' })
    .nullish()
    .or(z.literal('').transform(() => null)),
});

function checkHarvest(v: Partial<z.output<typeof HarvestFieldsSchema>>, ctx: z.RefinementCtx): void {
  if (v.sex === 'female' && typeof v.antlerPoints === 'number' && v.antlerPoints > 0) {
    ctx.addIssue({ code: 'custom', path: ['antlerPoints'], message: 'antler points are for bucks: leave them empty for a doe, or set the sex to male' });
  }
  if (v.ageClass === 'fawn' && typeof v.antlerPoints === 'number' && v.antlerPoints > 0) {
    ctx.addIssue({ code: 'custom', path: ['antlerPoints'], message: 'a fawn carries no antlers (a button buck has 0 points): check the age class or the points' });
  }
}

/** A new harvest record. */
export const HarvestCreateSchema = HarvestFieldsSchema.superRefine(checkHarvest);
export type HarvestCreateInput = z.input<typeof HarvestCreateSchema>;
export type HarvestCreateValues = z.output<typeof HarvestCreateSchema>;
/** A change to a harvest record; the result is checked whole. */
export const HarvestUpdateSchema = HarvestFieldsSchema.partial().superRefine(checkHarvest);

/** A hunting season named by the year it starts (July–June). */
export const SeasonSchema = z.coerce
  .number({ error: 'season: enter the year the season starts, e.g. 2025' })
  .int({ message: 'season: enter a year such as 2025' })
  .min(1990, { message: 'season: enter a year from 1990 on' })
  .max(2100, { message: 'season: enter a year before 2100' });

export const SeasonParamsSchema = z.object({ id: IdSchema, season: SeasonSchema });

/** A season report to make (a PDF kept for the client; sending is a separate step). */
export const SeasonReportCreateSchema = z.object({
  season: SeasonSchema,
  recommendations: optionalNote(LIMITS.textMax),
});
export type SeasonReportCreateInput = z.input<typeof SeasonReportCreateSchema>;

// ---------------------------------------------------------------------------------------------
// Answers

export interface CameraSiteDto {
  id: number;
  name: string;
}

export interface SurveyDto {
  id: number;
  propertyId: number;
  name: string;
  startDate: string;
  endDate: string;
  /** The hunting season (July–June) the survey started in. */
  season: number;
  buckPhotos: number;
  uniqueBucks: number;
  doePhotos: number;
  fawnPhotos: number;
  bucks: IdentifiedBuck[];
  cameraUnitIds: number[];
  cameras: CameraSiteDto[];
  cameraCount: number;
  notes: string | null;
  /** Acres the density refers to: the area a photo survey's cameras cover, else the property's. */
  areaAcres?: number | null;
  /** The deployments and dates a survey was tallied from, when made from tagged photos. */
  fromPhotos?: { deploymentIds: number[]; from: string; to: string } | null;
  /** Null only when the property has no measured area. */
  estimates: SurveyEstimates | null;
  display: SurveyEstimatesDisplay | null;
  surveyDays: number;
  acresPerCamera: number | null;
  warnings: SurveyWarning[];
  createdAt: string;
  updatedAt: string;
}

export interface HarvestDto {
  id: number;
  propertyId: number;
  date: string;
  season: number;
  sex: HarvestSex;
  ageClass: (typeof AGE_CLASSES)[number];
  dressedWeightLb: number | null;
  antlerPoints: number | null;
  unitId: number | null;
  unitName: string | null;
  stand: string | null;
  hunter: string | null;
  notes: string | null;
  standUnitId: number | null;
  standName: string | null;
  sitId: number | null;
  diseaseSampleNumber: string | null;
  createdAt: string;
}

export interface SeasonReportDto {
  id: number;
  propertyId: number;
  season: number;
  seasonLabel: string;
  recommendations: string | null;
  sentAt: string | null;
  sentTo: string[];
  /** Set when a sent report was withdrawn from the landowner's portal. */
  withdrawnAt: string | null;
  byteSize: number;
  pdfUrl: string;
  createdAt: string;
}

/** One season of surveys, for charts compared season over season (the season's latest survey); buckDoeRatio is does per buck. */
export type SurveyTrendPoint = SurveyTrendRow;

/** Everything the Results page shows for one property. */
export interface ResultsDto {
  property: { id: number; name: string; acres: number | null; clientId: number };
  cameraSites: CameraSiteDto[];
  /** Units a harvest may be tied to (stands, plots…). */
  units: { id: number; name: string; kind: string }[];
  surveys: SurveyDto[];
  surveyTrend: SurveyTrendPoint[];
  harvests: HarvestDto[];
  harvestSummary: HarvestSummary;
  reports: SeasonReportDto[];
  cautions: Caution[];
}

export interface SeasonWorkItem {
  taskId: number;
  name: string;
  unitName: string;
  practiceName: string;
  doneOn: string;
}

/** One season's results: the work done, the acres established, surveys and harvests. */
export interface SeasonSummaryDto {
  season: number;
  label: string;
  startsOn: string;
  endsOn: string;
  property: { id: number; name: string; acres: number | null };
  work: SeasonWorkItem[];
  photoCount: number;
  acresEstablished: number;
  unitsEstablished: { id: number; name: string; kind: string; acres: number | null }[];
  surveys: SurveyDto[];
  harvests: HarvestDto[];
  harvestSummary: HarvestSummary;
  surveyTrend: SurveyTrendPoint[];
  /** Harvest by season up to this one (buck:doe trend). */
  harvestTrend: SeasonSummary[];
}
