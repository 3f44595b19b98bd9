import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { ClientCreateInput, ClientDto } from '../../../../shared/schemas/client';

export const getClientsQueryOptions = () => queryOptions({ queryKey: ['clients'], queryFn: () => getData<ClientDto[]>('/api/clients') });
export const useClients = () => useQuery(getClientsQueryOptions());

export function useCreateClient() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ClientCreateInput) => api.post<{ data: ClientDto }>('/api/clients', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['clients'] }),
  });
}
