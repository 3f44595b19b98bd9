/**
 * The one way a photo comes in (field observations, camera cards, …): checked by its content
 * (JPEG, PNG or HEIC by magic bytes, never the name or the claimed type), its size before it is read
 * whole, its pixel count from the header before anything decodes it; then its EXIF capture time and
 * GPS position are read (exifr) and judged (shared/domain/photo-exif.ts), its SHA-256 is taken, and a
 * JPEG thumbnail is made with sharp (libvips works on libuv's thread pool, so the event loop stays
 * free). Storing goes through the storage module, so photos follow the firm to object storage.
 *
 * Two steps so a caller can refuse or skip (a duplicate hash) before anything is written:
 * `inspectPhoto` checks and reads, `storePhoto` writes the photo and its thumbnail; `intakePhoto`
 * does both. `discardStoredPhoto` removes what `storePhoto` wrote when the caller's transaction fails.
 */
import crypto from 'node:crypto';
import { promises as fs } from 'node:fs';
import exifr from 'exifr';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { PHOTO_LIMITS } from '../../../shared/limits';
import { readImageSize } from '../../../shared/domain/image-size';
import { readHeifSize } from '../../../shared/domain/heif-size';
import { exifDateTimeToLocal, exifOffset, judgePhotoExif, type ExifJudgement, type PhotoExifReading } from '../../../shared/domain/photo-exif';
import { payloadTooLarge, unprocessable, unsupportedMedia } from '../../errors';
import { deleteFile, saveFile } from '../storage/storage';

/** The photo types kept, by the MIME type file-type finds, with the stored extension. */
export const INTAKE_PHOTO_TYPES = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/heic': 'heic', 'image/heif': 'heic' } as const;
export type IntakePhotoContentType = keyof typeof INTAKE_PHOTO_TYPES;

/** Where the photo comes from: bytes in memory (multer's memory storage) or a file on disk (a temporary upload). */
export type PhotoSource = { bytes: Buffer; originalName?: string | null } | { path: string; originalName?: string | null };

/** Limits for one intake; both default to PHOTO_LIMITS. */
export interface PhotoIntakeLimits {
  maxBytes?: number;
  maxPixels?: number;
}

/** A photo that passed the checks, read but not stored yet. */
export interface InspectedPhoto {
  bytes: Buffer;
  originalName: string | null;
  contentType: string;
  extension: string;
  byteSize: number;
  width: number | null;
  height: number | null;
  /** Lower-case hex SHA-256 of the bytes: the same picture uploaded twice has the same hash. */
  sha256: string;
  /** The tags as read (before judging). */
  exifRead: PhotoExifReading;
  /** The usable capture time and position, and a sentence for each value that was not used. */
  exif: ExifJudgement;
}

/** A photo kept in storage. */
export interface StoredPhoto extends InspectedPhoto {
  storageKey: string;
  /** A JPEG at most PHOTO_LIMITS.thumbnailPx on its longer side, or null when the format cannot be decoded here (HEIC: the HEVC codec is not bundled with sharp). */
  thumbnailKey: string | null;
}

/** Storage folders; each caller passes its own so its orphan sweep knows its tables. */
export interface PhotoFolders {
  photos: string;
  thumbnails: string;
}

function label(name: string | null): string {
  return name ? `"${name}"` : 'A photo';
}

