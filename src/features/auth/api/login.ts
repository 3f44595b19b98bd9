import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';
import { clearPersistedCache } from '../../../lib/persisted-cache';
import { login } from './session-requests';

export { login };

export function useLogin() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (user) => {
      qc.clear();
      qc.setQueryData(['auth', 'me'], user);
    },
  });
}

export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<void>('/api/auth/logout'),
    onSettled: async () => {
      setCsrfToken(null);
      qc.clear();
      // Nothing this person saw stays on the phone for the next one.
      await clearPersistedCache();
      qc.setQueryData(['auth', 'me'], null);
    },
  });
}
