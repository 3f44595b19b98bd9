import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { resultsKeys } from './keys';

/** Deletes a harvest record. */
export const deleteHarvest = (id: number) => api.delete<void>(`/api/harvests/${id}`);

/** Deletes a harvest record; the property's results refetch. */
export function useDeleteHarvest(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteHarvest, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}
