/**
 * Take your data with you: the owner's whole-firm zip, built by a background job into storage
 * (folder "exports/"), downloadable by the firm's owner only.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE firm_exports (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      requested_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      job_id UUID,
      status TEXT NOT NULL DEFAULT 'building' CHECK (status IN ('building', 'ready', 'failed')),
      storage_key TEXT,
      byte_size BIGINT,
      file_count INTEGER,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      finished_at TIMESTAMPTZ
    )`);
  await qi.sequelize.query('CREATE INDEX firm_exports_firm_idx ON firm_exports (firm_id, created_at DESC)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS firm_exports');
};
