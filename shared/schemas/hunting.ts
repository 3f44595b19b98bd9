/** Hunting pressure: stand sites, stand winds, the wind record, sits and pressure (requests and answers). */
import { z } from 'zod';
import type { Geometry } from 'geojson';
import { STAND_TYPES } from '../domain/unit-kinds';
import { WIND_NAMES, windSector, type WindName } from '../domain/stand-winds';
import { LIMITS } from '../limits';
import { RecordIdSchema } from './common';

/** Upload and size limits of the planner, checked before the work they protect. */
export const HUNTING_LIMITS = {
  /** A wind file: a year of hourly lines is about 0.5 MB (ISD-Lite) — ten years fit. */
  windFileMaxBytes: 8 * 1024 * 1024,
  /** Above this the file is parsed in a worker thread, off the event loop. */
  windFileInlineBytes: 256 * 1024,
  sitMaxHours: 24,
  deerSeenMax: 500,
  windMphMax: 150,
  standHeightFtMax: 60,
  /** Most identified bucks one sit may name (more than any roster sees at once; common practice, no source). */
  sitBucksMax: 20,
} as const;

export const WindNameSchema = z.enum(WIND_NAMES, { error: `the wind must be one of the 16 names: ${WIND_NAMES.join(', ')}` });

/** A wind given as one of the 16 names or in degrees (0–360, where it blows from); answers the name. */
export const WindInputSchema = z.union(
  [
    WindNameSchema,
    z
      .number({ message: 'the wind must be degrees from 0 to 360 or one of the 16 names' })
      .min(0, { message: 'a wind direction in degrees must be from 0 to 360' })
      .max(360, { message: 'a wind direction in degrees must be from 0 to 360' })
      .transform((d): WindName => windSector(d)),
  ],
  { error: `the wind must be degrees from 0 to 360 or one of the 16 names (${WIND_NAMES.join(', ')})` },
);

export const StandTypeSchema = z.enum(STAND_TYPES, { error: `stand type must be one of: ${STAND_TYPES.join(', ')}` });

/** What a stand site watches, its type and height. Null clears a field. */
export const StandSiteUpdateSchema = z
  .object({
    watchedUnitId: RecordIdSchema.nullable().optional(),
    standType: StandTypeSchema.nullable().optional(),
    heightFt: z.number().min(0).max(HUNTING_LIMITS.standHeightFtMax, { message: `height must be at most ${HUNTING_LIMITS.standHeightFtMax} ft` }).nullable().optional(),
    approachFrom: WindNameSchema.nullable().optional(),
  })
  .strict();
export type StandSiteUpdateInput = z.infer<typeof StandSiteUpdateSchema>;

export const StandSiteSchema = z.object({
  unitId: z.number().int(),
  name: z.string(),
  watchedUnitId: z.number().int().nullable(),
  standType: StandTypeSchema.nullable(),
  heightFt: z.number().nullable(),
  approachFrom: WindNameSchema.nullable(),
});
export type StandSiteDto = z.infer<typeof StandSiteSchema>;

export const WindReasonSchema = z.object({ kind: z.enum(['bedding-area', 'sanctuary', 'approach-side', 'route']), unitId: z.number().int(), name: z.string() });

export const StandWindsRowSchema = z.object({
  unitId: z.number().int(),
  name: z.string(),
  standType: StandTypeSchema.nullable(),
  heightFt: z.number().nullable(),
  watchedUnitId: z.number().int().nullable(),
  approachFrom: WindNameSchema.nullable(),
  routeIds: z.array(z.number().int()),
  winds: z.array(z.object({ from: WindNameSchema, degrees: z.number(), suitable: z.boolean(), reasons: z.array(WindReasonSchema), routeIds: z.array(z.number().int()) })),
  /** Share of the wind record's hours with a suitable wind; null without a wind record. */
  huntableShare: z.number().nullable(),
});
export type StandWindsRow = z.infer<typeof StandWindsRowSchema>;

