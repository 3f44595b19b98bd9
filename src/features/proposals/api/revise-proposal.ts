import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** Makes a new draft version with the same lines; a sent earlier version is withdrawn. */
export const reviseProposal = async (id: number) => (await api.post<{ data: ProposalDto }>(`/api/proposals/${id}/revise`)).data;

/** Revises a proposal; the answer is the new draft version. */
export function useReviseProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: reviseProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
