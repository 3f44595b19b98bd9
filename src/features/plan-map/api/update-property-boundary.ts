import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { MultiPolygon, Polygon } from 'geojson';
import { api } from '../../../lib/api-client';
import type { PropertyDto } from '../../../../shared/schemas/property';
import { planMapKeys } from './keys';

/** PATCH /api/properties/:id {boundary}: replaces the boundary (null clears it). */
export async function updatePropertyBoundary(propertyId: number, boundary: Polygon | MultiPolygon | null): Promise<PropertyDto> {
  const body = await api.patch<{ data: PropertyDto }>(`/api/properties/${propertyId}`, { boundary });
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
    mutationFn: (boundary: Polygon | MultiPolygon | null) => updatePropertyBoundary(propertyId, boundary),
    onSuccess: (property) => applyProperty(qc, property),
  });
}
