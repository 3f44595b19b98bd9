import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { WindRecordDto } from '../../../../shared/schemas/hunting';
import { huntingKeys } from './keys';

export const getWindRecordQueryOptions = (propertyId: number) =>
  queryOptions({ queryKey: huntingKeys.windRecord(propertyId), queryFn: ({ signal }) => getData<WindRecordDto | null>(`/api/properties/${propertyId}/wind-record`, signal) });

/** The property's wind record (rose and hours), or null. */
export const useWindRecord = (propertyId: number) => useQuery({ ...getWindRecordQueryOptions(propertyId), enabled: propertyId > 0 });

/** Uploads a wind file (CSV or ISD-Lite) with the months and hours that matter (staff). */
export const useUploadWindRecord = (propertyId: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { file: File; months: string; hours: 'hunting' | 'all' }) => {
      const form = new FormData();
      form.append('months', input.months);
      form.append('hours', input.hours);
      form.append('file', input.file);
      return api.upload<{ data: WindRecordDto }>(`/api/properties/${propertyId}/wind-record`, form);
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: huntingKeys.all }),
  });
};
