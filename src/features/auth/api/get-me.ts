import { queryOptions, useQuery } from '@tanstack/react-query';
import { getMe as readMe } from './session-requests';
import { setFirmZone } from '../../../lib/firm-clock';
import { setFirmUnits } from '../../../lib/firm-units';
import type { SessionUser } from '../../../../shared/schemas/auth';

/** The signed-in user, or null when nobody is signed in; records the firm's time zone for the clock. */
export async function getMe(): Promise<SessionUser | null> {
  const user = await readMe();
  if (user) setFirmZone(user.firmTimezone);
  if (user) setFirmUnits(user);
  return user;
}

export const getMeQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 60_000 });

/** The signed-in user (a cache restored offline also sets the firm's zone). */
export function useMe() {
  const me = useQuery(getMeQueryOptions());
  if (me.data) setFirmZone(me.data.firmTimezone);
  if (me.data) setFirmUnits(me.data);
  return me;
}
