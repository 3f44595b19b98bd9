import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { InviteCreateInput, TeamMember } from '../../../../shared/schemas/auth';

export const getTeamQueryOptions = () => queryOptions({ queryKey: ['team'], queryFn: () => getData<TeamMember[]>('/api/team') });
export const useTeam = () => useQuery(getTeamQueryOptions());

export function useInviteMember() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteCreateInput) => api.post<{ data: TeamMember }>('/api/team/invitations', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['team'] }),
  });
}

export function useSetMemberActive() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, active }: { id: number; active: boolean }) => api.patch<{ data: TeamMember }>(`/api/team/${id}`, { active }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['team'] }),
  });
}

export interface CapturedMailSummary {
  id: number;
  receivedAt: string;
  to: string[];
  subject: string;
  attachments: { filename: string; size: number }[];
}
export interface CapturedMail extends CapturedMailSummary {
  text: string;
  html: string | null;
}
export const useCapturedMail = () => useQuery({ queryKey: ['dev-mail'], queryFn: () => getData<CapturedMailSummary[]>('/api/dev/mail'), refetchInterval: 5000 });
export const useCapturedMessage = (id: number | null) =>
  useQuery({ queryKey: ['dev-mail', id], queryFn: () => getData<CapturedMail>(`/api/dev/mail/${id}`), enabled: id !== null });
