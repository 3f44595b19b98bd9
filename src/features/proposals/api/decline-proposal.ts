import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** The client declines a sent proposal, telling the consultant why. */
export const declineProposal = async ({ id, reason }: { id: number; reason: string }) =>
  (await api.post<{ data: ProposalDto }>(`/api/proposals/${id}/decline`, { reason })).data;

/** Declines a proposal (client only). */
export function useDeclineProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: declineProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
