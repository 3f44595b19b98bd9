/**
 * Background jobs the firm can see: one row per job handed to the queue (pg-boss, in its own
 * schema), with its state, progress and last error, so a failed job shows with a retry button.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE background_jobs (
      id UUID PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      kind TEXT NOT NULL,
      status TEXT NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'retrying', 'failed', 'done')),
      progress INTEGER NOT NULL DEFAULT 0 CHECK (progress BETWEEN 0 AND 100),
      step TEXT,
      title TEXT NOT NULL,
      subject_type TEXT,
      subject_id INTEGER,
      data JSONB NOT NULL DEFAULT '{}'::jsonb,
      result JSONB,
      attempts INTEGER NOT NULL DEFAULT 0,
      last_error TEXT,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      finished_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await qi.sequelize.query(`CREATE INDEX background_jobs_firm_created ON background_jobs (firm_id, created_at DESC)`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS background_jobs`);
};
