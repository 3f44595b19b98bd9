import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { FirmExportDto } from '../../../../shared/schemas/firm-export';

/** The firm's latest whole-firm exports, newest first (owner only). */
export const getFirmExports = (signal?: AbortSignal) => getData<FirmExportDto[]>('/api/firm-exports', signal);

export const getFirmExportsQueryOptions = () => queryOptions({ queryKey: ['firm-exports'], queryFn: ({ signal }) => getFirmExports(signal) });

/** The exports; polled every second while one is being built, so its progress moves. */
export const useFirmExports = () =>
  useQuery({ ...getFirmExportsQueryOptions(), refetchInterval: (q) => (q.state.data?.some((e) => e.status === 'building') ? 1000 : false) });

/** Starts a new export of the whole firm. */
export const createFirmExport = async () => (await api.post<{ data: FirmExportDto }>('/api/firm-exports')).data;

export function useCreateFirmExport() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createFirmExport, onSuccess: () => qc.invalidateQueries({ queryKey: ['firm-exports'] }) });
}
