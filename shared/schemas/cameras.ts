/**
 * The camera fleet: cameras, their deployments at camera sites, card pulls, card photos and their
 * review, the buck roster and a deployment's events. One set of schemas for the server's
 * validation, the pages' forms and the answers' types.
 */
import { z } from 'zod';
import { IsoDateSchema, RecordIdSchema, optionalText } from './common';
import { SurveyCreateSchema } from './results';
import { LIMITS } from '../limits';
import { AGE_CLASSES } from '../domain/survey-estimates';
import { CAMERA_TAGS, SUN_PERIODS, type SunPeriod } from '../domain/camera-events';

export { CAMERA_TAGS };

/** How a camera records. */
export const CAMERA_MODES = ['photo', 'video', 'hybrid'] as const;
export type CameraMode = (typeof CAMERA_MODES)[number];

/** Limits of a card upload. */
export const CARD_LIMITS = {
  /** Bytes one card photo may have (trail cameras write 1–8 MB JPEGs). */
  maxBytes: 20 * 1024 * 1024,
  /** Photos one request may carry; the page sends a card in small batches. */
  perRequest: 10,
  /** Pixels of one photo (width × height), checked from its header before anything is decoded. */
  maxPixels: 60_000_000,
  /** Hashes one "which do you have" question may ask about. */
  hashesPerQuery: 2000,
  /** Largest clock correction, seconds (a camera a year off is "never set", not drift). */
  maxClockOffsetSeconds: 400 * 86_400,
} as const;

const label = z.string({ error: 'give the camera a label, e.g. “Cam 4”' }).trim().min(1, { message: 'give the camera a label, e.g. “Cam 4”' }).max(60, { message: 'a camera label must be at most 60 characters' });

export const CameraCreateSchema = z
  .object({
    label,
    serial: optionalText(80),
  })
  .strict();
export type CameraCreateInput = z.input<typeof CameraCreateSchema>;

export const CameraUpdateSchema = z.object({ label: label.optional(), serial: optionalText(80), retired: z.boolean().optional() }).strict();

export const DeploymentCreateSchema = z
  .object({
    unitId: RecordIdSchema,
    startedOn: IsoDateSchema,
    mode: z.enum(CAMERA_MODES, { error: `mode: choose ${CAMERA_MODES.join(', ')}` }),
    notes: optionalText(LIMITS.textMax),
    /** Seconds to add to the camera's clock to get the true time (a camera 5 minutes slow: 300). */
    clockOffsetSeconds: z.number().int({ message: 'clock offset: whole seconds' }).min(-CARD_LIMITS.maxClockOffsetSeconds).max(CARD_LIMITS.maxClockOffsetSeconds, { message: 'a clock more than 400 days off was never set: set the camera’s clock and enter the offset of the photos taken before' }).optional(),
  })
  .strict();
export type DeploymentCreateInput = z.input<typeof DeploymentCreateSchema>;

/** Ending a deployment (the camera is moved or taken down), or correcting its clock offset or notes. */
export const DeploymentUpdateSchema = z
  .object({
    endedOn: IsoDateSchema.optional(),
    clockOffsetSeconds: z.number().int({ message: 'clock offset: whole seconds' }).min(-CARD_LIMITS.maxClockOffsetSeconds).max(CARD_LIMITS.maxClockOffsetSeconds).optional(),
    notes: optionalText(LIMITS.textMax),
  })
  .strict();
export type DeploymentUpdateInput = z.input<typeof DeploymentUpdateSchema>;

export const CardPullCreateSchema = z
  .object({
    pulledOn: IsoDateSchema,
    batteryPct: z.number({ error: 'battery: enter a percentage' }).int({ message: 'battery: a whole percentage' }).min(0).max(100, { message: 'battery: at most 100 %' }).nullish(),
    photoCount: z.number({ error: 'photos on the card: enter a whole number' }).int().min(0).max(1_000_000).nullish(),
    notes: optionalText(LIMITS.textMax),
  })
  .strict();
