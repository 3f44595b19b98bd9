import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { UnitCreateInput, UnitDto } from '../../../../shared/schemas/unit';
import { applyUnitChanges } from './get-units';

/** POST /api/properties/:id/units: one new unit. */
export async function createUnit(propertyId: number, input: UnitCreateInput): Promise<UnitDto> {
  const body = await api.post<{ data: UnitDto }>(`/api/properties/${propertyId}/units`, input);
  return body.data;
}

/** Creates a unit and shows it at once. */
export function useCreateUnit(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UnitCreateInput) => createUnit(propertyId, input),
    onSuccess: (unit) => applyUnitChanges(qc, propertyId, { upsert: [unit] }),
  });
}
