import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProposalCreateInput } from '../../../../shared/schemas/proposal';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { storeProposal } from './proposal-cache';

/** Drafts a proposal for a property from its prescriptions (all of them unless some are chosen). */
export const createProposal = async ({ propertyId, input = {} }: { propertyId: number; input?: ProposalCreateInput }) =>
  (await api.post<{ data: ProposalDto }>(`/api/properties/${propertyId}/proposals`, input)).data;

/** Drafts a proposal; the lists refetch. */
export function useCreateProposal() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createProposal, onSuccess: (proposal) => storeProposal(qc, proposal) });
}
