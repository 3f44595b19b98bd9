import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SignupInput } from '../../../../shared/schemas/auth';

/** Signs a new firm up; the answer is the same whether the address is new or not. */
export const useSignup = () => useMutation({ mutationFn: (input: SignupInput) => api.post<{ data: { message: string } }>('/api/signup', input) });

/** Confirms the e-mail address from the link's token. */
export const useVerifyEmail = () => useMutation({ mutationFn: (token: string) => api.post<{ data: { email: string; message: string } }>('/api/auth/verify-email', { token }) });
