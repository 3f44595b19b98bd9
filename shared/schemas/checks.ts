/**
 * Checks on a unit — establishment check, browse check (exclusion cages), timber cruise: the bodies
 * the server validates and the field sheet's and unit page's forms use, and the answer's shape.
 */
import { z } from 'zod';
import { IsoDateSchema } from './common';
import { LIMITS } from '../limits';
import { WEED_PRESSURES, type BrowseResult, type EstablishmentResult, type PlotCheckStatus, type TimberResult } from '../domain/plot-checks';

export const CHECK_KINDS = ['establishment', 'browse', 'timber'] as const;
export type CheckKind = (typeof CHECK_KINDS)[number];
export const CHECK_KIND_LABELS: Record<CheckKind, string> = { establishment: 'Establishment check', browse: 'Browse check', timber: 'Timber cruise' };

/** Most frames, pairs or prism points one check may carry: far above a real check, low enough to catch a slip. */
export const CHECK_MAX_SAMPLES = 500;
/** Most DBHs one prism point may list. */
export const CHECK_MAX_TREES_PER_POINT = 200;

const species = z
  .string({ error: 'species: name the species, e.g. “white clover”' })
  .trim()
  .min(1, { message: 'species: name the species, e.g. “white clover”' })
  .max(LIMITS.nameMax, { message: `species: at most ${LIMITS.nameMax} characters` });

const wholeCount = (label: string) =>
  z
    .number({ error: `${label}: enter a whole number, zero or more` })
    .int({ message: `${label}: enter a whole number (no fractions)` })
    .min(0, { message: `${label} cannot be negative` })
    .max(100_000, { message: `${label} cannot be more than 100,000` });

const positive = (label: string, unit: string, max: number) =>
  z
    .number({ error: `${label}: enter a number of ${unit}` })
    .gt(0, { message: `${label} must be more than 0 ${unit}` })
    .max(max, { message: `${label} cannot be more than ${max.toLocaleString('en-US')} ${unit}` });

const notes = z.string().trim().max(LIMITS.textMax, { message: `notes: at most ${LIMITS.textMax} characters` }).nullish();

export const EstablishmentCheckCreateSchema = z.object({
  kind: z.literal('establishment'),
  checkedOn: IsoDateSchema,
  frameSqFt: positive('frameSqFt: the frame area', 'ft²', 100),
  samples: z
    .array(z.object({ species, plants: wholeCount('plants: the count') }), { error: 'samples: list the frames counted' })
    .min(1, { message: 'samples: count at least one frame' })
    .max(CHECK_MAX_SAMPLES, { message: `samples: at most ${CHECK_MAX_SAMPLES} frames` }),
  groundCoverPct: z.number({ error: 'groundCoverPct: enter a percentage, 0 to 100' }).min(0, { message: 'groundCoverPct cannot be below 0 %' }).max(100, { message: 'groundCoverPct cannot be above 100 %' }),
  weedPressure: z.enum(WEED_PRESSURES, { error: `weedPressure must be one of ${WEED_PRESSURES.join(', ')}` }),
  notes,
});

export const BROWSE_MEASURES = ['height-in', 'clipped-g'] as const;

export const BrowseCheckCreateSchema = z
  .object({
    kind: z.literal('browse'),
    checkedOn: IsoDateSchema,
    /** What each sample measures: plant height in inches, or clipped weight in grams. */
    measure: z.enum(BROWSE_MEASURES, { error: `measure must be one of ${BROWSE_MEASURES.join(', ')}` }).default('height-in'),
    pairs: z
      .array(
        z.object({
          species,
          caged: positive('caged: the caged sample', 'units of the measure', 100_000),
          open: z.number({ error: 'open: enter the open sample, 0 or more' }).min(0, { message: 'open cannot be negative' }).max(100_000, { message: 'open cannot be more than 100,000' }),
        }),
        { error: 'pairs: list the caged and open pairs' },
      )
      .min(1, { message: 'pairs: measure at least one caged and open pair' })
      .max(CHECK_MAX_SAMPLES, { message: `pairs: at most ${CHECK_MAX_SAMPLES} pairs` }),
    notes,
  })
  .superRefine((body, ctx) => {
    body.pairs.forEach((pair, i) => {
      if (pair.open > pair.caged) {
        ctx.addIssue({
          code: 'custom',
          path: ['pairs', i, 'open'],
          message: `open (${pair.open}) is larger than its cage (${pair.caged}) for ${pair.species}: the cage method measures what deer removed, so open cannot exceed caged — measure the pair again`,
        });
      }
    });
  });

