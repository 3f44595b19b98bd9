import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';
import { forgetPersistedQueries } from '../../../lib/query-persistence';
import { paths } from '../../../config/paths';
import { login } from './session-requests';

export { login };

/** Signs out, forgets what this person saw (persisted cache, memory) and leaves for the sign-in page with a full page load. */
export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<void>('/api/auth/logout'),
    onSettled: async () => {
      setCsrfToken(null);
      // Nothing this person saw stays on the phone for the next one.
      await forgetPersistedQueries();
      qc.clear();
      window.location.replace(paths.login);
    },
  });
}
