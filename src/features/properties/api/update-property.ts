import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PropertyDto, PropertyUpdateInput } from '../../../../shared/schemas/property';

/** Changes a property's details (PATCH; `boundary` only when given). */
export const updateProperty = async ({ id, input }: { id: number; input: PropertyUpdateInput }) => (await api.patch<{ data: PropertyDto }>(`/api/properties/${id}`, input)).data;

/** Changes a property; the property, property lists and client counts refetch. */
export function useUpdateProperty() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateProperty,
    onSuccess: (property) => {
      qc.setQueryData(['properties', 'detail', property.id], property);
      return Promise.all([qc.invalidateQueries({ queryKey: ['properties'] }), qc.invalidateQueries({ queryKey: ['clients'] })]);
    },
  });
}
