import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { OverlayDto } from './get-overlays';
import { planMapKeys } from './keys';
import { uploadForm, type UploadProgress } from '../lib/xhr-upload';
import { GEOMETRY_LIMITS } from '../../../../shared/limits';

/** What goes with an image: its world file's text and EPSG code (JPEG/PNG), or nothing (GeoTIFF). */
export interface OverlayUploadInput {
  file: File;
  worldFile?: { text: string; epsg: string } | null;
  onProgress?: UploadProgress;
}

/** POST /api/properties/:id/overlays (multipart, with upload progress). */
export function uploadOverlay(propertyId: number, input: OverlayUploadInput): Promise<OverlayDto> {
  return uploadForm<OverlayDto>(
    `/api/properties/${propertyId}/overlays`,
    () => {
      const form = new FormData();
      if (input.worldFile) {
        form.append('worldFile', input.worldFile.text);
        form.append('epsg', input.worldFile.epsg);
      }
      form.append('file', input.file, input.file.name);
      return form;
    },
    input.onProgress,
    `The image is larger than ${Math.round(GEOMETRY_LIMITS.overlayMaxBytes / 1024 / 1024)} MB, the most one upload may be.`,
  );
}

/** Uploads an aerial photo; the list gains it. */
export function useUploadOverlay(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: OverlayUploadInput) => uploadOverlay(propertyId, input),
    onSuccess: (overlay) => qc.setQueryData<OverlayDto[]>(planMapKeys.overlays(propertyId), (old) => [...(old ?? []), overlay]),
  });
}

/** DELETE /api/overlays/:id. */
export function useDeleteOverlay(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (overlayId: number) => api.delete(`/api/overlays/${overlayId}`),
    onSuccess: (_r, overlayId) => qc.setQueryData<OverlayDto[]>(planMapKeys.overlays(propertyId), (old) => (old ?? []).filter((o) => o.id !== overlayId)),
  });
}
