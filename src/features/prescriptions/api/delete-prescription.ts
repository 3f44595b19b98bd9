import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { prescriptionKeys } from './keys';

/** DELETE /api/prescriptions/:id. */
export const deletePrescription = (id: number) => api.delete<void>(`/api/prescriptions/${id}`);

/** Deletes a prescription; every prescription list refreshes. */
export function useDeletePrescription() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePrescription, onSuccess: () => qc.invalidateQueries({ queryKey: prescriptionKeys.all() }) });
}
