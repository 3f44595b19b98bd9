/**
 * One trail-camera photo of the demo scenario, written as the card intake would: the bytes and their
 * thumbnail saved to storage under random keys, then the `camera_photos` row, already tagged.
 */
import { CameraPhoto, type CameraDeployment } from '../../models';
import { saveFile } from '../../services/storage/storage';
import { makeThumbnail } from '../../services/photos';
import { correctedPhotoTime, type CameraTag } from '../../../shared/domain/camera-events';
import { sha256Of } from './demo-camera-bytes';

/** What differs from one demo photo of a deployment to the next; the rest is the same for every one. */
export interface DemoPhoto {
  /** The JPEG itself. */
  bytes: Buffer;
  originalName: string;
  /** The camera's wall-clock time, `YYYY-MM-DDTHH:MM:SS`. */
  cameraTime: string;
  tag: CameraTag;
  /** The roster buck it shows; none when left out. */
  buckId?: number | null;
  /** The buck's featured photo; false when left out. */
  featured?: boolean;
}

/**
 * Saves a demo photo's file and thumbnail and writes its tagged row on the deployment's card, taken at
 * the camera time corrected by the deployment's clock offset in the firm's zone; answers the row.
 */
export async function seedPhoto(deployment: CameraDeployment, zone: string, photo: DemoPhoto): Promise<CameraPhoto> {
  const { bytes, ...row } = photo;
  const thumb = await makeThumbnail({ bytes, contentType: 'image/jpeg', originalName: null });
  return CameraPhoto.create({
    firmId: deployment.firmId,
    deploymentId: deployment.id,
    propertyId: deployment.propertyId,
    buckId: null,
    featured: false,
    ...row,
    takenAt: correctedPhotoTime(photo.cameraTime, null, zone, deployment.clockOffsetSeconds),
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
