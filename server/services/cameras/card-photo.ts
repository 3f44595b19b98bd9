/**
 * Reads one photo of a camera card: its type from the bytes, its pixel size from the header (before
 * anything is decoded), its SHA-256 and the camera clock's EXIF DateTimeOriginal as written (no
 * zone: the firm's zone and the deployment's clock offset are applied by the caller).
 */
import crypto from 'node:crypto';
import exifr from 'exifr';
import { fileTypeFromBuffer } from 'file-type';
import { readImageSize } from '../../../shared/domain/image-size';
import { parseExifDateTime } from '../../../shared/domain/camera-events';
import { CARD_LIMITS, type SkipReason } from '../../../shared/schemas/cameras';

/** Types a card photo may be, by content. */
export const CARD_PHOTO_TYPES: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/heic': 'heic' };

export interface CardPhoto {
  bytes: Buffer;
  name: string | null;
  sha256: string;
  contentType: string;
  extension: string;
  /** EXIF DateTimeOriginal "YYYY-MM-DDTHH:MM:SS", or null when missing or garbled. */
  cameraTime: string | null;
  latitude: number | null;
  longitude: number | null;
}

export type CardPhotoReading = { ok: true; photo: CardPhoto } | { ok: false; name: string | null; sha256: string; reason: SkipReason; message: string };

/** The SHA-256 of a photo's bytes, as hex. */
export const sha256Of = (bytes: Buffer): string => crypto.createHash('sha256').update(bytes).digest('hex');

async function readExif(bytes: Buffer): Promise<{ cameraTime: string | null; latitude: number | null; longitude: number | null }> {
  try {
    const raw = (await exifr.parse(bytes, { tiff: true, exif: true, gps: true, xmp: false, icc: false, iptc: false, reviveValues: false })) as Record<string, unknown> | undefined;
    const gps = (await exifr.gps(bytes).catch(() => undefined)) as { latitude?: number; longitude?: number } | undefined;
    const lat = typeof gps?.latitude === 'number' && Number.isFinite(gps.latitude) ? gps.latitude : null;
    const lon = typeof gps?.longitude === 'number' && Number.isFinite(gps.longitude) ? gps.longitude : null;
    return { cameraTime: parseExifDateTime(raw?.DateTimeOriginal ?? raw?.CreateDate ?? raw?.DateTime), latitude: lat, longitude: lon };
  } catch {
    return { cameraTime: null, latitude: null, longitude: null };
  }
}

/** Checks one uploaded file and reads what the card upload needs; a refusal says why in a sentence. */
export async function readCardPhoto(bytes: Buffer, name: string | null): Promise<CardPhotoReading> {
  const sha256 = sha256Of(bytes);
  const label = name ? `“${name}”` : 'A file';
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !(type.mime in CARD_PHOTO_TYPES)) {
    return { ok: false, name, sha256, reason: 'not-a-photo', message: `${label} is not a JPEG, PNG or HEIC photo${type ? ` (it looks like ${type.ext.toUpperCase()})` : ''}; it was skipped. Upload the card’s picture files.` };
  }
  if (bytes.length > CARD_LIMITS.maxBytes) {
    return { ok: false, name, sha256, reason: 'too-large', message: `${label} is larger than ${CARD_LIMITS.maxBytes / 1024 / 1024} MB; it was skipped.` };
  }
  const size = type.mime === 'image/heic' ? null : readImageSize(bytes);
  if (size && size.width * size.height > CARD_LIMITS.maxPixels) {
    return { ok: false, name, sha256, reason: 'too-many-pixels', message: `${label} is ${size.width} × ${size.height} pixels, more than the ${CARD_LIMITS.maxPixels / 1_000_000} megapixels a card photo may have; it was skipped.` };
  }
  const exif = await readExif(bytes);
  return { ok: true, photo: { bytes, name, sha256, contentType: type.mime, extension: CARD_PHOTO_TYPES[type.mime], ...exif } };
}
