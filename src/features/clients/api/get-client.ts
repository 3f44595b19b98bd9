import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ClientDto } from '../../../../shared/schemas/client';

/** One client with its property count and acres. */
export const getClient = (id: number, signal?: AbortSignal) => getData<ClientDto>(`/api/clients/${id}`, signal);

export const getClientQueryOptions = (id: number) => queryOptions({ queryKey: ['clients', 'detail', id], queryFn: ({ signal }) => getClient(id, signal) });

/** One client of the firm. */
export const useClient = (id: number) => useQuery({ ...getClientQueryOptions(id), enabled: id > 0 });
