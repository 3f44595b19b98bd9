import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData, setCsrfToken } from '../../../lib/api-client';
import type { PasswordResetRequestInput, SessionUser, TokenPasswordInput } from '../../../../shared/schemas/auth';
import { setFirmZone } from '../../../lib/firm-clock';
import { setFirmUnits } from '../../../lib/firm-units';

export interface InvitationInfo {
  name: string;
  email: string;
  role: string;
  firmName: string;
}

export const getInvitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['auth', 'invitation', token], queryFn: () => getData<InvitationInfo>(`/api/auth/invitations/${encodeURIComponent(token)}`) });
export const useInvitation = (token: string) => useQuery(getInvitationQueryOptions(token));

export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (input: TokenPasswordInput) => {
      const body = await api.post<{ user: SessionUser; csrfToken: string }>('/api/auth/invitations/accept', input);
      setCsrfToken(body.csrfToken);
      return body.user;
    },
    onSuccess: (user) => {
      qc.clear();
      setFirmZone(user.firmTimezone);
      setFirmUnits(user);
      qc.setQueryData(['auth', 'me'], user);
    },
  });
}

export const useResetCheck = (token: string) =>
  useQuery({ queryKey: ['auth', 'reset', token], queryFn: () => getData<{ email: string }>(`/api/auth/password-reset/${encodeURIComponent(token)}`) });

export const useRequestPasswordReset = () =>
  useMutation({ mutationFn: (input: PasswordResetRequestInput) => api.post<{ data: { message: string } }>('/api/auth/password-reset', input) });

export const useCompletePasswordReset = () =>
  useMutation({ mutationFn: (input: TokenPasswordInput) => api.post<{ data: { message: string } }>('/api/auth/password-reset/complete', input) });
