import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ProposalRowDto } from '../../../../shared/schemas/proposal-dto';

/** Every proposal (all versions) of one property, newest first. */
export const getPropertyProposals = (propertyId: number, signal?: AbortSignal) => getData<ProposalRowDto[]>(`/api/properties/${propertyId}/proposals`, signal);

export const getPropertyProposalsQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: ['proposals', { propertyId, scope: 'property' }], queryFn: ({ signal }) => getPropertyProposals(propertyId, signal) });

/** The proposals of one property (staff). */
export const usePropertyProposals = (propertyId: number) => useQuery({ ...getPropertyProposalsQueryOptions(propertyId), enabled: propertyId > 0 });
