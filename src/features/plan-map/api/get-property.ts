import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { PropertyDto } from '../../../../shared/schemas/property';
import { planMapKeys } from './keys';

/** GET /api/properties/:id: the property with its boundary and server-computed acres. */
export const getProperty = (propertyId: number, signal?: AbortSignal) => getData<PropertyDto>(`/api/properties/${propertyId}`, signal);

export const getPropertyQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: planMapKeys.property(propertyId), queryFn: ({ signal }) => getProperty(propertyId, signal) });

/** The property shown on the plan map. */
export const useProperty = (propertyId: number) => useQuery(getPropertyQueryOptions(propertyId));
