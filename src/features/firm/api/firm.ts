import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { FirmDto, FirmProfileUpdateInput, FirmSettingsUpdateInput } from '../../../../shared/schemas/firm';

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

/** Saves the firm's profile (PATCH /api/firm). */
export function useUpdateFirmProfile() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: FirmProfileUpdateInput) => api.patch<{ data: FirmDto }>('/api/firm', input),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: ['firm'] });
      await qc.invalidateQueries({ queryKey: ['auth', 'me'] });
    },
  });
}

/** Uploads a new logo (PNG or JPEG) for the firm's documents. */
export function useUploadFirmLogo() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return api.upload<{ data: FirmDto }>('/api/firm/logo', form);
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: ['firm'] }),
  });
}
