/**
 * Thumbnails of card photos, made by the `camera-thumbnails` background job (never on the
 * request that uploaded them): 320 px on the longer side, JPEG, through the storage module.
 */
import sharp from 'sharp';
import { CameraPhoto } from '../../models';
import { readFile, saveFile, deleteFile } from '../storage/storage';
import type { JobContext } from '../jobs/job-queue';

/** Longest side of a review-grid thumbnail, pixels. */
export const THUMBNAIL_SIDE_PX = 320;

/** Makes a thumbnail of one stored photo; answers the JPEG bytes. */
export async function makeThumbnail(bytes: Buffer): Promise<Buffer> {
  return sharp(bytes, { limitInputPixels: 60_000_000 }).rotate().resize(THUMBNAIL_SIDE_PX, THUMBNAIL_SIDE_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 72 }).toBuffer();
}

/** The job: thumbnails for the photos named in the job's data that have none yet. */
export async function makeCameraThumbnails(data: { photoIds: number[] }, job: JobContext): Promise<void> {
  const ids = Array.isArray(data.photoIds) ? data.photoIds.filter((n) => Number.isSafeInteger(n)) : [];
  for (const [i, id] of ids.entries()) {
    const photo = await CameraPhoto.findByPk(id, { attributes: ['id', 'storageKey', 'thumbnailKey'] });
    if (!photo || photo.thumbnailKey) continue;
    let thumb: Buffer;
    try {
      thumb = await makeThumbnail(await readFile(photo.storageKey));
    } catch {
      continue; // an undecodable photo keeps no thumbnail; the grid shows the photo itself
    }
    const key = await saveFile('photos', thumb, 'jpg');
    const [changed] = await CameraPhoto.update({ thumbnailKey: key }, { where: { id, thumbnailKey: null } });
    if (changed === 0) await deleteFile(key).catch(() => undefined);
    if (i % 10 === 9) await job.progress(((i + 1) / ids.length) * 100, `${i + 1} of ${ids.length} thumbnails`);
  }
  await job.finish(async () => ids.length, (n) => ({ photos: n }));
}
