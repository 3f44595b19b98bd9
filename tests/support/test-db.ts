/** The test cluster (fsync off) and fresh databases on it. */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';

const root = path.resolve(import.meta.dirname, '../..');
export const TEST_DB_PORT = Number(process.env.TEST_DB_PORT ?? 54330);

/** Starts the test PostgreSQL cluster when it is not running (installs PostGIS when missing). */
export function startTestCluster(): void {
  execFileSync('bash', [path.join(root, 'server/scripts/db.sh'), 'start', 'test'], { stdio: ['ignore', 'ignore', 'inherit'] });
}

/**
 * This run's suffix for database names: the process id and a random part, so two runs on one
 * machine (two worktrees, a bench beside the suite) never share or drop each other's database.
 */
export const RUN_SUFFIX = `${process.pid}_${Math.random().toString(36).slice(2, 8)}`;

/** A database name unique to this run: `name` (lower-case letters, digits, `_`) plus {@link RUN_SUFFIX}. */
export function runDatabaseName(name: string): string {
  if (!/^[a-z][a-z0-9_]*$/.test(name)) throw new Error(`Not a plain database name: ${name}`);
  return `${name}_${RUN_SUFFIX}`.slice(0, 63);
}

async function withAdmin<T>(work: (admin: pg.Client) => Promise<T>): Promise<T> {
  const admin = new pg.Client({ connectionString: `postgres://postgres@127.0.0.1:${TEST_DB_PORT}/postgres` });
  await admin.connect();
  try {
    return await work(admin);
  } finally {
    await admin.end();
  }
}

/** Creates a database unique to this run (see {@link runDatabaseName}) on the test cluster; answers its URL. */
export async function freshDatabase(name: string): Promise<string> {
  const unique = runDatabaseName(name);
  await withAdmin(async (admin) => {
    await admin.query(`DROP DATABASE IF EXISTS ${unique} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${unique}`);
  });
  return `postgres://postgres@127.0.0.1:${TEST_DB_PORT}/${unique}`;
}

/** Drops a database made by {@link freshDatabase} (by its URL); a cluster already gone is not an error. */
export async function dropDatabase(url: string): Promise<void> {
  const name = new URL(url).pathname.slice(1);
  if (!/^[a-z][a-z0-9_]*$/.test(name)) throw new Error(`Not a plain database name: ${name}`);
  try {
    await withAdmin((admin) => admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
  } catch (error) {
    if ((error as { code?: string }).code !== 'ECONNREFUSED') throw error;
  }
}
