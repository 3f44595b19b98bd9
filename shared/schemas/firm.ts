import { z } from 'zod';
import { isTimeZone } from '../domain/clock';
import { LIME_METHODS } from '../domain/soil-tests';

/**
 * An XYZ raster tile URL template such as https://tiles.example.com/{z}/{x}/{y}.png (https only).
 * A WMTS RESTful template (OGC 07-057r7, 10.2: {TileMatrix}/{TileRow}/{TileCol}) is taken too and
 * stored as XYZ; its tile matrix set must be Google/Web Mercator (GoogleMapsCompatible).
 */
export const TileUrlTemplateSchema = z
  .string()
  .trim()
  .max(500)
  .transform((v) => v.replace(/\{TileMatrix\}/gi, '{z}').replace(/\{TileRow\}/gi, '{y}').replace(/\{TileCol\}/gi, '{x}'))
  .refine((v) => /^https:\/\/[^\s/]+\//.test(v), { message: 'start the address with https:// and the server name (plain http is not allowed)' })
  .refine((v) => v.includes('{z}') && v.includes('{x}') && v.includes('{y}'), { message: 'the address must contain {z}, {x} and {y}' });

/** [west, south, east, north] in degrees, west below east and south below north. */
export const LonLatBoxSchema = z
  .tuple([z.number().min(-180).max(180), z.number().min(-85).max(85), z.number().min(-180).max(180), z.number().min(-85).max(85)], { error: 'the area must be [west, south, east, north] in degrees' })
  .refine(([w, s, e, n]) => w < e && s < n, { message: 'the area’s west edge must lie west of its east edge and its south edge south of its north edge' });

/**
 * Where the firm works: picked counties or a searched/drawn area, as a name and a box. A new
 * property's map opens here.
 */
export const HomeAreaSchema = z.object({
  name: z.string().trim().min(1, { message: 'name the home area, such as “Crawford County, WI”' }).max(300),
  bbox: LonLatBoxSchema,
});
export type HomeArea = z.infer<typeof HomeAreaSchema>;

export const FirmSettingsUpdateSchema = z.object({
  /** Where a new property's map opens; null clears it. */
  homeArea: HomeAreaSchema.nullable().optional(),
  tileUrlTemplate: z.union([TileUrlTemplateSchema, z.literal('').transform(() => null), z.null()]).optional(),
  tileAttribution: z.string().trim().max(200).nullish(),
  taxRatePct: z.number().min(0).max(30).optional(),
  timezone: z.string().trim().refine(isTimeZone, { message: 'choose a time zone from the list, such as America/Chicago' }).optional(),
  /** Property size, acres, above which saving a boundary asks for a confirmation (default 20,000). */
  largeAreaAcres: z.number({ message: 'enter the acreage above which a boundary needs confirming' }).min(1).max(10_000_000).optional(),
  /** Feet outside every unit within which an observation still goes to the nearest unit (default 50). */
  observationSnapFt: z.number({ message: 'enter the distance in feet' }).min(0).max(5280, { message: 'must be at most 5,280 ft (a mile)' }).optional(),
  /** Hours without any request after which a session ends (besides the 14-day limit from sign-in). */
  idleTimeoutHours: z.number({ message: 'give the idle time in hours' }).min(0.25, { message: 'must be at least a quarter of an hour' }).max(168, { message: 'must be at most 168 hours (a week)' }).optional(),
  /** Days after the last card pull (or the day a camera was set) when its card is due (default 21). */
  cardPullIntervalDays: z.number({ message: 'give the days between card pulls' }).int({ message: 'whole days between card pulls' }).min(1).max(365).optional(),
  /** Minutes within which photos at one camera site form one independent event (default 30). */
  eventGapMinutes: z.number({ message: 'give the event gap in minutes' }).int({ message: 'whole minutes' }).min(1).max(24 * 60).optional(),
  /** The state method soil tests are worked by; null goes back to the region's (south and mid-south NCDA&CS, elsewhere Missouri). */
  limeMethod: z.enum(LIME_METHODS, { error: `limeMethod must be one of ${LIME_METHODS.join(', ')}` }).nullable().optional(),
  /** Years after a soil test when the Desk lists it for a retest (default 3). */
  soilRetestYears: z.number({ message: 'soilRetestYears: give the years between soil tests' }).int({ message: 'soilRetestYears: whole years' }).min(1, { message: 'soilRetestYears: at least 1 year' }).max(10, { message: 'soilRetestYears: at most 10 years' }).optional(),
});

/** The idle timeout of a firm that has not chosen one. */
export const DEFAULT_IDLE_TIMEOUT_HOURS = 8;
export type FirmSettingsUpdateInput = z.infer<typeof FirmSettingsUpdateSchema>;

const optionalProfileText = (max: number) => z.union([z.string().trim().max(max), z.null()]).transform((v) => (v ? v : null)).optional();

/** Units the firm's pages and documents show areas and lengths in. */
export const AREA_UNITS = ['acres', 'hectares'] as const;
export const LENGTH_UNITS = ['feet', 'metres'] as const;

/**
 * The firm's profile (`PATCH /api/firm`): what every PDF and e-mail prints, and the defaults new
 * proposals and invoices start from. Every field is optional; an empty text clears it.
 */
export const FirmProfileUpdateSchema = z
  .object({
    name: z.string().trim().min(1, { message: 'the firm needs a name' }).max(120).optional(),
    address: optionalProfileText(300),
    phone: optionalProfileText(40),
    email: z
      .union([z.string().trim().max(254).email({ message: 'enter an e-mail address such as office@example.com' }), z.literal('').transform(() => null), z.null()])
      .optional(),
    website: z
      .union([
        z.string().trim().max(200).refine((v) => /^https?:\/\/[^\s/]+\.[^\s]+$/.test(v), { message: 'start the website with https:// and the address' }),
        z.literal('').transform(() => null),
        z.null(),
      ])
      .optional(),
    licenceNumbers: optionalProfileText(300),
    defaultDepositPct: z.number({ message: 'enter the deposit as a number' }).min(0).max(100, { message: 'the deposit is at most 100 %' }).optional(),
    paymentTermsDays: z.number({ message: 'enter the payment terms in days' }).int({ message: 'payment terms are whole days' }).min(0).max(365).optional(),
    proposalValidDays: z.number({ message: 'enter how many days a proposal is valid' }).int({ message: 'validity is in whole days' }).min(1).max(365).optional(),
    taxRatePct: z.number().min(0).max(30, { message: 'a sales tax above 30 % looks like a typing slip' }).optional(),
    timezone: z.string().trim().refine(isTimeZone, { message: 'choose a time zone from the list, such as America/Chicago' }).optional(),
    areaUnit: z.enum(AREA_UNITS, { message: 'choose acres or hectares' }).optional(),
    lengthUnit: z.enum(LENGTH_UNITS, { message: 'choose feet or metres' }).optional(),
  })
  .strict();
export type FirmProfileUpdateInput = z.input<typeof FirmProfileUpdateSchema>;

/** What a document or e-mail prints about the firm, as the profile stood (kept in a sent document's snapshot). */
export interface DocumentFirm {
  name: string;
  phone?: string | null;
  email?: string | null;
  address?: string | null;
  website?: string | null;
  licenceNumbers?: string | null;
  /** Storage key of the logo file as it was; logo files are never overwritten. */
  logoKey?: string | null;
  /** The units figures print in, as the profile stood (snapshots from before print acres and feet). */
  areaUnit?: (typeof AREA_UNITS)[number] | null;
  lengthUnit?: (typeof LENGTH_UNITS)[number] | null;
}

export const FirmSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  region: z.string(),
  /** IANA time zone: the firm's "today" and the times on its documents. */
  timezone: z.string(),
  settings: z.object({ tileUrlTemplate: z.string().nullable(), tileAttribution: z.string().nullable(), homeArea: HomeAreaSchema.nullable(), taxRatePct: z.number(), largeAreaAcres: z.number(), idleTimeoutHours: z.number(), observationSnapFt: z.number(), limeMethod: z.enum(LIME_METHODS).nullable().optional(), soilRetestYears: z.number().optional() }),
  address: z.string().nullable(),
  website: z.string().nullable(),
  licenceNumbers: z.string().nullable(),
  /** Address of the logo image, or null when the firm has none. */
  logoUrl: z.string().nullable(),
  defaultDepositPct: z.number(),
  paymentTermsDays: z.number().int(),
  proposalValidDays: z.number().int(),
  taxRatePct: z.number(),
  areaUnit: z.enum(AREA_UNITS),
  lengthUnit: z.enum(LENGTH_UNITS),
});
export type FirmDto = z.infer<typeof FirmSchema>;

export const OverlayCornersSchema = z
  .array(z.tuple([z.number().min(-180).max(180), z.number().min(-85).max(85)]), { error: 'corners must be four [longitude, latitude] pairs' })
  .length(4, { message: 'give exactly four corners: top-left, top-right, bottom-right, bottom-left' });

export const OverlayUpdateSchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  opacity: z.number().min(0).max(1).optional(),
  /** Shown on the plan map (hidden overlays stay in the list). */
  visible: z.boolean().optional(),
  /** Printed under the plan in the plan PDF and the proposal map. */
  inDocuments: z.boolean().optional(),
});

export const OverlaySchema = z.object({
  id: z.number().int(),
  propertyId: z.number().int(),
  name: z.string(),
  imageUrl: z.string(),
  corners: z.array(z.tuple([z.number(), z.number()])).length(4),
  opacity: z.number(),
  visible: z.boolean(),
  inDocuments: z.boolean(),
  byteSize: z.number().int(),
  createdAt: z.string(),
});
export type OverlayDto = z.infer<typeof OverlaySchema>;
