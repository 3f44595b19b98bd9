import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SharedFileDto } from '../../../../shared/schemas/file';
import { portalKeys } from './portal-scope';

/** POST /api/files as a client: its own upload (only when the consultant allows it). */
export const uploadPortalFile = async (input: { file: File; title?: string; propertyId?: number | null }) => {
  const form = new FormData();
  form.set('file', input.file);
  if (input.title) form.set('title', input.title);
  if (input.propertyId) form.set('propertyId', String(input.propertyId));
  return (await api.upload<{ data: SharedFileDto }>('/api/files', form)).data;
};

/** Uploads a client's file; the portal's files refetch. */
export function useUploadPortalFile() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: uploadPortalFile, onSuccess: () => qc.invalidateQueries({ queryKey: portalKeys.all }) });
}
