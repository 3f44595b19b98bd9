import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ObservationSummaryDto } from '../../../../shared/schemas/observation';
import { observationKeys } from './keys';

/** Counts by unit or by month, split by kind. */
export const getObservationSummary = (propertyId: number, by: 'unit' | 'month', signal?: AbortSignal) =>
  getData<ObservationSummaryDto>(`/api/properties/${propertyId}/observations/summary?by=${by}`, signal);

export const getObservationSummaryQueryOptions = (propertyId: number, by: 'unit' | 'month') =>
  queryOptions({ queryKey: observationKeys.summary(propertyId, by), queryFn: ({ signal }) => getObservationSummary(propertyId, by, signal) });

export const useObservationSummary = (propertyId: number, by: 'unit' | 'month') => useQuery(getObservationSummaryQueryOptions(propertyId, by));
