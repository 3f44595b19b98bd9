import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PasswordChangeInput } from '../../../../shared/schemas/auth';

export interface PasswordChangeAnswer {
  data: { message: string; sessionsEnded: number };
}

/** Changes the signed-in person's password; their other sessions end. */
export const changePassword = (input: PasswordChangeInput) => api.post<PasswordChangeAnswer>('/api/auth/password', input);

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
