import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client';
import type { SessionUser } from '../../../../shared/schemas/auth';
import { setFirmZone } from '../../../lib/firm-clock';

/** The signed-in user, or null when nobody is signed in. */
export async function getMe(): Promise<SessionUser | null> {
  try {
    const body = await api.get<{ user: SessionUser }>('/api/auth/me');
    setFirmZone(body.user.firmTimezone);
    return body.user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const getMeQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 60_000 });

export const useMe = () => useQuery(getMeQueryOptions());
