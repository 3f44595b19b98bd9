import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SurveyCreateValues, SurveyDto } from '../../../../shared/schemas/results';
import { resultsKeys } from './keys';

/** Records a camera survey; answers it with its estimates. */
export const createSurvey = async ({ propertyId, input }: { propertyId: number; input: SurveyCreateValues }) =>
  (await api.post<{ data: SurveyDto }>(`/api/properties/${propertyId}/surveys`, input)).data;

/** Records a survey; the property's results refetch. */
export function useCreateSurvey(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createSurvey, onSuccess: () => qc.invalidateQueries({ queryKey: resultsKeys.property(propertyId) }) });
}
