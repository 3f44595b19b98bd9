/**
 * The one query-options module of GET /api/properties/:id, shared by every feature that reads a
 * property (properties, plan map, prescriptions) and by route loaders: one key, one fetcher, one type.
 * It lives in src/lib because features never import each other (lint zones).
 */
import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../api-client';
import type { PropertyDto } from '../../../shared/schemas/property';

/** Query keys of one property (every feature's `property(id)` key is this one). */
export const propertyKeys = {
  detail: (propertyId: number) => ['properties', 'detail', propertyId] as const,
};

/** GET /api/properties/:id: the property with its boundary and server-computed acres. */
export const getProperty = (propertyId: number, signal?: AbortSignal) => getData<PropertyDto>(`/api/properties/${propertyId}`, signal);

/** The query options of one property, for hooks and loaders alike. */
export const getPropertyQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: propertyKeys.detail(propertyId), queryFn: ({ signal }) => getProperty(propertyId, signal) });

/** One property of the firm (disabled until there is an id). */
export const useProperty = (propertyId: number) => useQuery({ ...getPropertyQueryOptions(propertyId), enabled: propertyId > 0 });
