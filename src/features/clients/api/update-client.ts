import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ClientDto, ClientUpdateInput } from '../../../../shared/schemas/client';

/** Changes a client's details. */
export const updateClient = async ({ id, input }: { id: number; input: ClientUpdateInput }) => (await api.patch<{ data: ClientDto }>(`/api/clients/${id}`, input)).data;

/** Changes a client; the client and the lists refetch, and properties show the new name. */
export function useUpdateClient() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateClient,
    onSuccess: (client) => {
      qc.setQueryData(['clients', 'detail', client.id], client);
      return Promise.all([qc.invalidateQueries({ queryKey: ['clients'] }), qc.invalidateQueries({ queryKey: ['properties'] })]);
    },
  });
}
