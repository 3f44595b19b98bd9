import { z } from 'zod';

/**
 * The text fields of `POST /api/properties/:id/overlays` (multipart, beside the image in `file`):
 * an optional name, and for a PNG/JPEG either its four corners (JSON) or its world file's text
 * with the EPSG code its coordinates are in.
 */
export const OverlayUploadFieldsSchema = z
  .object({
    name: z.string().trim().max(120).optional(),
    corners: z.string().max(2000).optional(),
    worldFile: z.string().max(2000, { message: 'a world file is six short lines; this text is too long to be one' }).optional(),
    epsg: z
      .string()
      .trim()
      .regex(/^(EPSG:)?\d{4,6}$/i, { message: 'give the EPSG code of the world file’s coordinates, such as 26915 (NAD83 / UTM zone 15N) or 4326' })
      .transform((v) => Number(v.replace(/^EPSG:/i, '')))
      .optional(),
  })
  .refine((v) => !v.worldFile || v.epsg !== undefined, { message: 'say which coordinate system the world file is in (its EPSG code, such as 26915)', path: ['epsg'] });
export type OverlayUploadFields = z.output<typeof OverlayUploadFieldsSchema>;
