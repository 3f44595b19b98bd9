import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ClientDto } from '../../../../shared/schemas/client';

/** Every client of the firm, by name. */
export const getClients = (signal?: AbortSignal) => getData<ClientDto[]>('/api/clients', signal);

export const getClientsQueryOptions = () => queryOptions({ queryKey: ['clients'], queryFn: ({ signal }) => getClients(signal) });

/** The firm's clients. */
export const useClients = () => useQuery(getClientsQueryOptions());
