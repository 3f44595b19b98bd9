/**
 * umzug over a dedicated one-connection Sequelize; the schema comes from migrations only, never sync().
 * Each migration runs in its own transaction together with its row in SequelizeMeta, so a failed
 * migration leaves nothing half-done. A migration that cannot run in a transaction (CREATE INDEX
 * CONCURRENTLY) exports `transaction = false`.
 */
import { Umzug, type MigrationFn as UmzugMigrationFn, type UmzugStorage } from 'umzug';
import { Sequelize, QueryTypes, type QueryInterface } from 'sequelize';
import pg from 'pg';
import { sequelize } from './sequelize';
import { migrations as listed } from './migrations';
import { config } from '../config';

export type MigrationFn = UmzugMigrationFn<QueryInterface>;

export interface MigrationDefinition {
  name: string;
  up: MigrationFn;
  down?: MigrationFn;
  /** false for a migration that must run outside a transaction. */
  transaction?: boolean;
}

export interface MigratorOptions {
  migrations?: readonly MigrationDefinition[];
  /** The connection the migrations use (default: a new one-connection pool on MIGRATION_DATABASE_URL). */
  connection?: Sequelize;
  metaTable?: string;
}

/** A one-connection Sequelize for migrations, so BEGIN, the migration and COMMIT share one session. */
export function migrationConnection(url = config.migrationDatabaseUrl): Sequelize {
  return new Sequelize(url, { dialect: 'postgres', logging: false, define: { underscored: true }, pool: { max: 1, min: 0, idle: 600_000, acquire: 60_000 } });
}

function metaStorage(db: Sequelize, table: string): UmzugStorage {
  const ensure = () => db.query(`CREATE TABLE IF NOT EXISTS "${table}" (name VARCHAR(255) NOT NULL PRIMARY KEY)`);
  return {
    async executed() {
      await ensure();
      const rows = await db.query<{ name: string }>(`SELECT name FROM "${table}" ORDER BY name`, { type: QueryTypes.SELECT });
      return rows.map((r) => r.name);
    },
    // The row is written inside the migration's own transaction (below).
    async logMigration() {},
    async unlogMigration({ name }) {
      await db.query(`DELETE FROM "${table}" WHERE name = $1`, { bind: [name] });
    },
  };
}

function inTransaction(db: Sequelize, table: string, m: MigrationDefinition, direction: 'up' | 'down') {
  return async (params: Parameters<MigrationFn>[0]) => {
    const step = direction === 'up' ? m.up : m.down;
    if (!step) throw new Error(`migration ${m.name} has no ${direction}`);
    const record = () =>
      direction === 'up'
        ? db.query(`INSERT INTO "${table}" (name) VALUES ($1) ON CONFLICT DO NOTHING`, { bind: [m.name] })
        : db.query(`DELETE FROM "${table}" WHERE name = $1`, { bind: [m.name] });
    if (m.transaction === false) {
      await step(params);
      await record();
      return;
    }
    await db.query('BEGIN');
    try {
      await step(params);
      await record();
      await db.query('COMMIT');
    } catch (err) {
      await db.query('ROLLBACK').catch(() => undefined);
      throw err;
    }
  };
}

/** A migrator over the listed migrations, tracked in the SequelizeMeta table. */
export function createMigrator(options: MigratorOptions = {}) {
  const db = options.connection ?? migrationConnection();
  const table = options.metaTable ?? 'SequelizeMeta';
  return new Umzug({
    migrations: (options.migrations ?? listed).map((m) => ({ name: m.name, up: inTransaction(db, table, m, 'up'), down: inTransaction(db, table, m, 'down') })),
    context: db.getQueryInterface(),
    storage: metaStorage(db, table),
    logger: undefined,
  });
}

/** Applies every pending migration under an advisory lock, so two instances never race. */
export async function migrateUp(): Promise<string[]> {
  // The lock lives on its own connection: a pooled query could unlock on another one. Migrations
  // need a direct connection (not PgBouncer in transaction mode) for this session lock.
  const lockClient = new pg.Client({ connectionString: config.migrationDatabaseUrl });
  await lockClient.connect();
  const db = migrationConnection();
  try {
    await lockClient.query('SELECT pg_advisory_lock(7260410)');
    const done = await createMigrator({ connection: db }).up();
    // A fresh database gets PostGIS from the first migration: reload the type ids this process
    // cached before, or geometry columns read back as raw WKB in the same process (the seed).
    if (done.length > 0) await (sequelize.connectionManager as unknown as { _refreshDynamicOIDs(): Promise<void> })._refreshDynamicOIDs();
    return done.map((m) => m.name);
  } finally {
    await db.close().catch(() => undefined);
    await lockClient.query('SELECT pg_advisory_unlock(7260410)').catch(() => undefined);
    await lockClient.end();
  }
}
