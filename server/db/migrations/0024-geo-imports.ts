/**
 * Imports waiting to be saved: the full geometries of the features an uploaded file held, in the
 * order of their preview, so the preview sent to the browser can stay small. Kept for a day.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE geo_imports (
      id UUID PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      format TEXT NOT NULL,
      feature_count INTEGER NOT NULL CHECK (feature_count >= 0),
      geometries JSON NOT NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await qi.sequelize.query('CREATE INDEX geo_imports_created_idx ON geo_imports (created_at)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS geo_imports');
};
