/** Applies pending migrations to DATABASE_URL. */
import { migrateUp } from '../db/migrator';
import { sequelize } from '../db/sequelize';

const applied = await migrateUp();
console.log(applied.length ? `migrated: ${applied.join(', ')}` : 'migrations: up to date');
await sequelize.close();
