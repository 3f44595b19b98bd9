import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { MaterialCreateInput, MaterialDto } from '../../../../shared/schemas/library';

/** POST /api/materials. */
export const createMaterial = (input: MaterialCreateInput) => api.post<{ data: MaterialDto }>('/api/materials', input).then((r) => r.data);

/** Adds a material to the library. */
export function useCreateMaterial() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createMaterial, onSuccess: () => qc.invalidateQueries({ queryKey: ['materials'] }) });
}
