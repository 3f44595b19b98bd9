/** The firm's shared files: list per client, upload, share/unshare and rename, delete. */
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { FileUpdateInput, SharedFileDto } from '../../../../shared/schemas/file';

export const filesKeys = {
  all: ['files'] as const,
  list: (filter: { clientId?: number; propertyId?: number }) => ['files', filter] as const,
};

/** GET /api/files?clientId=…: a client's files, newest first. */
export const getFiles = (filter: { clientId?: number; propertyId?: number }, signal?: AbortSignal) => {
  const q = new URLSearchParams();
  if (filter.clientId) q.set('clientId', String(filter.clientId));
  if (filter.propertyId) q.set('propertyId', String(filter.propertyId));
  return getData<SharedFileDto[]>(`/api/files?${q.toString()}`, signal);
};

export const getFilesQueryOptions = (filter: { clientId?: number; propertyId?: number }) => queryOptions({ queryKey: filesKeys.list(filter), queryFn: ({ signal }) => getFiles(filter, signal) });

/** The files of a client (or property). */
export const useFiles = (filter: { clientId?: number; propertyId?: number }) => useQuery(getFilesQueryOptions(filter));

export interface ShareFileInput {
  clientId: number;
  propertyId: number | null;
  category: string;
  title?: string;
  visibleToClient: boolean;
  file: File;
}

/** POST /api/files: a consultant's upload for a client. */
export const shareFile = async (input: ShareFileInput) => {
  const form = new FormData();
  form.set('clientId', String(input.clientId));
  if (input.propertyId) form.set('propertyId', String(input.propertyId));
  form.set('category', input.category);
  if (input.title) form.set('title', input.title);
  form.set('visibleToClient', String(input.visibleToClient));
  form.set('file', input.file);
  return (await api.upload<{ data: SharedFileDto }>('/api/files', form)).data;
};

const invalidate = (qc: ReturnType<typeof useQueryClient>) => Promise.all([qc.invalidateQueries({ queryKey: filesKeys.all }), qc.invalidateQueries({ queryKey: ['portal'] })]);

/** Uploads a file for a client. */
export function useShareFile() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: shareFile, onSuccess: () => invalidate(qc) });
}

/** PATCH /api/files/:id: rename, share or unshare. */
export function useUpdateFile() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, input }: { id: number; input: FileUpdateInput }) => (await api.patch<{ data: SharedFileDto }>(`/api/files/${id}`, input)).data,
    onSuccess: () => invalidate(qc),
  });
}

/** DELETE /api/files/:id. */
export function useDeleteFile() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (id: number) => api.delete<void>(`/api/files/${id}`), onSuccess: () => invalidate(qc) });
}
