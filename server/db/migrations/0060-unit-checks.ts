/**
 * Checks on a unit: establishment checks, browse checks and timber cruises, each with what was
 * measured (`input`), the computed figures (`result`), a one-word status for maps and Progress, and
 * — for a thin or failed establishment — a re-seeding drafted for the consultant (`reseed`).
 * A phone's idempotency key is unique per firm, so a check sent twice is stored once.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE unit_checks (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      unit_id INTEGER NOT NULL REFERENCES units(id) ON DELETE CASCADE,
      kind TEXT NOT NULL CHECK (kind IN ('establishment','browse','timber')),
      checked_on DATE NOT NULL,
      season INTEGER NOT NULL,
      input JSONB NOT NULL,
      result JSONB NOT NULL,
      status TEXT NOT NULL,
      reseed JSONB,
      notes TEXT,
      idempotency_key TEXT,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await qi.sequelize.query('CREATE INDEX unit_checks_unit_idx ON unit_checks (unit_id, checked_on)');
  await qi.sequelize.query('CREATE INDEX unit_checks_property_idx ON unit_checks (property_id, checked_on)');
  await qi.sequelize.query('CREATE UNIQUE INDEX unit_checks_idempotency_idx ON unit_checks (firm_id, idempotency_key) WHERE idempotency_key IS NOT NULL');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS unit_checks');
};
