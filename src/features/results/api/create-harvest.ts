import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { HarvestCreateValues, HarvestDto } from '../../../../shared/schemas/results';
import { resultsKeys } from './keys';

/** Records a harvested deer. */
export const createHarvest = async ({ propertyId, input }: { propertyId: number; input: HarvestCreateValues }) =>
  (await api.post<{ data: HarvestDto }>(`/api/properties/${propertyId}/harvests`, input)).data;

/** Records a harvest; the property's results refetch. */
export function useCreateHarvest(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createHarvest, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}
