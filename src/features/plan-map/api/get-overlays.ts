import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import { planMapKeys } from './keys';

/** A georeferenced image laid under the plan (an aerial photo, a scanned survey). */
export interface OverlayDto {
  id: number;
  name: string;
  imageUrl: string;
  /** [lon, lat] of the top-left, top-right, bottom-right and bottom-left corners. */
  corners: [[number, number], [number, number], [number, number], [number, number]];
  opacity: number;
}

/** GET /api/properties/:id/overlays. */
export const getOverlays = (propertyId: number, signal?: AbortSignal) => getData<OverlayDto[]>(`/api/properties/${propertyId}/overlays`, signal);

export const getOverlaysQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: planMapKeys.overlays(propertyId), queryFn: ({ signal }) => getOverlays(propertyId, signal) });

/** The image overlays of a property. */
export const useOverlays = (propertyId: number) => useQuery(getOverlaysQueryOptions(propertyId));
