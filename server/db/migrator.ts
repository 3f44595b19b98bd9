/** umzug over the Sequelize connection; the schema comes from migrations only, never sync(). */
import { Umzug, SequelizeStorage, type MigrationFn as UmzugMigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';
import { sequelize } from './sequelize';
import pg from 'pg';
import { migrations } from './migrations';
import { config } from '../config';

export type MigrationFn = UmzugMigrationFn<QueryInterface>;

/** A migrator over the listed migrations, tracked in the SequelizeMeta table. */
export function createMigrator() {
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

/** Applies every pending migration under an advisory lock, so two instances never race. */
export async function migrateUp(): Promise<string[]> {
  // The lock lives on its own connection: a pooled query could unlock on another one.
  const lockClient = new pg.Client({ connectionString: config.databaseUrl });
  await lockClient.connect();
  try {
    await lockClient.query('SELECT pg_advisory_lock(7260410)');
    const done = await createMigrator().up();
    // A fresh database gets PostGIS from the first migration: reload the type ids this process
    // cached before, or geometry columns read back as raw WKB in the same process (the seed).
    if (done.length > 0) await (sequelize.connectionManager as unknown as { _refreshDynamicOIDs(): Promise<void> })._refreshDynamicOIDs();
    return done.map((m) => m.name);
  } finally {
    await lockClient.query('SELECT pg_advisory_unlock(7260410)').catch(() => undefined);
    await lockClient.end();
  }
}
