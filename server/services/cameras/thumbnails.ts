/**
 * Thumbnails of card photos, made by the `camera-thumbnails` background job (never on the request
 * that uploaded them) with the shared intake's `makeThumbnail`, kept through the storage module.
 */
import { CameraPhoto } from '../../models';
import { readFile, saveFile, deleteFile } from '../storage/storage';
import { makeThumbnail } from '../photos';
import type { JobContext } from '../jobs/job-queue';

/** The job: thumbnails for the photos named in the job's data that have none yet. */
export async function makeCameraThumbnails(data: { photoIds: number[] }, job: JobContext): Promise<void> {
  const ids = Array.isArray(data.photoIds) ? data.photoIds.filter((n) => Number.isSafeInteger(n)) : [];
  for (const [i, id] of ids.entries()) {
    const photo = await CameraPhoto.findByPk(id, { attributes: ['id', 'storageKey', 'thumbnailKey', 'contentType', 'originalName'] });
    if (!photo || photo.thumbnailKey) continue;
    let thumb: Buffer | null;
    try {
      thumb = await makeThumbnail({ bytes: await readFile(photo.storageKey), contentType: photo.contentType, originalName: photo.originalName });
    } catch {
      thumb = null; // an undecodable photo keeps no thumbnail; the grid shows the photo itself
    }
    if (!thumb) continue;
    const key = await saveFile('photos', thumb, 'jpg');
    const [changed] = await CameraPhoto.update({ thumbnailKey: key }, { where: { id, thumbnailKey: null } });
    if (changed === 0) await deleteFile(key).catch(() => undefined);
    if (i % 10 === 9) await job.progress(((i + 1) / ids.length) * 100, `${i + 1} of ${ids.length} thumbnails`);
  }
  await job.finish(async () => ids.length, (n) => ({ photos: n }));
}