export const TimberCheckCreateSchema = z
  .object({
    kind: z.literal('timber'),
    /** Defaults to the firm's today. */
    checkedOn: IsoDateSchema.optional(),
    baf: positive('baf: the basal area factor', 'ft²/acre per tree', 100),
    points: z
      .array(
        z.object({
          inTrees: wholeCount('inTrees: the count of in-trees'),
          dbhIn: z
            .union([positive('dbhIn', 'inches', 120), z.array(positive('dbhIn', 'inches', 120)).max(CHECK_MAX_TREES_PER_POINT)], { error: 'dbhIn: one DBH in inches, or one per in-tree' })
            .optional(),
        }),
        { error: 'points: list the prism points' },
      )
      .min(1, { message: 'points: record at least one prism point' })
      .max(CHECK_MAX_SAMPLES, { message: `points: at most ${CHECK_MAX_SAMPLES} points` }),
    /** Overrides the prescription's target residual basal area, ft²/acre. */
    targetResidualBaSqFtPerAcre: positive('targetResidualBaSqFtPerAcre', 'ft²/acre', 500).optional(),
    notes,
  })
  .superRefine((body, ctx) => {
    body.points.forEach((point, i) => {
      if (Array.isArray(point.dbhIn) && point.dbhIn.length !== point.inTrees) {
        ctx.addIssue({ code: 'custom', path: ['points', i, 'dbhIn'], message: `point ${i + 1} lists ${point.dbhIn.length} DBHs for ${point.inTrees} in-trees: give one per tree, or one mean for the point` });
      }
    });
  });

export const UnitCheckCreateSchema = z.discriminatedUnion('kind', [EstablishmentCheckCreateSchema, BrowseCheckCreateSchema, TimberCheckCreateSchema], {
  error: `kind must be one of ${CHECK_KINDS.join(', ')}`,
});
export type UnitCheckCreateInput = z.input<typeof UnitCheckCreateSchema>;
export type UnitCheckCreateValues = z.output<typeof UnitCheckCreateSchema>;

export const RESEED_STATUSES = ['proposed', 'accepted', 'rejected'] as const;
export type ReseedStatus = (typeof RESEED_STATUSES)[number];

/** A re-seeding drafted by a thin or failed establishment check, for the consultant to accept. */
export interface ReseedDraftDto {
  status: ReseedStatus;
  /** Share of the practice's full seeding rates (0.5 overseed, 1 full). */
  rateFactor: number;
  practiceId: number | null;
  practiceName: string | null;
  year: number;
  reason: string;
  prescriptionId: number | null;
}

export const ReseedDecisionSchema = z.object({ decision: z.enum(['accept', 'reject'], { error: 'decision must be accept or reject' }) });

interface CheckBase {
  id: number;
  unitId: number;
  unitName: string;
  propertyId: number;
  checkedOn: string;
  /** The calendar year of the check, as prescriptions' `year`. */
  season: number;
  status: PlotCheckStatus;
  notes: string | null;
  createdAt: string;
}

export type UnitCheckDto =
  | (CheckBase & { kind: 'establishment'; frameSqFt: number; samples: { species: string; plants: number }[]; groundCoverPct: number; weedPressure: string; result: EstablishmentResult; reseed: ReseedDraftDto | null })
  | (CheckBase & { kind: 'browse'; measure: string; pairs: { species: string; caged: number; open: number }[]; result: BrowseResult })
  | (CheckBase & { kind: 'timber'; baf: number; points: { inTrees: number; dbhIn?: number | number[] }[]; result: TimberResult });

/** The answer's shape, for integration tests and the client. */
export const UnitCheckDtoSchema = z.looseObject({
  id: z.number().int(),
  unitId: z.number().int(),
  unitName: z.string(),
  propertyId: z.number().int(),
  kind: z.enum(CHECK_KINDS),
  checkedOn: IsoDateSchema,
  season: z.number().int(),
  status: z.string(),
  result: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});

/** The latest check status of each checked unit of a property (plan map, Progress). */
export interface PlotStatusDto {
  unitId: number;
  unitName: string;
  status: PlotCheckStatus;
  kind: CheckKind;
  checkedOn: string;
}

/** How each plot status reads to people. */
export const PLOT_STATUS_LABELS: Record<PlotCheckStatus, string> = {
  established: 'Established',
  thin: 'Thin stand',
  failed: 'Failed stand',
  'browsed-hard': 'Browsed hard',
  'over-target': 'Over target basal area',
  checked: 'Checked',
};