const mb = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`;

async function readSource(source: PhotoSource, maxBytes: number): Promise<{ bytes: Buffer; name: string | null }> {
  const name = source.originalName ?? null;
  if ('path' in source) {
    const { size } = await fs.stat(source.path);
    if (size > maxBytes) throw payloadTooLarge(`${label(name)} is ${mb(size)}, more than the ${mb(maxBytes)} one photo may be. Send a smaller one (most phones can share a reduced size).`);
    return { bytes: await fs.readFile(source.path), name };
  }
  if (source.bytes.length > maxBytes) throw payloadTooLarge(`${label(name)} is ${mb(source.bytes.length)}, more than the ${mb(maxBytes)} one photo may be. Send a smaller one (most phones can share a reduced size).`);
  return { bytes: source.bytes, name };
}

/** The capture time (as written, with its offset) and GPS position in a photo's EXIF; nulls where absent or unreadable. */
export async function readExif(bytes: Buffer): Promise<PhotoExifReading> {
  const none: PhotoExifReading = { takenAtLocal: null, takenAtOffset: null, latitude: null, longitude: null };
  try {
    const raw = (await exifr.parse(bytes, { tiff: true, exif: true, gps: true, xmp: false, icc: false, iptc: false, reviveValues: false, pick: ['DateTimeOriginal', 'CreateDate', 'OffsetTimeOriginal'] })) as Record<string, unknown> | undefined;
    let latitude: number | null = null;
    let longitude: number | null = null;
    try {
      const gps = (await exifr.gps(bytes)) as { latitude?: unknown; longitude?: unknown } | undefined;
      if (gps && typeof gps.latitude === 'number' && typeof gps.longitude === 'number') {
        latitude = gps.latitude;
        longitude = gps.longitude;
      }
    } catch {
      // no GPS block, or a garbled one: no position
    }
    return {
      takenAtLocal: exifDateTimeToLocal(raw?.DateTimeOriginal ?? raw?.CreateDate),
      takenAtOffset: exifOffset(raw?.OffsetTimeOriginal),
      latitude,
      longitude,
    };
  } catch {
    return none;
  }
}

/**
 * Checks a photo and reads what it says. Refuses (415) anything not JPEG, PNG or HEIC by content,
 * (413) over `maxBytes` before reading it whole, (422) over `maxPixels` by its header. `now` judges
 * the EXIF capture time (default: this moment).
 */
export async function inspectPhoto(source: PhotoSource, limits: PhotoIntakeLimits = {}, now = new Date()): Promise<InspectedPhoto> {
  const maxBytes = limits.maxBytes ?? PHOTO_LIMITS.maxBytes;
  const maxPixels = limits.maxPixels ?? PHOTO_LIMITS.maxPixels;
  const { bytes, name } = await readSource(source, maxBytes);
  if (bytes.length === 0) throw unsupportedMedia(`${label(name)} is empty. Attach JPEG, PNG or HEIC pictures from the phone's camera.`);
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !(type.mime in INTAKE_PHOTO_TYPES)) {
    throw unsupportedMedia(`${label(name)} is not a photo we can keep${type ? ` (it looks like ${type.ext.toUpperCase()})` : ''}. Attach JPEG, PNG or HEIC pictures from the phone's camera.`);
  }
  const contentType = type.mime as IntakePhotoContentType;
  const size = contentType === 'image/heic' || contentType === 'image/heif' ? readHeifSize(bytes) : readImageSize(bytes);
  if (!size) throw unsupportedMedia(`${label(name)} is damaged: its size could not be read from its header. Take or export the picture again.`);
  if (size.width * size.height > maxPixels) {
    throw unprocessable(`${label(name)} is ${size.width} × ${size.height} pixels, more than the ${Math.round(maxPixels / 1_000_000)} megapixels one photo may have. Send a reduced size.`);
  }
  const exifRead = await readExif(bytes);
  return {
    bytes,
    originalName: name,
    contentType: contentType === 'image/heif' ? 'image/heic' : contentType,
    extension: INTAKE_PHOTO_TYPES[contentType],
    byteSize: bytes.length,
    width: size.width,
    height: size.height,
    sha256: crypto.createHash('sha256').update(bytes).digest('hex'),
    exifRead,
    exif: judgePhotoExif(exifRead, now),
  };
}

/**
 * A JPEG thumbnail turned upright by the EXIF orientation, at most `sizePx` on its longer side; null
 * when sharp cannot decode the format (HEIC). A JPEG or PNG that will not decode is refused (422).
 */
export async function makeThumbnail(photo: Pick<InspectedPhoto, 'bytes' | 'contentType' | 'originalName'>, sizePx: number = PHOTO_LIMITS.thumbnailPx, maxPixels: number = PHOTO_LIMITS.maxPixels): Promise<Buffer | null> {
  try {
    return await sharp(photo.bytes, { limitInputPixels: maxPixels, failOn: 'error' })
      .rotate()
      .resize(sizePx, sizePx, { fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75, mozjpeg: true })
      .toBuffer();
  } catch {
    if (photo.contentType === 'image/heic') return null;
    throw unprocessable(`${label(photo.originalName)} could not be read: the picture is damaged or cut short. Take or export it again.`);
  }
}

/** Writes an inspected photo and its thumbnail to storage; answers their keys with the photo. */
export async function storePhoto(photo: InspectedPhoto, folders: PhotoFolders): Promise<StoredPhoto> {
  const thumbnail = await makeThumbnail(photo);
  const storageKey = await saveFile(folders.photos, photo.bytes, photo.extension);
  let thumbnailKey: string | null = null;
  try {
    if (thumbnail) thumbnailKey = await saveFile(folders.thumbnails, thumbnail, 'jpg');
  } catch (err) {
    await deleteFile(storageKey).catch(() => undefined);
    throw err;
  }
  return { ...photo, storageKey, thumbnailKey };
}

/** Checks, reads and stores one photo (inspectPhoto then storePhoto). */
export async function intakePhoto(source: PhotoSource, folders: PhotoFolders, limits: PhotoIntakeLimits = {}, now = new Date()): Promise<StoredPhoto> {
  return storePhoto(await inspectPhoto(source, limits, now), folders);
}

/** Removes a stored photo and its thumbnail (after the caller's transaction failed); missing files are fine. */
export async function discardStoredPhoto(photo: Pick<StoredPhoto, 'storageKey' | 'thumbnailKey'>): Promise<void> {
  await deleteFile(photo.storageKey).catch(() => undefined);
  if (photo.thumbnailKey) await deleteFile(photo.thumbnailKey).catch(() => undefined);
}