export type CardPullCreateInput = z.input<typeof CardPullCreateSchema>;

export const CameraPhotoTagSchema = z
  .object({
    tag: z.enum(CAMERA_TAGS, { error: `tag: choose one of ${CAMERA_TAGS.join(', ')}` }).nullable(),
    buckId: RecordIdSchema.nullish(),
    /** Shown to the landowner among the roster's best photos (never a photo tagged person). */
    featured: z.boolean().optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.buckId && v.tag !== 'buck') ctx.addIssue({ code: 'custom', path: ['buckId'], message: 'only a photo tagged buck can name a buck from the roster' });
    if (v.featured && v.tag === 'person') ctx.addIssue({ code: 'custom', path: ['featured'], message: 'a photo of a person is never shown to the landowner' });
  });
export type CameraPhotoTagInput = z.input<typeof CameraPhotoTagSchema>;

/** "Which of these photos do you have?" — the card upload asks before sending each batch. */
export const PhotoHashQuerySchema = z
  .object({
    hashes: z.array(z.string().regex(/^[a-f0-9]{64}$/, { message: 'each hash is 64 hex digits (SHA-256)' })).min(1).max(CARD_LIMITS.hashesPerQuery),
  })
  .strict();

export const PhotoListQuerySchema = z.object({
  tag: z.union([z.enum(CAMERA_TAGS), z.literal('untagged')], { error: `tag: choose one of ${CAMERA_TAGS.join(', ')} or untagged` }).optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(500),
  offset: z.coerce.number().int().min(0).default(0),
});

const AgeEstimateSchema = z.object({
  season: z.number().int().min(1990).max(2100, { message: 'season: the year the season starts' }),
  ageClass: z.enum(AGE_CLASSES, { error: `age class must be one of ${AGE_CLASSES.join(', ')}` }),
});

export const BuckCreateSchema = z
  .object({
    name: z.string({ error: 'name the buck, e.g. “Split G2”' }).trim().min(1, { message: 'name the buck, e.g. “Split G2”' }).max(60),
    notes: optionalText(LIMITS.textMax),
    ageEstimates: z.array(AgeEstimateSchema).max(30).optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    const seasons = (v.ageEstimates ?? []).map((a) => a.season);
    if (new Set(seasons).size !== seasons.length) ctx.addIssue({ code: 'custom', path: ['ageEstimates'], message: 'give one age class per season' });
  });
export type BuckCreateInput = z.input<typeof BuckCreateSchema>;

export const BuckUpdateSchema = z
  .object({
    name: z.string().trim().min(1).max(60).optional(),
    notes: optionalText(LIMITS.textMax),
    ageEstimates: z.array(AgeEstimateSchema).max(30).optional(),
  })
  .strict();
export type BuckUpdateInput = z.input<typeof BuckUpdateSchema>;

/** A survey made from tagged photos of chosen deployments and dates, in place of typed tallies. */
export const FromPhotosSchema = z
  .object({
    deploymentIds: z.array(RecordIdSchema).min(1, { message: 'pick at least one deployment' }).max(200),
    from: IsoDateSchema,
    to: IsoDateSchema,
  })
  .strict()
  .refine((v) => v.from <= v.to, { path: ['to'], message: 'the survey ends before it starts' })
  .refine((v) => new Set(v.deploymentIds).size === v.deploymentIds.length, { path: ['deploymentIds'], message: 'a deployment is picked twice' });

export const SurveyFromPhotosSchema = z
  .object({
    name: z.string().trim().min(1, { message: 'name the survey, e.g. “Late-summer survey”' }).max(LIMITS.nameMax),
    fromPhotos: FromPhotosSchema,
    /** Acres the density refers to; by default about 100 acres per camera, capped at the property. */
    areaAcres: z.number().positive().max(10_000_000).optional(),
    notes: optionalText(LIMITS.textMax),
  })
  .strict();
