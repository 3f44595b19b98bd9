import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, getData } from '../../../lib/api-client';
import type { JobDto } from '../../../../shared/schemas/job';

export const jobsKeys = { all: ['jobs'] as const, list: () => ['jobs', 'list'] as const };

/** The firm's recent background jobs, newest first. */
export const getJobs = () => getData<JobDto[]>('/api/jobs?limit=20');

export const getJobsQueryOptions = () => ({ queryKey: jobsKeys.list(), queryFn: getJobs });

/** Recent jobs; refreshed while any is still under way. */
export const useJobs = () =>
  useQuery({ ...getJobsQueryOptions(), refetchInterval: (q) => (q.state.data?.some((j) => j.status === 'queued' || j.status === 'running' || j.status === 'retrying') ? 2000 : false) });

/** Sends a failed job round again. */
export const retryJob = async (id: string) => (await api.post<{ data: JobDto }>(`/api/jobs/${id}/retry`)).data;

export function useRetryJob() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: retryJob, onSuccess: () => qc.invalidateQueries({ queryKey: jobsKeys.all }) });
}
