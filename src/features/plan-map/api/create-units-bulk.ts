import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { UnitCreateInput, UnitDto } from '../../../../shared/schemas/unit';
import { applyUnitChanges } from './get-units';

/** POST /api/properties/:id/units/bulk: several units in one transaction (all or none). */
export async function createUnitsBulk(propertyId: number, units: UnitCreateInput[], confirmLargeArea = false): Promise<UnitDto[]> {
  const body = await api.post<{ data: UnitDto[] }>(`/api/properties/${propertyId}/units/bulk`, confirmLargeArea ? { units, confirmLargeArea } : { units });
  return body.data;
}

/** Saves imported features as units. */
export function useCreateUnitsBulk(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (arg: UnitCreateInput[] | { units: UnitCreateInput[]; confirmLargeArea: boolean }) =>
      Array.isArray(arg) ? createUnitsBulk(propertyId, arg) : createUnitsBulk(propertyId, arg.units, arg.confirmLargeArea),
    onSuccess: (units) => applyUnitChanges(qc, propertyId, { upsert: units }),
  });
}