export type SurveyFromPhotosInput = z.input<typeof SurveyFromPhotosSchema>;

/** True when a survey body asks to tally tagged photos (it carries `fromPhotos`) instead of typed tallies. */
export const isFromPhotos = (body: unknown): boolean => typeof body === 'object' && body !== null && 'fromPhotos' in body;

/**
 * POST /api/properties/:id/surveys: typed tallies (SurveyCreateSchema), or `fromPhotos` to tally the
 * tagged photos (SurveyFromPhotosSchema); each form is checked by its own schema, with its own messages.
 */
export const SurveyPostSchema = z.unknown().transform((value, ctx) => {
  const result = isFromPhotos(value) ? SurveyFromPhotosSchema.safeParse(value) : SurveyCreateSchema.safeParse(value);
  if (result.success) return result.data;
  for (const issue of result.error.issues) ctx.addIssue({ ...issue, input: undefined } as Parameters<typeof ctx.addIssue>[0]);
  return z.NEVER;
});

// ---- answers ----

export const CameraDtoSchema = z.object({
  id: z.number().int(),
  label: z.string(),
  serial: z.string().nullable(),
  retired: z.boolean(),
  /** The deployment running now, if any. */
  deployment: z.object({ id: z.number().int(), propertyId: z.number().int(), propertyName: z.string(), unitId: z.number().int(), unitName: z.string(), startedOn: z.string() }).nullable(),
});
export type CameraDto = z.infer<typeof CameraDtoSchema>;

export const CardPullDtoSchema = z.object({
  id: z.number().int(),
  deploymentId: z.number().int(),
  pulledOn: z.string(),
  batteryPct: z.number().int().nullable(),
  photoCount: z.number().int().nullable(),
  notes: z.string().nullable(),
});
export type CardPullDto = z.infer<typeof CardPullDtoSchema>;

export const DeploymentDtoSchema = z.object({
  id: z.number().int(),
  cameraId: z.number().int(),
  cameraLabel: z.string(),
  propertyId: z.number().int(),
  propertyName: z.string(),
  unitId: z.number().int(),
  unitName: z.string(),
  startedOn: z.string(),
  endedOn: z.string().nullable(),
  mode: z.enum(CAMERA_MODES),
  notes: z.string().nullable(),
  clockOffsetSeconds: z.number().int(),
  photoCount: z.number().int(),
  lastPulledOn: z.string().nullable(),
  pulls: z.array(CardPullDtoSchema),
});
export type DeploymentDto = z.infer<typeof DeploymentDtoSchema>;

export const CameraPhotoDtoSchema = z.object({
  id: z.number().int(),
  deploymentId: z.number().int(),
  takenAt: z.string().nullable(),
  /** The camera's own reading, before the clock correction ("YYYY-MM-DDTHH:MM:SS"). */
  cameraTime: z.string().nullable(),
  tag: z.enum(CAMERA_TAGS).nullable(),
  buckId: z.number().int().nullable(),
  featured: z.boolean(),
  originalName: z.string().nullable(),
  url: z.string(),
  thumbnailUrl: z.string().nullable(),
  flags: z.array(z.string()),
});
export type CameraPhotoDto = z.infer<typeof CameraPhotoDtoSchema>;

export const SKIP_REASONS = ['duplicate', 'not-a-photo', 'too-large', 'too-many-pixels', 'no-time'] as const;
export type SkipReason = (typeof SKIP_REASONS)[number];

export const CardUploadResultSchema = z.object({
  added: z.number().int(),
  skipped: z.number().int(),
  photos: z.array(CameraPhotoDtoSchema),
  skips: z.array(z.object({ name: z.string().nullable(), reason: z.enum(SKIP_REASONS), message: z.string() })),
  /** Photos kept with a warning (no EXIF time, a date in the future, GPS at 0,0). */
  flagged: z.array(z.object({ name: z.string().nullable(), message: z.string() })),
});
export type CardUploadResult = z.infer<typeof CardUploadResultSchema>;

