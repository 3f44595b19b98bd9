/** Starts the HTTP server, the outbox and reminder pollers and (by default) the job workers. */
import { createApp, closeSessionPool } from './app';
import { config, configurationProblems } from './config';
import { logger } from './logger';
import { migrateUp } from './db/migrator';
import { sequelize } from './db/sequelize';
import { startOutboxWorker } from './services/mail/outbox';
import { startReminderJob } from './commands/reminder-sender';
import { startJobQueue, stopJobQueue } from './services/jobs/job-queue';
import { beginDraining, closeServerGracefully } from './lifecycle';
import { warmGeoWorkers } from './services/geo-work/geo-pool';
import { closePdfWorkers, warmPdfWorkers } from './services/documents/pdf-pool';
import { closePasswordWorkers, warmPasswordWorkers } from './services/auth/passwords';

const problems = configurationProblems(config);
if (problems.length) {
  for (const problem of problems) logger.fatal(problem);
  process.exit(1);
}

if (config.migrateOnStart) {
  const applied = await migrateUp();
  if (applied.length) logger.info({ applied }, 'migrations applied');
}

const app = createApp();
warmGeoWorkers(); // the first upload does not wait for a worker thread to start
const server = app.listen(config.port, config.host, () => {
  logger.info({ url: `http://${config.host}:${config.port}`, env: config.env }, 'Browseline is listening');
});
warmPdfWorkers();
warmPasswordWorkers(); // the first sign-in does not wait for its worker thread to start
const stopOutbox = startOutboxWorker();
const stopReminders = startReminderJob();
// The queue starts in the background: a database outage at boot is logged, never a crash.
startJobQueue().catch((err) => logger.error({ err }, 'job queue did not start; jobs wait until it does'));

let stopping = false;
/**
 * SIGTERM: health answers 503 at once, requests in flight finish (up to SHUTDOWN_GRACE_MS), jobs
 * under way finish or go back to the queue, and only then do the pools close.
 */
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down: draining requests in flight');
  beginDraining();
  stopOutbox();
  stopReminders();
  const { timedOut } = await closeServerGracefully(server, config.shutdownGraceMs);
  if (timedOut) logger.warn({ graceMs: config.shutdownGraceMs }, 'requests still in flight were cut at the shutdown limit');
  await stopJobQueue(config.shutdownGraceMs);
  await closePdfWorkers().catch(() => undefined);
  await closePasswordWorkers().catch(() => undefined);
  await closeSessionPool().catch(() => undefined);
  await sequelize.close().catch(() => undefined);
  logger.info('stopped');
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
