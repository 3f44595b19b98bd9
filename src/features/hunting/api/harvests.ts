import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { HarvestCreateInput, HarvestDto } from '../../../../shared/schemas/results';
import { huntingKeys } from './keys';

/** Records a harvest from the planner (staff, or a client's hunters when sit logging is on), linked to a stand and sit. */
export const useCreateHarvest = (propertyId: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: HarvestCreateInput) => api.post<{ data: HarvestDto }>(`/api/properties/${propertyId}/harvests`, input),
    // The Results page reads harvests under its own keys; refresh everything of this property.
    onSuccess: () => qc.invalidateQueries({ predicate: (q) => q.queryKey.includes(propertyId) || q.queryKey[0] === huntingKeys.all[0] }),
  });
};
