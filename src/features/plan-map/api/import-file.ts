import { useMutation } from '@tanstack/react-query';
import { ApiError, getCsrfToken, getData } from '../../../lib/api-client';
import type { ImportFullFeatureDto, ImportPreviewDto } from '../../../../shared/schemas/geo-import';

export type { ImportPreviewDto, ImportPreviewFeatureDto as ImportedFeatureDto } from '../../../../shared/schemas/geo-import';

/** Upload progress from 0 to 1, or null while the server reads the file after the upload. */
export type ImportProgress = (fraction: number | null) => void;

function send(url: string, file: File, token: string, onProgress?: ImportProgress): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => onProgress?.(e.lengthComputable ? e.loaded / e.total : null);
    xhr.upload.onload = () => onProgress?.(null);
    xhr.onerror = () => reject(new ApiError(0, 'Browseline cannot be reached. Check your connection and try again.', 'network'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      resolve({ status: xhr.status, body });
    };
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

/**
 * POST /api/properties/:id/imports with upload progress: reads a GeoJSON, KML, KMZ, GPX or zipped
 * shapefile on the server and answers the features found, and the ones skipped with their reason.
 */
export async function importFile(propertyId: number, file: File, onProgress?: ImportProgress): Promise<ImportPreviewDto> {
  const url = `/api/properties/${propertyId}/imports`;
  let res = await send(url, file, await getCsrfToken(), onProgress);
  const code = (res.body as { code?: string } | null)?.code;
  if (res.status === 403 && code === 'csrf') res = await send(url, file, await getCsrfToken(true), onProgress);
  if (res.status >= 200 && res.status < 300) return (res.body as { data: ImportPreviewDto }).data;
  const p = (res.body ?? {}) as { error?: string; code?: string; details?: unknown };
  const fallback =
    res.status === 413
      ? 'The file is too large to import. Split it, or export only the layers you need.'
      : `The server answered ${res.status}. Please try again.`;
  throw new ApiError(res.status, p.error ?? fallback, p.code, p.details);
}

/** Uploads a file for an import preview. */
export function useImportFile(propertyId: number) {
  return useMutation({
    mutationFn: ({ file, onProgress }: { file: File; onProgress?: ImportProgress }) => importFile(propertyId, file, onProgress),
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
