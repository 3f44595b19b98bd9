import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { applyUnitChanges } from './get-units';

/** DELETE /api/units/:id. */
export async function deleteUnit(unitId: number): Promise<void> {
  await api.delete<void>(`/api/units/${unitId}`);
}

/** Deletes a unit and takes it off the map at once. */
export function useDeleteUnit(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (unitId: number) => deleteUnit(unitId),
    onSuccess: (_void, unitId) => applyUnitChanges(qc, propertyId, { remove: [unitId] }),
  });
}
