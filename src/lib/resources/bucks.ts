/**
 * The one query-options module of a property's buck roster (GET /api/properties/:id/bucks), shared by
 * the cameras feature (roster, review grid) and the hunting feature (the sit form's buck picker).
 * It lives in src/lib because features never import each other (lint zones).
 */
import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../api-client';
import type { BuckDto } from '../../../shared/schemas/cameras';

/** Query keys of the roster, under the camera fleet's prefix so a camera write refreshes it. */
export const buckKeys = {
  roster: (propertyId: number, scope = 'staff') => ['cameras', 'bucks', { propertyId, scope }] as const,
};

/** The query options of a property's roster, for hooks and loaders alike. */
export const getBucksQueryOptions = (propertyId: number, apiBase = '/api') =>
  queryOptions({ queryKey: buckKeys.roster(propertyId, apiBase), queryFn: ({ signal }) => getData<BuckDto[]>(`${apiBase}/properties/${propertyId}/bucks`, signal) });

/** A property's buck roster (a client gets the featured photos only). */
export const useBucks = (propertyId: number) => useQuery({ ...getBucksQueryOptions(propertyId), enabled: propertyId > 0 });
