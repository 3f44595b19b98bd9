/**
 * Background jobs of the firm: the list (failed ones with their error), one job's progress (polled by
 * the page that started it) and the retry button. Staff only; always scoped to the firm.
 */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { actor } from '../policies/firm-scope';
import { BackgroundJob } from '../models';
import { conflict, notFound } from '../errors';
import { presentJob } from '../presenters/job';
import { retryJob } from '../services/jobs/job-queue';
import { JobIdParamsSchema, JobListQuerySchema } from '../../shared/schemas/job';

const r = defineRoutes('/jobs');

async function jobInFirm(id: string, firmId: number): Promise<BackgroundJob> {
  const job = await BackgroundJob.findOne({ where: { id, firmId } });
  if (!job) throw notFound('That job');
  return job;
}

r.get('/', STAFF, ...typed({ query: JobListQuerySchema }, async ({ query }, req, res) => {
  const jobs = await BackgroundJob.findAll({ where: { firmId: actor(req).firmId, ...(query.status ? { status: query.status } : {}) }, order: [['createdAt', 'DESC']], limit: query.limit });
  res.json({ data: jobs.map(presentJob) });
}));

r.get('/:id', STAFF, ...typed({ params: JobIdParamsSchema }, async ({ params }, req, res) => {
  res.setHeader('Cache-Control', 'no-store');
  res.json({ data: presentJob(await jobInFirm(String(params.id), actor(req).firmId)) });
}));

r.post('/:id/retry', STAFF, ...typed({ params: JobIdParamsSchema }, async ({ params }, req, res) => {
  const job = await jobInFirm(String(params.id), actor(req).firmId);
  if (job.status !== 'failed') throw conflict(`This job is ${job.status}; only a failed job can be retried.`);
  res.json({ data: presentJob(await retryJob(job)) });
}));

export const jobsRouter = r.router;
