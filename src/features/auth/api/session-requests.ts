/** Sign-in and "who am I" as plain requests, without the query cache (the sign-in page loads no more than these). */
import { api, ApiError, setCsrfToken } from '../../../lib/api-client';
import type { LoginInput, SessionUser } from '../../../../shared/schemas/auth';

interface SignInAnswer {
  user: SessionUser;
  csrfToken: string;
}

/** The signed-in user, or null when nobody is signed in. */
export async function getMe(): Promise<SessionUser | null> {
  try {
    const body = await api.get<{ user: SessionUser }>('/api/auth/me');
    return body.user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

/** Signs in; the session is new, so its CSRF token replaces the old one. */
export async function login(input: LoginInput): Promise<SessionUser> {
  const body = await api.post<SignInAnswer>('/api/auth/login', input);
  setCsrfToken(body.csrfToken);
  return body.user;
}
