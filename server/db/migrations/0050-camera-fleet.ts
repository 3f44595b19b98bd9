/**
 * The camera fleet: cameras, their deployments at camera-site units, card pulls, the photos of a
 * card (content hash unique per deployment, so a card sent twice adds nothing) and the buck roster.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE cameras (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      label TEXT NOT NULL,
      serial TEXT,
      retired_at TIMESTAMPTZ,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (firm_id, label)
    );
    CREATE TABLE camera_deployments (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      camera_id INTEGER NOT NULL REFERENCES cameras(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      unit_id INTEGER NOT NULL REFERENCES units(id) ON DELETE RESTRICT,
      started_on DATE NOT NULL,
      ended_on DATE,
      mode TEXT NOT NULL CHECK (mode IN ('photo','video','hybrid')),
      notes TEXT,
      clock_offset_seconds INTEGER NOT NULL DEFAULT 0,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CHECK (ended_on IS NULL OR ended_on >= started_on)
    );
    CREATE UNIQUE INDEX camera_deployments_one_running ON camera_deployments (camera_id) WHERE ended_on IS NULL;
    CREATE INDEX camera_deployments_property ON camera_deployments (property_id);
    CREATE INDEX camera_deployments_firm_running ON camera_deployments (firm_id) WHERE ended_on IS NULL;
    CREATE TABLE card_pulls (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      deployment_id INTEGER NOT NULL REFERENCES camera_deployments(id) ON DELETE CASCADE,
      pulled_on DATE NOT NULL,
      battery_pct INTEGER CHECK (battery_pct BETWEEN 0 AND 100),
      photo_count INTEGER CHECK (photo_count >= 0),
      notes TEXT,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE INDEX card_pulls_deployment ON card_pulls (deployment_id, pulled_on);
    CREATE TABLE bucks (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      name TEXT NOT NULL,
      notes TEXT,
      age_estimates JSONB NOT NULL DEFAULT '[]',
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (property_id, name)
    );
    CREATE TABLE camera_photos (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      deployment_id INTEGER NOT NULL REFERENCES camera_deployments(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      sha256 TEXT NOT NULL,
      storage_key TEXT NOT NULL,
      thumbnail_key TEXT,
      content_type TEXT NOT NULL,
      byte_size INTEGER NOT NULL,
      original_name TEXT,
      camera_time TEXT,
      camera_offset TEXT,
      taken_at TIMESTAMPTZ,
      tag TEXT CHECK (tag IN ('buck','doe','fawn','other-species','person','empty')),
      buck_id INTEGER REFERENCES bucks(id) ON DELETE SET NULL,
      featured BOOLEAN NOT NULL DEFAULT false,
      flags JSONB NOT NULL DEFAULT '[]',
      tagged_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      tagged_at TIMESTAMPTZ,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (deployment_id, sha256),
      CHECK (buck_id IS NULL OR tag = 'buck'),
      CHECK (NOT (featured AND tag = 'person'))
    );
    CREATE INDEX camera_photos_deployment_time ON camera_photos (deployment_id, taken_at);
    CREATE INDEX camera_photos_buck ON camera_photos (buck_id) WHERE buck_id IS NOT NULL;
    ALTER TABLE camera_surveys ADD COLUMN area_acres NUMERIC(14,4), ADD COLUMN from_photos JSONB;
  `);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`DROP TABLE IF EXISTS camera_photos; DROP TABLE IF EXISTS bucks; DROP TABLE IF EXISTS card_pulls; DROP TABLE IF EXISTS camera_deployments; DROP TABLE IF EXISTS cameras;`);
  await qi.sequelize.query(`ALTER TABLE camera_surveys DROP COLUMN IF EXISTS area_acres, DROP COLUMN IF EXISTS from_photos`);
};
