/**
 * Hunting pressure: what a stand site watches (its type, height and the side deer approach from),
 * the property's wind record, the sit log keyed by the phone's idempotency key, the client switch
 * that lets a client's contacts log sits and harvests, and harvests linked to a stand and a sit with
 * a state disease-sampling number.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE stand_sites (
      unit_id INTEGER PRIMARY KEY REFERENCES units(id) ON DELETE CASCADE,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      watched_unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      stand_type TEXT,
      height_ft NUMERIC(6,1),
      approach_from TEXT,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE TABLE wind_records (
      property_id INTEGER PRIMARY KEY REFERENCES properties(id) ON DELETE CASCADE,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      source TEXT NOT NULL,
      file_name TEXT,
      months INTEGER[] NOT NULL,
      hours_filter TEXT NOT NULL,
      rose JSONB NOT NULL,
      hours INTEGER NOT NULL,
      calm_hours INTEGER NOT NULL DEFAULT 0,
      skipped_rows INTEGER NOT NULL DEFAULT 0,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    );
    CREATE TABLE sits (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      stand_unit_id INTEGER NOT NULL REFERENCES units(id) ON DELETE CASCADE,
      started_at TIMESTAMPTZ NOT NULL,
      ended_at TIMESTAMPTZ NOT NULL,
      wind_from TEXT,
      wind_mph NUMERIC(5,1),
      bucks INTEGER NOT NULL DEFAULT 0,
      does INTEGER NOT NULL DEFAULT 0,
      fawns INTEGER NOT NULL DEFAULT 0,
      notes TEXT,
      logged_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      idempotency_key TEXT NOT NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CONSTRAINT sits_ends_after_start CHECK (ended_at > started_at),
      CONSTRAINT sits_idempotency UNIQUE (firm_id, idempotency_key)
    );
    CREATE INDEX sits_property_started ON sits (property_id, started_at);
    CREATE INDEX sits_stand ON sits (stand_unit_id);
    ALTER TABLE clients ADD COLUMN portal_sits_allowed BOOLEAN NOT NULL DEFAULT false;
    ALTER TABLE harvest_records
      ADD COLUMN stand_unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      ADD COLUMN sit_id INTEGER REFERENCES sits(id) ON DELETE SET NULL,
      ADD COLUMN disease_sample_number TEXT;
  `);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE harvest_records DROP COLUMN IF EXISTS disease_sample_number, DROP COLUMN IF EXISTS sit_id, DROP COLUMN IF EXISTS stand_unit_id;
    ALTER TABLE clients DROP COLUMN IF EXISTS portal_sits_allowed;
    DROP TABLE IF EXISTS sits;
    DROP TABLE IF EXISTS wind_records;
    DROP TABLE IF EXISTS stand_sites;
  `);
};
