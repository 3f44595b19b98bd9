import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { resultsKeys } from './keys';

/** Deletes a survey. */
export const deleteSurvey = (id: number) => api.delete<void>(`/api/surveys/${id}`);

/** Deletes a survey; the property's results refetch. */
export function useDeleteSurvey(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteSurvey, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}
