import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProposalUpdateInput } from '../../../../shared/schemas/proposal';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** Saves a draft: its fields and, when given, all its lines (a full replacement). */
export const updateProposal = async ({ id, input }: { id: number; input: ProposalUpdateInput }) =>
  (await api.patch<{ data: ProposalDto }>(`/api/proposals/${id}`, input)).data;

/** Saves a draft; the server re-prices it with the same rule as the browser. */
export function useUpdateProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
