import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ApproveInput } from '../../../../shared/schemas/proposal';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** The client approves a sent proposal with their typed name and the options they chose. */
export const approveProposal = async ({ id, input }: { id: number; input: ApproveInput }) =>
  (await api.post<{ data: ProposalDto }>(`/api/proposals/${id}/approve`, input)).data;

/** Approves a proposal (client only). */
export function useApproveProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: approveProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
