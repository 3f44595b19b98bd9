/**
 * One trail-camera photo of the demo scenario, written as the card intake would: the bytes and their
 * thumbnail saved to storage under random keys, then the `camera_photos` row, already tagged.
 */
import { CameraPhoto, type CameraDeployment } from '../../models';
import { saveFile } from '../../services/storage/storage';
import { makeThumbnail } from '../../services/photos';
import type { CameraTag } from '../../../shared/domain/camera-events';
import { sha256Of } from './demo-camera-bytes';

/** What differs from one demo photo of a deployment to the next; the rest is the same for every one. */
export interface DemoPhoto {
  /** The JPEG itself. */
  bytes: Buffer;
  originalName: string;
  /** The camera's wall-clock time, `YYYY-MM-DDTHH:MM:SS`. */
  cameraTime: string;
  /** The camera time corrected for the deployment's clock offset, in the firm's zone. */
  takenAt: Date | null;
  tag: CameraTag;
  buckId: number | null;
  featured: boolean;
}

/** Saves a demo photo's file and thumbnail and writes its tagged row on the deployment's card; answers the row. */
export async function seedPhoto(deployment: CameraDeployment, photo: DemoPhoto): Promise<CameraPhoto> {
  const { bytes, ...row } = photo;
  const thumb = await makeThumbnail({ bytes, contentType: 'image/jpeg', originalName: null });
  return CameraPhoto.create({
    firmId: deployment.firmId,
    deploymentId: deployment.id,
    propertyId: deployment.propertyId,
    ...row,
    sha256: sha256Of(bytes),
    storageKey: await saveFile('photos', bytes, 'jpg'),
    thumbnailKey: thumb ? await saveFile('photos', thumb, 'jpg') : null,
    contentType: 'image/jpeg',
    byteSize: bytes.length,
    cameraOffset: null,
    taggedById: null,
    taggedAt: new Date(),
  });
}
