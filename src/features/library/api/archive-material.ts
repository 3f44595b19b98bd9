import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** DELETE /api/materials/:id: archives it (409 while a practice uses it). */
export const archiveMaterial = (id: number) => api.delete<void>(`/api/materials/${id}`);

/** Archives a material. */
export function useArchiveMaterial() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: archiveMaterial, onSuccess: () => qc.invalidateQueries({ queryKey: ['materials'] }) });
}
