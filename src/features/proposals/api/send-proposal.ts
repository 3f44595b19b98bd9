import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** Sends a draft to the client: it becomes read-only and the e-mail with the PDF and portal link is queued. */
export const sendProposal = async (id: number) => (await api.post<{ data: ProposalDto }>(`/api/proposals/${id}/send`)).data;

/** Sends a draft. */
export function useSendProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: sendProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
