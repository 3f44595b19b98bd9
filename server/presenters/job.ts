import type { BackgroundJob } from '../models';
import type { JobDto } from '../../shared/schemas/job';

/** A background job as the API shows it (no input data: it may hold addresses). */
export function presentJob(job: BackgroundJob): JobDto {
  return {
    id: job.id,
    kind: job.kind,
    title: job.title,
    status: job.status,
    progress: job.progress,
    step: job.step,
    subjectType: job.subjectType,
    subjectId: job.subjectId,
    result: job.result,
    attempts: job.attempts,
    lastError: job.lastError,
    createdAt: job.createdAt.toISOString(),
    finishedAt: job.finishedAt ? job.finishedAt.toISOString() : null,
  };
}
