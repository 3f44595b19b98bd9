import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { scheduleKeys } from './keys';
import type { PropertyProgress } from './get-property-progress';

/** PATCH /api/properties/:id/progress-settings: whether the client hears when a unit's work is finished. */
export const updateProgressSettings = (propertyId: number, notifyClientOnUnitDone: boolean) =>
  api.patch<{ data: { notifyClientOnUnitDone: boolean } }>(`/api/properties/${propertyId}/progress-settings`, { notifyClientOnUnitDone }).then((r) => r.data);

/** Turns the client's "unit finished" e-mail on or off and writes the answer into the cached progress. */
export function useUpdateProgressSettings(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (notify: boolean) => updateProgressSettings(propertyId, notify),
    onSuccess: (data) => qc.setQueryData<PropertyProgress>(scheduleKeys.progress(propertyId), (old) => (old ? { ...old, ...data } : old)),
  });
}
