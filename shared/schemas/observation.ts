/** Field observations: what the log form sends (multipart text fields), the answers, list and summary queries. */
import { z } from 'zod';
import { LIMITS } from '../limits';
import { OBSERVATION_KINDS, POSITION_SOURCES } from '../domain/observations';
import { IsoDateSchema } from './common';

export { OBSERVATION_KINDS, POSITION_SOURCES } from '../domain/observations';

const kind = z.enum(OBSERVATION_KINDS, { message: `choose a kind of sign: ${OBSERVATION_KINDS.join(', ')}` });
/** A number from a form field ("43.05"), refusing blanks and words. */
const formNumber = (what: string, min: number, max: number) =>
  z
    .union([z.number(), z.string().trim().regex(/^-?\d+(\.\d+)?$/, { message: `${what} must be a number written with digits` }).transform(Number)])
    .pipe(z.number().min(min, { message: `${what} must be between ${min} and ${max}` }).max(max, { message: `${what} must be between ${min} and ${max}` }));
const formBoolean = z.union([z.boolean(), z.enum(['true', 'false', '1', '0', 'on']).transform((v) => v === 'true' || v === '1' || v === 'on')]);

/** An instant with its zone: "2026-10-14T07:31:05-05:00" or "…Z" (what a phone's clock gives). */
export const InstantSchema = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})$/, { message: 'give the date and time with its zone, such as 2026-10-14T07:31:00-05:00' })
  .refine((v) => !Number.isNaN(Date.parse(v)), { message: 'is not a real date and time' });

/** The log form's fields. Position: lon and lat together, with where they came from; none → the photo's EXIF GPS. */
export const ObservationCreateSchema = z
  .object({
    kind,
    observedAt: InstantSchema.optional(),
    notes: z.string().trim().max(LIMITS.textMax).optional().transform((v) => (v ? v : null)),
    lon: formNumber('lon', -180, 180).optional(),
    lat: formNumber('lat', -90, 90).optional(),
    positionSource: z.enum(['device', 'map'], { message: 'say where lon/lat came from: device (the phone\u2019s GPS) or map (a tap on the map)' }).optional(),
    confirmFarAway: formBoolean.optional(),
  })
  .refine((v) => (v.lon === undefined) === (v.lat === undefined), { message: 'send lon and lat together, or neither (then the photo\u2019s GPS is used)', path: ['lat'] })
  .refine((v) => v.lon === undefined || v.positionSource !== undefined, { message: 'say where lon/lat came from: device or map', path: ['positionSource'] });
export type ObservationCreateInput = z.output<typeof ObservationCreateSchema>;

export const ObservationPhotoSchema = z.object({
  id: z.number().int(),
  url: z.string(),
  thumbnailUrl: z.string().nullable(),
  contentType: z.string(),
  takenAt: z.string().nullable(),
  /** Sentences for EXIF values that were not used (a date in 2099, GPS at 0, 0). */
  exifProblems: z.array(z.string()),
});

export const ObservationSchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  kind,
  observedAt: z.string(),
  notes: z.string().nullable(),
  /** [lon, lat], WGS84. */
  position: z.tuple([z.number(), z.number()]),
  positionSource: z.enum(POSITION_SOURCES),
  unitId: z.number().int().nullable(),
  unitName: z.string().nullable(),
  insideBoundary: z.boolean(),
  photos: z.array(ObservationPhotoSchema),
  loggedBy: z.string().nullable(),
  createdAt: z.string(),
});
export type ObservationDto = z.infer<typeof ObservationSchema>;

/** kind (one or several, comma-separated), from/to calendar dates in the firm's zone (both included). */
export const ObservationListQuerySchema = z
  .object({
    kind: z
      .string()
      .trim()
      .optional()
      .transform((v) => (v ? v.split(',').map((s) => s.trim()).filter(Boolean) : []))
      .pipe(z.array(kind)),
    from: IsoDateSchema.optional(),
    to: IsoDateSchema.optional(),
  })
  .refine((v) => !v.from || !v.to || v.from <= v.to, { message: 'from must be on or before to', path: ['to'] });
export type ObservationListQuery = z.output<typeof ObservationListQuerySchema>;

export const ObservationSummaryQuerySchema = z
  .object({ by: z.enum(['unit', 'month'], { message: 'by must be unit or month' }).default('unit') })
  .and(ObservationListQuerySchema);
export type ObservationSummaryQuery = z.output<typeof ObservationSummaryQuerySchema>;

export const ObservationSummaryRowSchema = z.object({
  /** Unit id as text ("none" outside every unit) or "YYYY-MM". */
  key: z.string(),
  label: z.string(),
  total: z.number().int(),
  byKind: z.record(z.string(), z.number().int()),
});
export const ObservationSummarySchema = z.object({
  by: z.enum(['unit', 'month']),
  total: z.number().int(),
  rows: z.array(ObservationSummaryRowSchema),
});
export type ObservationSummaryDto = z.infer<typeof ObservationSummarySchema>;
export type ObservationSummaryRow = z.infer<typeof ObservationSummaryRowSchema>;
