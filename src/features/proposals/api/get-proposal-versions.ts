import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ProposalRowDto } from '../../../../shared/schemas/proposal-dto';

/** Every version of the proposal's series, newest first (staff). */
export const getProposalVersions = (id: number, signal?: AbortSignal) => getData<ProposalRowDto[]>(`/api/proposals/${id}/versions`, signal);

export const getProposalVersionsQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['proposals', 'versions', id], queryFn: ({ signal }) => getProposalVersions(id, signal) });

/** The versions of a proposal. */
export const useProposalVersions = (id: number) => useQuery({ ...getProposalVersionsQueryOptions(id), enabled: id > 0 });
