import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PracticeDto } from '../../../../shared/schemas/library';
import type { PracticeStep } from '../../../../shared/domain/practice';
import { libraryKeys } from './keys';

/** The parts of a practice the practice page changes: its name, description and the full steps array. */
export interface PracticeUpdate {
  name?: string;
  description?: string;
  steps?: PracticeStep[];
}

/** PATCH /api/practices/:id. */
export const updatePractice = (id: number, input: PracticeUpdate) => api.patch<{ data: PracticeDto }>(`/api/practices/${id}`, input).then((r) => r.data);

/** Saves a practice and refreshes the library lists. */
export function useUpdatePractice(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PracticeUpdate) => updatePractice(id, input),
    onSuccess: (practice) => {
      qc.setQueryData(libraryKeys.practice(id), practice);
      void qc.invalidateQueries({ queryKey: libraryKeys.practices() });
    },
  });
}
