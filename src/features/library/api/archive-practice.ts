import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { libraryKeys } from './keys';

/** DELETE /api/practices/:id: archives the practice; prescriptions written from it are kept. */
export const archivePractice = (id: number) => api.delete<{ data: { archived: boolean; prescriptionsKept: number } }>(`/api/practices/${id}`).then((r) => r.data);

/** Archives a practice and drops it from the list. */
export function useArchivePractice() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: archivePractice,
    onSuccess: (_data, id) => {
      qc.removeQueries({ queryKey: libraryKeys.practice(id) });
      void qc.invalidateQueries({ queryKey: libraryKeys.practices() });
    },
  });
}
