import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ClientCreateInput, ClientDto } from '../../../../shared/schemas/client';

/** Adds a client to the firm. */
export const createClient = async (input: ClientCreateInput) => (await api.post<{ data: ClientDto }>('/api/clients', input)).data;

/** Adds a client; every client list refetches. */
export function useCreateClient() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createClient,
    onSuccess: () => qc.invalidateQueries({ queryKey: ['clients'] }),
  });
}
