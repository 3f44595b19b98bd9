import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PracticeDto } from '../../../../shared/schemas/library';
import { libraryKeys } from './keys';

/** POST /api/practices/:id/duplicate: a copy named "… (copy)". */
export const duplicatePractice = (id: number) => api.post<{ data: PracticeDto }>(`/api/practices/${id}/duplicate`).then((r) => r.data);

/** Copies a practice; the new one joins the list. */
export function useDuplicatePractice() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: duplicatePractice,
    onSuccess: (copy) => {
      qc.setQueryData(libraryKeys.practice(copy.id), copy);
      void qc.invalidateQueries({ queryKey: libraryKeys.practices() });
    },
  });
}
