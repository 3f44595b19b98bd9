import { z } from 'zod';
import { isTimeZone } from '../domain/clock';

/** An XYZ raster tile URL template such as https://tiles.example.com/{z}/{x}/{y}.png (https only). */
export const TileUrlTemplateSchema = z
  .string()
  .trim()
  .max(500)
  .refine((v) => /^https:\/\/[^\s/]+\//.test(v), { message: 'start the address with https:// and the server name (plain http is not allowed)' })
  .refine((v) => v.includes('{z}') && v.includes('{x}') && v.includes('{y}'), { message: 'the address must contain {z}, {x} and {y}' });

export const FirmSettingsUpdateSchema = z.object({
  tileUrlTemplate: z.union([TileUrlTemplateSchema, z.literal('').transform(() => null), z.null()]).optional(),
  tileAttribution: z.string().trim().max(200).nullish(),
  taxRatePct: z.number().min(0).max(30).optional(),
  timezone: z.string().trim().refine(isTimeZone, { message: 'choose a time zone from the list, such as America/Chicago' }).optional(),
  /** Property size, acres, above which saving a boundary asks for a confirmation (default 20,000). */
  largeAreaAcres: z.number({ message: 'enter the acreage above which a boundary needs confirming' }).min(1).max(10_000_000).optional(),
  /** Hours without any request after which a session ends (besides the 14-day limit from sign-in). */
  idleTimeoutHours: z.number({ message: 'give the idle time in hours' }).min(0.25, { message: 'must be at least a quarter of an hour' }).max(168, { message: 'must be at most 168 hours (a week)' }).optional(),
});

/** The idle timeout of a firm that has not chosen one. */
export const DEFAULT_IDLE_TIMEOUT_HOURS = 8;
export type FirmSettingsUpdateInput = z.infer<typeof FirmSettingsUpdateSchema>;

export const FirmSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  region: z.string(),
  /** IANA time zone: the firm's "today" and the times on its documents. */
  timezone: z.string(),
  settings: z.object({ tileUrlTemplate: z.string().nullable(), tileAttribution: z.string().nullable(), taxRatePct: z.number(), largeAreaAcres: z.number(), idleTimeoutHours: z.number() }),
});
export type FirmDto = z.infer<typeof FirmSchema>;

export const OverlayCornersSchema = z
  .array(z.tuple([z.number().min(-180).max(180), z.number().min(-85).max(85)]), { error: 'corners must be four [longitude, latitude] pairs' })
  .length(4, { message: 'give exactly four corners: top-left, top-right, bottom-right, bottom-left' });

export const OverlayUpdateSchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  opacity: z.number().min(0).max(1).optional(),
});

export const OverlaySchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  name: z.string(),
  imageUrl: z.string(),
  corners: z.array(z.tuple([z.number(), z.number()])).length(4),
  opacity: z.number(),
  byteSize: z.number().int(),
  createdAt: z.string(),
});
export type OverlayDto = z.infer<typeof OverlaySchema>;
