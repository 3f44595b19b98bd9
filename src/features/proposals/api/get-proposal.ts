import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';

/** One proposal with lines, totals, unit summaries, cautions and its approval record. */
export const getProposal = (id: number, signal?: AbortSignal) => getData<ProposalDto>(`/api/proposals/${id}`, signal);

export const getProposalQueryOptions = (id: number) => queryOptions({ queryKey: ['proposals', 'detail', id], queryFn: ({ signal }) => getProposal(id, signal) });

/** One proposal (a client reading it for the first time marks it viewed). */
export const useProposal = (id: number) => useQuery({ ...getProposalQueryOptions(id), enabled: id > 0 });
