import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { libraryKeys } from './keys';

/** DELETE /api/rates/:id: archives it (409 while a practice uses it). */
export const archiveRate = (id: number) => api.delete<void>(`/api/rates/${id}`);

/** Archives a rate. */
export function useArchiveRate() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: archiveRate, onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.rates() }) });
}
