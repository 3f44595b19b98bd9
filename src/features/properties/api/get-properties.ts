import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PropertyDto } from '../../../../shared/schemas/property';

export interface PropertyFilter {
  clientId?: number;
}

/** The firm's properties, optionally of one client. */
export function getProperties(filter: PropertyFilter = {}, signal?: AbortSignal): Promise<PropertyDto[]> {
  const params = new URLSearchParams();
  if (filter.clientId) params.set('clientId', String(filter.clientId));
  const qs = params.toString();
  return getData<PropertyDto[]>(`/api/properties${qs ? `?${qs}` : ''}`, signal);
}

export const getPropertiesQueryOptions = (filter: PropertyFilter = {}) =>
  queryOptions({ queryKey: ['properties', filter], queryFn: ({ signal }) => getProperties(filter, signal) });

/** The firm's properties; while another client's list loads, the last one stays on screen. */
export const useProperties = (filter: PropertyFilter = {}) => useQuery({ ...getPropertiesQueryOptions(filter), placeholderData: keepPreviousData });
