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

/** Drops and creates a database on the test cluster; answers its URL. */
export async function freshDatabase(name: string): Promise<string> {
  const admin = new pg.Client({ connectionString: `postgres://postgres@127.0.0.1:${TEST_DB_PORT}/postgres` });
  await admin.connect();
  try {
    await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${name}`);
  } finally {
    await admin.end();
  }
  return `postgres://postgres@127.0.0.1:${TEST_DB_PORT}/${name}`;
}