export const HuntingSettingsSchema = z.object({
  coneHalfAngleDeg: z.number().min(5).max(90),
  coneReachYd: z.number().min(25).max(2000),
  routeBufferYd: z.number().min(10).max(1000),
  routeToStandYd: z.number().min(5).max(500),
  maxSitsPerWeek: z.number().int().min(1).max(14),
});
export const HuntingSettingsUpdateSchema = HuntingSettingsSchema.partial().strict();
export type HuntingSettingsUpdateInput = z.infer<typeof HuntingSettingsUpdateSchema>;

export const RouteWarningSchema = z.object({ code: z.enum(['route-near-bedding', 'route-near-sanctuary', 'route-crosses-food-plot']), unitIds: z.array(z.number().int()), message: z.string(), distanceYd: z.number() });

export const CautionSchema = z.object({ id: z.string(), title: z.string(), text: z.string() });

/** `GET /api/properties/:id/stand-winds`. */
export const StandWindsAnswerSchema = z.object({
  data: z.array(StandWindsRowSchema),
  meta: z.object({
    settings: HuntingSettingsSchema,
    routeWarnings: z.array(RouteWarningSchema),
    cautions: z.array(CautionSchema),
    hasWindRecord: z.boolean(),
    /** Whether the reader may log sits (staff; a client's contacts when turned on). */
    mayLogSits: z.boolean(),
    /** The units the planner's map draws: bedding areas, sanctuaries, food plots, access routes and stands. */
    layout: z.array(z.object({ id: z.number().int(), name: z.string(), kind: z.string(), geometry: z.custom<Geometry>() })),
    boundary: z.custom<Geometry>().nullable(),
  }),
});
export type StandWindsAnswer = z.infer<typeof StandWindsAnswerSchema>;

const MonthsSchema = z.array(z.number().int().min(1, { message: 'months are 1 (January) to 12 (December)' }).max(12, { message: 'months are 1 (January) to 12 (December)' })).min(1).max(12);
export const HoursFilterSchema = z.enum(['hunting', 'all'], { error: 'hours must be “hunting” (30 min before sunrise to 30 min after sunset) or “all”' });

/** Months and hours for a wind file (multipart fields: `months` "9,10,11", `hours`). */
export const WindFileFieldsSchema = z.object({
  months: z
    .string()
    .optional()
    .transform((v) => (v && v.trim() ? v.split(',').map((m) => Number(m.trim())) : undefined))
    .pipe(MonthsSchema.optional()),
  hours: HoursFilterSchema.optional(),
});

/** Typed 16-sector frequencies (any positive numbers; normalised to shares). */
export const WindSectorsSchema = z
  .object({
    sectors: z.array(z.object({ from: WindNameSchema, share: z.number().min(0, { message: 'a share cannot be negative' }) })).min(1).max(16),
  })
  .strict();

export const WindRecordSchema = z.object({
  rose: z.array(z.object({ from: WindNameSchema, share: z.number() })),
  hours: z.number().int(),
  calmHours: z.number().int(),
  skippedRows: z.number().int(),
  source: z.enum(['csv', 'isd-lite', 'sectors']),
  fileName: z.string().nullable(),
  months: z.array(z.number().int()),
  hoursFilter: z.enum(['hunting', 'all', 'typed']),
  updatedAt: z.string(),
});
export type WindRecordDto = z.infer<typeof WindRecordSchema>;

