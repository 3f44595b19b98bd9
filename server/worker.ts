/**
 * `npm run worker`: the job workers alone, without HTTP, for deployments that keep heavy work
 * (PDFs, season reports, the storage sweep) off the app instances (then set JOB_WORKERS_IN_APP=false there).
 */
import { config } from './config';
import { logger } from './logger';
import { sequelize } from './db/sequelize';
import { startJobQueue, stopJobQueue } from './services/jobs/job-queue';
import './models';

await startJobQueue({ workers: true });
logger.info({ schema: config.jobs.schema }, 'Browseline job worker is running');

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'job worker stopping: jobs under way finish first');
  await stopJobQueue(config.shutdownGraceMs);
  await sequelize.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
