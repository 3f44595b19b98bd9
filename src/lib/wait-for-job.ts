/** Polls a background job (GET /api/jobs/:id) until it is done or failed, reporting its progress. */
import { getData } from './api-client';
import type { JobDto } from '../../shared/schemas/job';

/** Resolves with the finished job; rejects with the job's error when it failed. */
export async function waitForJob(id: string, onProgress?: (job: JobDto) => void, intervalMs = 1000): Promise<JobDto> {
  for (;;) {
    const job = await getData<JobDto>(`/api/jobs/${id}`);
    onProgress?.(job);
    if (job.status === 'done') return job;
    if (job.status === 'failed') throw new Error(job.lastError ?? 'The job failed. Try again from Settings · Team → Background work.');
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
}
