/** JSON shapes of the camera fleet (types in shared/schemas/cameras.ts). */
import type { Buck, CameraPhoto } from '../models';
import type { CameraPhotoDto } from '../../shared/schemas/cameras';

/** A camera photo with the addresses of its file and thumbnail (null until the thumbnail is made). */
export function presentCameraPhoto(p: CameraPhoto): CameraPhotoDto {
  return {
    id: p.id,
    deploymentId: p.deploymentId,
    takenAt: p.takenAt ? p.takenAt.toISOString() : null,
    cameraTime: p.cameraTime,
    tag: p.tag,
    buckId: p.buckId,
    featured: p.featured,
    originalName: p.originalName,
    url: `/api/camera-photos/${p.id}/file`,
    thumbnailUrl: p.thumbnailKey ? `/api/camera-photos/${p.id}/thumbnail` : null,
    flags: p.flags,
  };
}

/** A buck's own fields (the roster read adds its photos). */
export const buckFields = (b: Buck) => ({ id: b.id, propertyId: b.propertyId, name: b.name, notes: b.notes, ageEstimates: [...b.ageEstimates].sort((x, y) => x.season - y.season) });
