import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { ObservationDto } from '../../../../shared/schemas/observation';
import { observationKeys } from './keys';

/** Filters of the list: kinds, and calendar dates in the firm's zone. */
export interface ObservationFilters {
  kind?: string[];
  from?: string;
  to?: string;
}

function queryString(f: ObservationFilters): string {
  const p = new URLSearchParams();
  if (f.kind?.length) p.set('kind', f.kind.join(','));
  if (f.from) p.set('from', f.from);
  if (f.to) p.set('to', f.to);
  return p.toString();
}

/** A property's observations, oldest first. */
export const getObservations = (propertyId: number, filters: ObservationFilters = {}, signal?: AbortSignal) => {
  const q = queryString(filters);
  return getData<ObservationDto[]>(`/api/properties/${propertyId}/observations${q ? `?${q}` : ''}`, signal);
};

export const getObservationsQueryOptions = (propertyId: number, filters: ObservationFilters = {}) =>
  queryOptions({ queryKey: observationKeys.list(propertyId, queryString(filters)), queryFn: ({ signal }) => getObservations(propertyId, filters, signal) });

/** A property's observations (all of them unless filtered). */
export const useObservations = (propertyId: number, filters: ObservationFilters = {}, enabled = true) => useQuery({ ...getObservationsQueryOptions(propertyId, filters), enabled });
