import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ResultsDto } from '../../../../shared/schemas/results';
import { resultsKeys } from './keys';

/** A property's surveys, harvests, charts' data and season reports. */
export const getResults = (propertyId: number, signal?: AbortSignal) => getData<ResultsDto>(`/api/properties/${propertyId}/results`, signal);

export const getResultsQueryOptions = (propertyId: number) => queryOptions({ queryKey: resultsKeys.property(propertyId), queryFn: ({ signal }) => getResults(propertyId, signal) });

/** The results of one property (staff, or the client who owns it). */
export const useResults = (propertyId: number) => useQuery({ ...getResultsQueryOptions(propertyId), enabled: propertyId > 0 });
