import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StandSiteDto, StandSiteUpdateInput, StandWindsAnswer } from '../../../../shared/schemas/hunting';
import { huntingKeys } from './keys';

/** Every stand's 16 winds with reasons, the route checks, cautions and the map's units. */
export const getStandWinds = (propertyId: number, signal?: AbortSignal) => api.get<StandWindsAnswer>(`/api/properties/${propertyId}/stand-winds`, signal);

export const getStandWindsQueryOptions = (propertyId: number) => queryOptions({ queryKey: huntingKeys.standWinds(propertyId), queryFn: ({ signal }) => getStandWinds(propertyId, signal) });

/** The stand winds of one property (staff, or the client who owns it). */
export const useStandWinds = (propertyId: number) => useQuery({ ...getStandWindsQueryOptions(propertyId), enabled: propertyId > 0 });

/** Saves what a stand watches, its type, height and approach side (staff). */
export const useUpdateStandSite = (propertyId: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ unitId, input }: { unitId: number; input: StandSiteUpdateInput }) => api.put<{ data: StandSiteDto }>(`/api/units/${unitId}/stand-site`, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: huntingKeys.standWinds(propertyId) }),
  });
};
