import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Deletes a property with its plan. */
export const deleteProperty = (id: number) => api.delete<void>(`/api/properties/${id}`);

/**
 * Deletes a property. Its own cached record is dropped without a refetch (the page showing it is
 * about to leave); lists, client counts and the desk refetch.
 */
export function useDeleteProperty() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteProperty,
    onSuccess: (_none, id) => {
      const isThisProperty = (key: readonly unknown[]) => key[1] === 'detail' && key[2] === id;
      void qc.invalidateQueries({ queryKey: ['properties'], predicate: (q) => !isThisProperty(q.queryKey) });
      void qc.invalidateQueries({ queryKey: ['clients'] });
      void qc.invalidateQueries({ queryKey: ['desk'] });
      qc.removeQueries({ queryKey: ['properties', 'detail', id] });
      qc.removeQueries({ queryKey: ['units', { propertyId: id }] });
    },
  });
}
