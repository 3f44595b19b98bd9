/**
 * Background jobs (pg-boss, the worker in this process): the PDF and e-mail of a sent proposal,
 * written once however often the job is delivered; a failed job with its error and a retry; the
 * season report made by a job whose progress the page polls (202 when it takes longer than the wait).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedInAgent, type Agent, propertyWithBrassicaPlot } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';

import { OutboxMessage } from '../../server/models';
import { sequelize } from '../../server/db/sequelize';
import { config } from '../../server/config';
import { deliverJob, enqueueJob, startJobQueue, waitForJob } from '../../server/services/jobs/job-queue';
import { JobDtoSchema } from '../../shared/schemas/job';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let owner: Agent;
let consultant: Agent;
let propertyId: number;

const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown = {}) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

beforeAll(async () => {
  ctx = await makeFirm();
  owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  propertyId = (await propertyWithBrassicaPlot(consultant, ctx.firm.id, ctx.client.id)).propertyId;
});

describe('the PDF and e-mail of a sent proposal', () => {
  it('is a job that finishes before the answer, and delivering it again writes no second e-mail', async () => {
    const draft = await send(consultant, 'post', `/api/properties/${propertyId}/proposals`, { taxRatePct: 5.5, depositPct: 30 });
    expect(draft.status).toBe(201);
    const sent = await send(consultant, 'post', `/api/proposals/${draft.body.data.id}/send`);
    expect(sent.status).toBe(200);
    const job = JobDtoSchema.parse(sent.body.job);
    expect(job).toMatchObject({ kind: 'document-email', status: 'done', progress: 100, subjectType: 'Proposal', subjectId: draft.body.data.id, attempts: 1 });
    const mails = () => OutboxMessage.count({ where: { kind: 'proposal-sent', firmId: ctx.firm.id } });
    expect(await mails()).toBe(1);

    // A new job for the same document, delivered three times at once besides the worker's own
    // delivery (a redelivery after a lost acknowledgement, or on another instance): one e-mail more.
    const again = await sequelize.transaction((transaction) =>
      enqueueJob({ kind: 'document-email', firmId: ctx.firm.id, createdById: null, title: 'Again', data: { document: 'proposal', id: draft.body.data.id, firmId: ctx.firm.id, recipients: [ctx.users.client.email], consultantName: 'Test' } }, transaction),
    );
    await Promise.all([0, 1, 2].map(() => deliverJob('document-email', { id: again.id, retryCount: 0, retryLimit: 5 })));
    expect((await waitForJob(again.id, 15_000))!.status).toBe('done');
    expect(await mails()).toBe(2);
    // A delivery of a finished job does nothing.
    await deliverJob('document-email', { id: job.id, retryCount: 0, retryLimit: 5 });
    expect(await mails()).toBe(2);
    // Only a failed job can be retried.
    expect((await send(consultant, 'post', `/api/jobs/${job.id}/retry`)).status).toBe(409);
  });
});

describe('a job that fails', () => {
  it('shows the owner its error and goes round again with the retry button', async () => {
    // A proposal that does not exist: the handler refuses with a sentence, and no retries are left.
    const job = await sequelize.transaction((transaction) =>
      enqueueJob({ kind: 'document-email', firmId: ctx.firm.id, createdById: ctx.users.owner.id, title: 'E-mail a missing proposal', data: { document: 'proposal', id: 987_654, firmId: ctx.firm.id, recipients: ['nobody@browseline.test'], consultantName: 'Test' }, retryLimit: 0 }, transaction),
    );
    expect((await waitForJob(job.id, 15_000))!.status).toBe('failed');

    const failed = await owner.get('/api/jobs?status=failed');
    expect(failed.status).toBe(200);
    const shown = failed.body.data.find((j: { id: string }) => j.id === job.id);
    expect(shown).toMatchObject({ status: 'failed', lastError: 'That proposal was not found.', attempts: 1 });
    expect((await owner.get(`/api/jobs/${job.id}`)).body.data.lastError).toBe('That proposal was not found.');
    expect((await owner.get('/api/jobs?status=sideways')).status).toBe(422);

    const stranger = await signedInAgent((await makeFirm()).users.owner.email, PASSWORD);
    expect((await stranger.get(`/api/jobs/${job.id}`)).status).toBe(404);
    expect((await send(stranger, 'post', `/api/jobs/${job.id}/retry`)).status).toBe(404);

    const retried = await send(owner, 'post', `/api/jobs/${job.id}/retry`);
    expect(retried.status).toBe(200);
    expect(retried.body.data).toMatchObject({ status: 'queued', lastError: null });
    const again = await waitForJob(job.id, 15_000);
    expect(again).toMatchObject({ status: 'failed', attempts: 2 });
  });
});

describe('the queue', () => {
  it('survives an error from its database connection (logged, never thrown)', async () => {
    const queue = await startJobQueue();
    // An EventEmitter 'error' without a listener throws and, in a server, ends the process.
    expect(() => queue.emit('error', new Error('Connection terminated unexpectedly'))).not.toThrow();
  });
});

describe('the season report', () => {
  it('answers 202 with the job when it takes longer than the wait; the page polls it to done', async () => {
    const jobs = config.jobs as { waitMs: number };
    const wait = jobs.waitMs;
    jobs.waitMs = 0;
    try {
      // A season with nothing in it makes no report; one harvest gives it something to say.
      expect((await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, { date: '2024-10-05', sex: 'male', ageClass: '1.5' })).status).toBe(201);
      const made = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2024 });
      expect(made.status).toBe(202);
      const job = JobDtoSchema.parse(made.body.job);
      expect(job.kind).toBe('season-report');
      await waitForJob(job.id, 30_000);
      const polled = await consultant.get(`/api/jobs/${job.id}`);
      expect(polled.body.data).toMatchObject({ status: 'done', progress: 100, step: null });
      const reportId = polled.body.data.result.seasonReportId as number;
      const list = await consultant.get(`/api/properties/${propertyId}/season-reports`);
      expect(list.body.data.map((r: { id: number }) => r.id)).toContain(reportId);
    } finally {
      jobs.waitMs = wait;
    }
  });
});
