/** Applies pending migrations (on MIGRATION_DATABASE_URL, a direct connection) and installs the job queue's schema. */
import { migrateUp } from '../db/migrator';
import { sequelize } from '../db/sequelize';
import { startJobQueue, stopJobQueue } from '../services/jobs/job-queue';

const applied = await migrateUp();
console.log(applied.length ? `migrated: ${applied.join(', ')}` : 'migrations: up to date');
await startJobQueue({ workers: false, install: true });
await stopJobQueue();
await sequelize.close();
