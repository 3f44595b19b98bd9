import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { UndeliveredMailDto } from '../../../../shared/schemas/outbox';

export const getUndeliveredMailQueryOptions = () => queryOptions({ queryKey: ['outbox', 'undelivered'], queryFn: () => getData<UndeliveredMailDto[]>('/api/outbox/undelivered'), refetchInterval: 30_000 });
/** Mail the outbox failed to deliver or is still retrying (owner only). */
export const useUndeliveredMail = () => useQuery(getUndeliveredMailQueryOptions());

/** Puts a message back in the queue now, with a fresh 3-day retry window. */
export function useResendMail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post<{ data: UndeliveredMailDto }>(`/api/outbox/${id}/resend`),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['outbox'] }),
  });
}
