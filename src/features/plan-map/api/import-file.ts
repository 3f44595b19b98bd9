import { useMutation } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import { uploadForm, type UploadProgress } from '../lib/xhr-upload';
import type { ImportFullFeatureDto, ImportPreviewDto } from '../../../../shared/schemas/geo-import';

export type { ImportPreviewDto, ImportPreviewFeatureDto as ImportedFeatureDto } from '../../../../shared/schemas/geo-import';

export type { UploadProgress as ImportProgress } from '../lib/xhr-upload';

/**
 * POST /api/properties/:id/imports with upload progress: reads a GeoJSON, KML, KMZ, GPX or zipped
 * shapefile on the server and answers the features found, and the ones skipped with their reason.
 */
export function importFile(propertyId: number, file: File, onProgress?: UploadProgress): Promise<ImportPreviewDto> {
  return uploadForm<ImportPreviewDto>(
    `/api/properties/${propertyId}/imports`,
    () => {
      const form = new FormData();
      form.append('file', file, file.name);
      return form;
    },
    onProgress,
    'The file is too large to import. Split it, or export only the layers you need.',
  );
}

/** Uploads a file for an import preview. */
export function useImportFile(propertyId: number) {
  return useMutation({
    mutationFn: ({ file, onProgress }: { file: File; onProgress?: UploadProgress }) => importFile(propertyId, file, onProgress),
  });
}

/**
 * GET /api/properties/:id/imports/:importId/features: the full geometries of the chosen preview
 * items (the preview itself carries simplified outlines only).
 */
export function fetchImportGeometries(propertyId: number, importId: string, items: number[]): Promise<ImportFullFeatureDto[]> {
  if (items.length === 0) return Promise.resolve([]);
  return getData<ImportFullFeatureDto[]>(`/api/properties/${propertyId}/imports/${importId}/features?items=${items.join(',')}`);
}
