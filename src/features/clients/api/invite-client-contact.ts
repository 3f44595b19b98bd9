import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { TeamMember } from '../../../../shared/schemas/auth';

export interface ClientContactInvite {
  clientId: number;
  name: string;
  email: string;
}

/** Invites a landowner to the portal of their client record (an e-mail with a link to set a password). */
export const inviteClientContact = async ({ clientId, name, email }: ClientContactInvite) =>
  (await api.post<{ data: TeamMember }>('/api/team/invitations', { email, name, role: 'client', clientId })).data;

/** Invites a portal contact; the client's contacts and the team list refetch. */
export function useInviteClientContact() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: inviteClientContact,
    onSuccess: (_member, input) =>
      Promise.all([qc.invalidateQueries({ queryKey: ['clients', 'detail', input.clientId, 'contacts'] }), qc.invalidateQueries({ queryKey: ['team'] })]),
  });
}
