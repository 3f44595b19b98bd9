import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { MultiPolygon, Polygon } from 'geojson';
import { api } from '../../../lib/api-client';
import type { PropertyDto } from '../../../../shared/schemas/property';
import { planMapKeys } from './keys';

/**
 * PATCH /api/properties/:id {boundary}: replaces the boundary (null clears it). A boundary over the
 * firm's large-area threshold needs `confirmLargeArea` (the server answers 422 naming it otherwise).
 */
export async function updatePropertyBoundary(propertyId: number, boundary: Polygon | MultiPolygon | null, confirmLargeArea = false): Promise<PropertyDto> {
  const body = await api.patch<{ data: PropertyDto }>(`/api/properties/${propertyId}`, confirmLargeArea ? { boundary, confirmLargeArea } : { boundary });
  return body.data;
}

/** Puts the answered property into the cache and refreshes what depends on the boundary. */
export function applyProperty(qc: QueryClient, property: PropertyDto): void {
  qc.setQueryData(planMapKeys.property(property.id), property);
  void qc.invalidateQueries({ queryKey: planMapKeys.plan(property.id) });
  void qc.invalidateQueries({ queryKey: ['properties'], exact: false, predicate: (q) => q.queryKey[1] !== 'detail' });
  void qc.invalidateQueries({ queryKey: ['desk'] });
}

/** The boundary of the property, saved. */
export function useUpdatePropertyBoundary(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (arg: Polygon | MultiPolygon | null | { boundary: Polygon | MultiPolygon | null; confirmLargeArea: boolean }) =>
      arg && 'boundary' in arg ? updatePropertyBoundary(propertyId, arg.boundary, arg.confirmLargeArea) : updatePropertyBoundary(propertyId, arg),
    onSuccess: (property) => applyProperty(qc, property),
  });
}
