import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RateCreateInput } from '../../../../shared/schemas/library';
import type { RateDto } from '../lib/types';
import { libraryKeys } from './keys';

/** PATCH /api/rates/:id. */
export const updateRate = (id: number, input: Partial<RateCreateInput>) => api.patch<{ data: RateDto }>(`/api/rates/${id}`, input).then((r) => r.data);

/** Saves a rate. */
export function useUpdateRate() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: Partial<RateCreateInput> }) => updateRate(id, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.rates() }),
  });
}
