/** Background jobs as the API shows them (GET /api/jobs, GET /api/jobs/:id) and their query. */
import { z } from 'zod';

export const JOB_KINDS = ['document-email', 'season-report', 'camera-thumbnails', 'firm-export'] as const;
export type JobKind = (typeof JOB_KINDS)[number];

export const JOB_STATUSES = ['queued', 'running', 'retrying', 'failed', 'done'] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

export const JobIdParamsSchema = z.object({ id: z.uuid({ message: 'that is not a job id' }) });

export const JobListQuerySchema = z.object({
  status: z.enum(JOB_STATUSES, { message: `status: choose one of ${JOB_STATUSES.join(', ')}` }).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});
export type JobListQuery = z.infer<typeof JobListQuerySchema>;

export const JobDtoSchema = z.object({
  id: z.string(),
  kind: z.enum(JOB_KINDS),
  title: z.string(),
  status: z.enum(JOB_STATUSES),
  progress: z.number().int().min(0).max(100),
  step: z.string().nullable(),
  subjectType: z.string().nullable(),
  subjectId: z.number().int().nullable(),
  result: z.record(z.string(), z.unknown()).nullable(),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type JobDto = z.infer<typeof JobDtoSchema>;
