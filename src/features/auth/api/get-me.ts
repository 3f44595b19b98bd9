import { queryOptions, useQuery } from '@tanstack/react-query';
import { getMe } from './session-requests';

export { getMe };

export const getMeQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 60_000 });

export const useMe = () => useQuery(getMeQueryOptions());
