import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { OverlayDto } from '../../../../shared/schemas/firm';
import { planMapKeys } from './keys';

export type { OverlayDto };

/** GET /api/properties/:id/overlays. */
export const getOverlays = (propertyId: number, signal?: AbortSignal) => getData<OverlayDto[]>(`/api/properties/${propertyId}/overlays`, signal);

export const getOverlaysQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: planMapKeys.overlays(propertyId), queryFn: ({ signal }) => getOverlays(propertyId, signal) });

/** The image overlays of a property. */
export const useOverlays = (propertyId: number) => useQuery(getOverlaysQueryOptions(propertyId));
