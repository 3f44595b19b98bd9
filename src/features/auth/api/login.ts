import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';
import type { LoginInput, SessionUser } from '../../../../shared/schemas/auth';
import { setFirmZone } from '../../../lib/firm-clock';

interface SignInAnswer {
  user: SessionUser;
  csrfToken: string;
}

/** Signs in; the session is new, so its CSRF token replaces the old one. */
export async function login(input: LoginInput): Promise<SessionUser> {
  const body = await api.post<SignInAnswer>('/api/auth/login', input);
  setCsrfToken(body.csrfToken);
  return body.user;
}

export function useLogin() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (user) => {
      qc.clear();
      setFirmZone(user.firmTimezone);
      qc.setQueryData(['auth', 'me'], user);
    },
  });
}

export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<void>('/api/auth/logout'),
    onSettled: () => {
      setCsrfToken(null);
      qc.clear();
      qc.setQueryData(['auth', 'me'], null);
    },
  });
}
