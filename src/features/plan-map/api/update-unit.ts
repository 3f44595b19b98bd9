import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { UnitDto, UnitUpdateInput } from '../../../../shared/schemas/unit';
import { applyUnitChanges } from './get-units';

/** PATCH /api/units/:id: kind, name, notes or geometry. */
export async function updateUnit(unitId: number, input: UnitUpdateInput): Promise<UnitDto> {
  const body = await api.patch<{ data: UnitDto }>(`/api/units/${unitId}`, input);
  return body.data;
}

/** Saves a change to a unit and shows it at once. */
export function useUpdateUnit(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ unitId, input }: { unitId: number; input: UnitUpdateInput }) => updateUnit(unitId, input),
    onSuccess: (unit) => applyUnitChanges(qc, propertyId, { upsert: [unit] }),
  });
}