export const BuckDtoSchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  name: z.string(),
  notes: z.string().nullable(),
  ageEstimates: z.array(z.object({ season: z.number().int(), ageClass: z.enum(AGE_CLASSES) })),
  photoCount: z.number().int(),
  firstSeen: z.string().nullable(),
  lastSeen: z.string().nullable(),
  photos: z.array(z.object({ id: z.number().int(), takenAt: z.string().nullable(), thumbnailUrl: z.string().nullable(), url: z.string(), featured: z.boolean() })),
});
export type BuckDto = z.infer<typeof BuckDtoSchema>;

const eventSchema = z.object({
  kind: z.enum(['deer', 'other-species', 'person']),
  startedAt: z.string(),
  endedAt: z.string(),
  photoIds: z.array(z.number().int()),
  tags: z.record(z.string(), z.number().int()),
  buckIds: z.array(z.number().int()),
});

export const DeploymentEventsDtoSchema = z.object({
  events: z.array(eventSchema),
  /** Independent deer events (other kinds are in `events` and `eventsByKind`). */
  eventCount: z.number().int(),
  eventsByKind: z.object({ deer: z.number().int(), 'other-species': z.number().int(), person: z.number().int() }),
  cameraNights: z.number().int(),
  eventsPer100CameraNights: z.number().nullable(),
  gapMinutes: z.number(),
  activity: z.object({
    byHour: z.array(z.number().int()).length(24),
    bySun: z.record(z.enum(SUN_PERIODS as [SunPeriod, ...SunPeriod[]]), z.number().int()),
    daylightShare: z.number().nullable(),
  }),
  position: z.tuple([z.number(), z.number()]).nullable(),
});
export type DeploymentEventsDto = z.infer<typeof DeploymentEventsDtoSchema>;

export const DuePullDtoSchema = z.object({
  deploymentId: z.number().int(),
  cameraLabel: z.string(),
  propertyId: z.number().int(),
  propertyName: z.string(),
  unitId: z.number().int(),
  unitName: z.string(),
  /** The last pull, or the day the camera was set. */
  since: z.string(),
  daysSince: z.number().int(),
  dueOn: z.string(),
  position: z.tuple([z.number(), z.number()]).nullable(),
  /** The access route to walk in on: the property's access-route unit nearest the camera. */
  accessRoute: z.object({ id: z.number().int(), name: z.string(), distanceFt: z.number() }).nullable(),
});
export type DuePullDto = z.infer<typeof DuePullDtoSchema>;

const byKind = <T extends z.ZodType>(v: T) => z.object({ deer: v, 'other-species': v, person: v });

/** One camera site's numbers over all its deployments (`GET /api/properties/:id/camera-sites`). */
export const CameraSiteSummaryDtoSchema = z.object({
  unitId: z.number().int(),
  name: z.string(),
  deploymentCount: z.number().int(),
  /** The sum of each deployment's nights. */
  cameraNights: z.number().int(),
  eventsByKind: byKind(z.number().int()),
  eventsPer100CameraNights: byKind(z.number().nullable()),
  /** Events of each kind by the hour (0–23) they started, on the firm's clock. */
  byHour: byKind(z.array(z.number().int()).length(24)),
  deerDaylightShare: z.number().nullable(),
});
export type CameraSiteSummaryDto = z.infer<typeof CameraSiteSummaryDtoSchema>;

export const CameraSitesAnswerSchema = z.object({
  data: z.array(CameraSiteSummaryDtoSchema),
  meta: z.object({ gapMinutes: z.number(), timezone: z.string() }),
});
export type CameraSitesAnswer = z.infer<typeof CameraSitesAnswerSchema>;
