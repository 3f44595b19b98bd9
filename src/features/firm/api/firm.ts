import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { FirmDto, FirmSettingsUpdateInput } from '../../../../shared/schemas/firm';

export const getFirmQueryOptions = () => queryOptions({ queryKey: ['firm'], queryFn: () => getData<FirmDto>('/api/firm') });
export const useFirm = () => useQuery(getFirmQueryOptions());

export function useUpdateFirmSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: FirmSettingsUpdateInput) => api.patch<{ data: FirmDto }>('/api/firm/settings', input),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: ['firm'] });
      // The firm's time zone travels with the signed-in user; every page's "today" follows it.
      await qc.invalidateQueries({ queryKey: ['auth', 'me'] });
    },
  });
}
