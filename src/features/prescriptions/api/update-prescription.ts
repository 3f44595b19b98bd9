import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PrescriptionCreateInput } from '../../../../shared/schemas/library';
import type { PrescriptionDto } from '../lib/types';
import { prescriptionKeys } from './keys';

export type PrescriptionUpdateInput = Partial<Omit<PrescriptionCreateInput, 'practiceId'>>;

/** PATCH /api/prescriptions/:id: new values, computed again with the current library. */
export const updatePrescription = (id: number, input: PrescriptionUpdateInput) => api.patch<{ data: PrescriptionDto }>(`/api/prescriptions/${id}`, input).then((r) => r.data);

/** Changes a prescription; every prescription list refreshes. */
export function useUpdatePrescription() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: PrescriptionUpdateInput }) => updatePrescription(id, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: prescriptionKeys.all() }),
  });
}
