import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { MaterialCreateInput, MaterialDto } from '../../../../shared/schemas/library';

/** PATCH /api/materials/:id with the whole material (its kind cannot change). */
export const updateMaterial = (id: number, input: MaterialCreateInput) => api.patch<{ data: MaterialDto }>(`/api/materials/${id}`, input).then((r) => r.data);

/** Saves a material; practices' cautions and lists depend on it, so those refresh too. */
export function useUpdateMaterial() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: MaterialCreateInput }) => updateMaterial(id, input),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: ['materials'] });
      void qc.invalidateQueries({ queryKey: ['practices'] });
    },
  });
}
