import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PrescriptionCreateInput } from '../../../../shared/schemas/library';
import type { PrescriptionDto } from '../lib/types';
import { prescriptionKeys } from './keys';

/** POST /api/units/:id/prescriptions. */
export const createPrescription = (unitId: number, input: PrescriptionCreateInput) =>
  api.post<{ data: PrescriptionDto }>(`/api/units/${unitId}/prescriptions`, input).then((r) => r.data);

/** Writes a prescription on a unit; every prescription list refreshes. */
export function useCreatePrescription(unitId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: PrescriptionCreateInput) => createPrescription(unitId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: prescriptionKeys.all() }),
  });
}
