import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RateCreateInput } from '../../../../shared/schemas/library';
import type { RateDto } from '../lib/types';
import { libraryKeys } from './keys';

/** POST /api/rates. */
export const createRate = (input: RateCreateInput) => api.post<{ data: RateDto }>('/api/rates', input).then((r) => r.data);

/** Adds a service rate. */
export function useCreateRate() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createRate, onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.rates() }) });
}
