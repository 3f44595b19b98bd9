/** Starts the HTTP server and the outbox worker. */
import { createApp, closeSessionPool } from './app';
import { config, configurationProblems } from './config';
import { logger } from './logger';
import { migrateUp } from './db/migrator';
import { sequelize } from './db/sequelize';
import { startOutboxWorker } from './services/mail/outbox';
import { startReminderJob } from './commands/reminder-sender';

const problems = configurationProblems(config);
if (problems.length) {
  for (const problem of problems) logger.fatal(problem);
  process.exit(1);
}

if (process.env.MIGRATE_ON_START !== 'false') {
  const applied = await migrateUp();
  if (applied.length) logger.info({ applied }, 'migrations applied');
}

const app = createApp();
const server = app.listen(config.port, config.host, () => {
  logger.info({ url: `http://${config.host}:${config.port}`, env: config.env }, 'Browseline is listening');
});
const stopOutbox = startOutboxWorker();
const stopReminders = startReminderJob();

async function shutdown(signal: string) {
  logger.info({ signal }, 'shutting down');
  stopOutbox();
  stopReminders();
  server.close();
  await closeSessionPool().catch(() => undefined);
  await sequelize.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
