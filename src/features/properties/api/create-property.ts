import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PropertyCreateInput, PropertyDto } from '../../../../shared/schemas/property';

/** Adds a property to a client (the boundary may follow later). */
export const createProperty = async (input: PropertyCreateInput) => (await api.post<{ data: PropertyDto }>('/api/properties', input)).data;

/** Adds a property; property lists and the client's counts refetch. */
export function useCreateProperty() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createProperty,
    onSuccess: (property) => {
      qc.setQueryData(['properties', 'detail', property.id], property);
      return Promise.all([qc.invalidateQueries({ queryKey: ['properties'] }), qc.invalidateQueries({ queryKey: ['clients'] }), qc.invalidateQueries({ queryKey: ['desk'] })]);
    },
  });
}