/** A sit as a phone sends it. Times are ISO 8601 instants. */
export const SitCreateSchema = z
  .object({
    standUnitId: RecordIdSchema,
    startedAt: z.iso.datetime({ offset: true, message: 'startedAt must be a date and time, e.g. 2026-11-14T06:10:00-06:00' }),
    endedAt: z.iso.datetime({ offset: true, message: 'endedAt must be a date and time, e.g. 2026-11-14T09:30:00-06:00' }),
    windFrom: WindInputSchema.optional(),
    windMph: z.number().min(0).max(HUNTING_LIMITS.windMphMax, { message: `wind speed must be at most ${HUNTING_LIMITS.windMphMax} mph` }).optional(),
    seen: z.object({
      bucks: z.number().int().min(0).max(HUNTING_LIMITS.deerSeenMax),
      does: z.number().int().min(0).max(HUNTING_LIMITS.deerSeenMax),
      fawns: z.number().int().min(0).max(HUNTING_LIMITS.deerSeenMax),
    }),
    notes: z.string().trim().max(LIMITS.textMax).optional(),
    /** Identified bucks from the property's camera roster (`GET /api/properties/:id/bucks`). */
    buckIds: z
      .array(RecordIdSchema, { error: 'buckIds: a list of buck ids from the camera roster' })
      .max(HUNTING_LIMITS.sitBucksMax, { message: `buckIds: at most ${HUNTING_LIMITS.sitBucksMax} identified bucks per sit` })
      .refine((ids) => new Set(ids).size === ids.length, { message: 'buckIds: each buck once' })
      .optional(),
  })
  .superRefine((v, ctx) => {
    const ms = Date.parse(v.endedAt) - Date.parse(v.startedAt);
    if (!(ms > 0)) ctx.addIssue({ code: 'custom', path: ['endedAt'], message: 'the sit ends before it starts: endedAt must be after startedAt' });
    else if (ms > HUNTING_LIMITS.sitMaxHours * 3600_000) ctx.addIssue({ code: 'custom', path: ['endedAt'], message: `a sit lasts at most ${HUNTING_LIMITS.sitMaxHours} hours: check the start and end` });
  });
export type SitCreateInput = z.input<typeof SitCreateSchema>;
export type SitCreateValues = z.output<typeof SitCreateSchema>;

export const SitSchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  standUnitId: z.number().int(),
  standName: z.string(),
  startedAt: z.string(),
  endedAt: z.string(),
  windFrom: WindNameSchema.nullable(),
  windMph: z.number().nullable(),
  seen: z.object({ bucks: z.number().int(), does: z.number().int(), fawns: z.number().int() }),
  notes: z.string().nullable(),
  buckIds: z.array(z.number().int()),
  /** False when the stand does not suit the sit's wind; null without a wind. */
  windSuitable: z.boolean().nullable(),
  createdAt: z.string(),
});
export type SitDto = z.infer<typeof SitSchema>;

export const PressureRowSchema = z.object({
  unitId: z.number().int(),
  name: z.string(),
  sits: z.number().int(),
  hours: z.number(),
  lastSitOn: z.string().nullable(),
  daysSinceLastSit: z.number().int().nullable(),
  deerPerHour: z.number().nullable(),
  sitsOnUnsuitableWind: z.number().int(),
  /** Sits in the seven days up to today (the firm's clock). */
  sitsThisWeek: z.number().int(),
  /** More sits this week than the firm's setting. */
  overPressured: z.boolean(),
});
export type PressureRow = z.infer<typeof PressureRowSchema>;

export const PressureAnswerSchema = z.object({ data: z.array(PressureRowSchema), meta: z.object({ maxSitsPerWeek: z.number().int(), season: z.number().int() }) });

export const PressureQuerySchema = z.object({ season: z.coerce.number().int().min(2000).max(2100).optional() });

export const SitLoggingSchema = z.object({ allowed: z.boolean({ message: 'allowed must be true or false' }) }).strict();

export const PressureWarningSchema = z.object({
  propertyId: z.number().int(),
  propertyName: z.string(),
  unitId: z.number().int(),
  name: z.string(),
  sitsThisWeek: z.number().int(),
  maxSitsPerWeek: z.number().int(),
  message: z.string(),
});
export type PressureWarning = z.infer<typeof PressureWarningSchema>;
