import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ProposalRowDto, ProposalStatus } from '../../../../shared/schemas/proposal-dto';

export interface ProposalListFilter {
  status?: ProposalStatus;
  propertyId?: number;
}

/** Proposals the signed-in person may see: staff the firm's, a client their own sent ones. */
export const getProposals = (filter: ProposalListFilter = {}, signal?: AbortSignal) => {
  const query = new URLSearchParams();
  if (filter.status) query.set('status', filter.status);
  if (filter.propertyId) query.set('propertyId', String(filter.propertyId));
  const qs = query.toString();
  return getData<ProposalRowDto[]>(`/api/proposals${qs ? `?${qs}` : ''}`, signal);
};

export const getProposalsQueryOptions = (filter: ProposalListFilter = {}) =>
  queryOptions({ queryKey: ['proposals', filter], queryFn: ({ signal }) => getProposals(filter, signal) });

/** The proposal list, filtered by status and/or property. */
export const useProposals = (filter: ProposalListFilter = {}) => useQuery(getProposalsQueryOptions(filter));
