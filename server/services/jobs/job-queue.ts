/**
 * Background work in PostgreSQL (pg-boss, in its own schema): PDFs for e-mails, season reports,
 * whole-firm exports, the hourly storage sweep. A job is handed over inside the transaction of the action behind it,
 * retried with backoff, recorded in background_jobs for the firm to see (progress, last error,
 * retry), and its effect is written at most once (the row is locked and checked when finishing).
 * Workers run in the app process by default (JOB_WORKERS_IN_APP) or in `npm run worker`.
 */
import PgBoss from 'pg-boss';
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { BackgroundJob } from '../../models';
import { AppError } from '../../errors';
import { config } from '../../config';
import { logger } from '../../logger';
import type { JobKind } from '../../../shared/schemas/job';

/** What a handler gets besides its data. */
export interface JobContext {
  readonly id: string;
  /** Reports progress (0–100) and the step under way; the page that started the job polls it. */
  progress(percent: number, step: string): Promise<void>;
  /**
   * Writes the job's effect and marks it done in one transaction, under a lock on the job's row;
   * answers null (and writes nothing) when another delivery of the same job finished it already.
   */
  finish<T>(effect: (transaction: Transaction) => Promise<T>, result?: (value: T) => Record<string, unknown>): Promise<T | null>;
}

export type JobHandler = (data: Record<string, unknown>, context: JobContext) => Promise<void>;

const SWEEP_QUEUE = 'storage-sweep';
const KINDS: readonly JobKind[] = ['document-email', 'season-report', 'camera-thumbnails', 'firm-export'];
const handlers = new Map<JobKind, JobHandler>();
const workerIds = new Map<string, string>();
let boss: PgBoss | null = null;
let starting: Promise<PgBoss> | null = null;

/** Registers the function that does one kind of job (see job-handlers.ts). */
export function registerJobHandler(kind: JobKind, handler: JobHandler): void {
  handlers.set(kind, handler);
}

/** A sentence for the owner: our own errors are already sentences; anything else gets a frame. */
export function jobErrorMessage(err: unknown): string {
  if (err instanceof AppError) return err.message;
  const message = (err as Error)?.message ?? String(err);
  return `The job stopped with an error: ${message}`.slice(0, 500);
}

/** Runs one delivery of a job (the worker calls this; tests call it to deliver a job again). */
export async function deliverJob(kind: JobKind, job: Pick<PgBoss.JobWithMetadata, 'id' | 'retryCount' | 'retryLimit'>): Promise<void> {
  const handler = handlers.get(kind);
  const record = await BackgroundJob.findByPk(job.id);
  if (!record || record.status === 'done' || !handler) return;
  await record.update({ status: 'running', attempts: record.attempts + 1, lastError: null });
  const context: JobContext = {
    id: job.id,
    progress: async (percent, step) => {
      await BackgroundJob.update({ progress: Math.max(0, Math.min(99, Math.round(percent))), step }, { where: { id: job.id, status: 'running' } });
    },
    finish: (effect, result) =>
      sequelize.transaction(async (transaction) => {
        const locked = await BackgroundJob.findByPk(job.id, { transaction, lock: transaction.LOCK.UPDATE });
        if (!locked || locked.status === 'done') return null;
        const value = await effect(transaction);
        await locked.update({ status: 'done', progress: 100, step: null, lastError: null, finishedAt: new Date(), result: result ? result(value) : null }, { transaction });
        return value;
      }),
  };
  try {
    await handler(record.data, context);
    await BackgroundJob.update({ status: 'done', progress: 100, step: null, finishedAt: new Date() }, { where: { id: job.id, status: 'running' } });
  } catch (err) {
    const last = job.retryCount >= job.retryLimit;
    logger.warn({ jobId: job.id, kind, attempt: job.retryCount + 1, err: (err as Error).message }, last ? 'job failed' : 'job failed; it will be retried');
    await BackgroundJob.update({ status: last ? 'failed' : 'retrying', step: null, lastError: jobErrorMessage(err), finishedAt: last ? new Date() : null }, { where: { id: job.id } }).catch(() => undefined);
    throw err;
  }
}

