/**
 * Checks completion photos by their content (magic bytes, never the file name or the claimed type)
 * and reads the camera's location and time from EXIF when present.
 */
import exifr from 'exifr';
import { fileTypeFromBuffer } from 'file-type';
import { unsupportedMedia } from '../../errors';

export const PHOTO_TYPES: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp', 'image/heic': 'heic' };

export interface InspectedPhoto {
  bytes: Buffer;
  originalName: string | null;
  contentType: string;
  extension: string;
  latitude: number | null;
  longitude: number | null;
  takenAt: Date | null;
}

const finite = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/** EXIF GPS position and capture time, or nulls when the photo carries none (or garbled values). */
export async function readPhotoExif(bytes: Buffer): Promise<Pick<InspectedPhoto, 'latitude' | 'longitude' | 'takenAt'>> {
  try {
    const tags = (await exifr.parse(bytes, { gps: true, tiff: true, exif: true, xmp: false, icc: false, iptc: false })) as Record<string, unknown> | undefined;
    if (!tags) return { latitude: null, longitude: null, takenAt: null };
    const latitude = finite(tags.latitude);
    const longitude = finite(tags.longitude);
    const inRange = latitude !== null && longitude !== null && Math.abs(latitude) <= 90 && Math.abs(longitude) <= 180 && !(latitude === 0 && longitude === 0);
    const when = tags.DateTimeOriginal ?? tags.CreateDate ?? tags.ModifyDate;
    const takenAt = when instanceof Date && !Number.isNaN(when.getTime()) ? when : null;
    return { latitude: inRange ? latitude : null, longitude: inRange ? longitude : null, takenAt };
  } catch {
    return { latitude: null, longitude: null, takenAt: null };
  }
}

/** Accepts JPEG, PNG, WebP and HEIC photos by content; anything else is refused with 415 naming the file. */
export async function inspectPhoto(bytes: Buffer, originalName: string | null): Promise<InspectedPhoto> {
  const type = await fileTypeFromBuffer(bytes);
  const label = originalName ? `"${originalName}"` : 'A file';
  if (!type || !(type.mime in PHOTO_TYPES)) {
    throw unsupportedMedia(`${label} is not a photo we can keep${type ? ` (it looks like ${type.ext.toUpperCase()})` : ''}. Attach JPEG, PNG, WebP or HEIC pictures from the phone's camera.`);
  }
  return { bytes, originalName, contentType: type.mime, extension: PHOTO_TYPES[type.mime], ...(await readPhotoExif(bytes)) };
}
