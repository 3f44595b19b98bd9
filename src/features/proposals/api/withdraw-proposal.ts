import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** Withdraws a draft or sent proposal; the client can no longer approve it. */
export const withdrawProposal = async (id: number) => (await api.post<{ data: ProposalDto }>(`/api/proposals/${id}/withdraw`)).data;

/** Withdraws a proposal. */
export function useWithdrawProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: withdrawProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
