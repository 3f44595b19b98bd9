/** Field observations (sign on the ground) with their photos, and the consultant's switch that lets a client's contacts log them. */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`
    CREATE TABLE observations (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      kind TEXT NOT NULL,
      observed_at TIMESTAMPTZ NOT NULL,
      notes TEXT,
      position geometry(Point, 4326) NOT NULL,
      position_source TEXT NOT NULL CHECK (position_source IN ('device','photo','map')),
      inside_boundary BOOLEAN NOT NULL,
      idempotency_key TEXT NOT NULL,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (firm_id, idempotency_key)
    )`);
  await q('CREATE INDEX observations_property_idx ON observations (property_id, observed_at)');
  await q('CREATE INDEX observations_position_gist ON observations USING gist (position)');
  await q(`
    CREATE TABLE observation_photos (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      observation_id INTEGER NOT NULL REFERENCES observations(id) ON DELETE CASCADE,
      storage_key TEXT NOT NULL,
      thumbnail_key TEXT,
      original_name TEXT,
      content_type TEXT NOT NULL,
      byte_size INTEGER NOT NULL,
      width INTEGER,
      height INTEGER,
      sha256 TEXT NOT NULL,
      taken_at TIMESTAMPTZ,
      latitude DOUBLE PRECISION,
      longitude DOUBLE PRECISION,
      exif_problems JSONB NOT NULL DEFAULT '[]'::jsonb,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await q('CREATE INDEX observation_photos_observation_idx ON observation_photos (observation_id)');
  await q('ALTER TABLE clients ADD COLUMN portal_observations_allowed BOOLEAN NOT NULL DEFAULT false');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE clients DROP COLUMN IF EXISTS portal_observations_allowed');
  for (const t of ['observation_photos', 'observations']) await qi.sequelize.query(`DROP TABLE IF EXISTS ${t}`);
};