/** Starts the queue (installing its schema when migrations run at start); with workers, also takes jobs. */
export async function startJobQueue(options: { workers?: boolean; install?: boolean } = {}): Promise<PgBoss> {
  if (boss) return boss;
  if (starting) return starting;
  const workers = options.workers ?? config.jobs.workersInApp;
  starting = (async () => {
    const b = new PgBoss({
      connectionString: config.databaseUrl,
      schema: config.jobs.schema,
      application_name: 'browseline-jobs',
      max: 4,
      migrate: options.install ?? config.migrateOnStart,
      supervise: workers,
      schedule: workers,
    });
    // A database outage must not crash the app: pg-boss reports it here and keeps trying.
    b.on('error', (err) => logger.error({ err }, 'job queue error'));
    await b.start();
    for (const kind of KINDS) await b.createQueue(kind, { name: kind, retryLimit: 5, retryDelay: 5, retryBackoff: true, expireInSeconds: 15 * 60 });
    await b.createQueue(SWEEP_QUEUE, { name: SWEEP_QUEUE, policy: 'singleton', retryLimit: 2 });
    if (workers) {
      const { registerJobHandlers } = await import('./job-handlers');
      registerJobHandlers();
      for (const kind of KINDS) {
        workerIds.set(kind, await b.work<Record<string, unknown>>(kind, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: config.jobs.pollSeconds }, ([job]) => deliverJob(kind, job)));
      }
      // The hourly sweep of orphaned files; never in tests, whose database does not know the files
      // a development server keeps in the same default folder.
      if (!config.isTest) {
        const { sweepOrphanFiles } = await import('../storage/orphan-sweeper');
        await b.schedule(SWEEP_QUEUE, '17 * * * *');
        await b.work(SWEEP_QUEUE, { pollingIntervalSeconds: 30 }, async () => {
          await sweepOrphanFiles();
        });
      }
    }
    boss = b;
    return b;
  })();
  try {
    return await starting;
  } finally {
    starting = null;
  }
}

/** Stops taking jobs; with graceful, waits (up to timeoutMs) for jobs under way to finish. */
export async function stopJobQueue(timeoutMs = config.shutdownGraceMs): Promise<void> {
  const b = boss ?? (starting ? await starting.catch(() => null) : null);
  boss = null;
  workerIds.clear();
  if (!b) return;
  await b.stop({ graceful: true, timeout: timeoutMs, wait: true }).catch((err) => logger.warn({ err }, 'job queue stopped with an error'));
}

export interface EnqueueJobInput {
  kind: JobKind;
  firmId: number;
  createdById: number | null;
  title: string;
  subject?: { type: string; id: number };
  data: Record<string, unknown>;
  /** Retries after the first try (default 5, with exponential backoff). */
  retryLimit?: number;
}

/**
 * Hands a job to the queue inside the caller's transaction (the job exists only if the action
 * commits) and records it for the firm. In-process workers are woken after the commit.
 */
export async function enqueueJob(input: EnqueueJobInput, transaction: Transaction): Promise<BackgroundJob> {
  const b = await startJobQueue();
  const id = crypto.randomUUID();
  const record = await BackgroundJob.create(
    { id, firmId: input.firmId, kind: input.kind, title: input.title, subjectType: input.subject?.type ?? null, subjectId: input.subject?.id ?? null, data: input.data, result: null, lastError: null, createdById: input.createdById, finishedAt: null, step: null },
    { transaction },
  );
  const connection = (transaction as unknown as { connection: { query(text: string, values: unknown[]): Promise<{ rows: unknown[] }> } }).connection;
  await b.send(input.kind, { firmId: input.firmId }, { id, ...(input.retryLimit === undefined ? {} : { retryLimit: input.retryLimit }), db: { executeSql: (text, values) => connection.query(text, values) as Promise<{ rows: unknown[] }> } });
  transaction.afterCommit(() => wakeWorker(input.kind));
  return record;
}

function wakeWorker(kind: string): void {
  const workerId = workerIds.get(kind);
  if (boss && workerId) boss.notifyWorker(workerId);
}

/** Sends a failed job round again (the retry button); answers the job's row. */
export async function retryJob(job: BackgroundJob): Promise<BackgroundJob> {
  const b = await startJobQueue();
  await b.retry(job.kind, job.id);
  await job.update({ status: 'queued', progress: 0, step: null, lastError: null, finishedAt: null });
  wakeWorker(job.kind);
  return job;
}

/**
 * Waits until a job is done or failed, or the time is up, and answers its row. Lets a request that
 * started a job keep its old answer when the job is quick, and answer 202 with the job when not.
 */
export async function waitForJob(id: string, timeoutMs = config.jobs.waitMs): Promise<BackgroundJob | null> {
  const deadline = Date.now() + timeoutMs;
  for (let pause = 25; ; pause = Math.min(250, pause * 2)) {
    const job = await BackgroundJob.findByPk(id);
    if (!job || job.status === 'done' || job.status === 'failed' || Date.now() >= deadline) return job;
    await new Promise((resolve) => setTimeout(resolve, Math.min(pause, Math.max(0, deadline - Date.now()))));
  }
}
