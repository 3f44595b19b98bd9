/**
 * Next season's plan of a property, drafted from the evidence: the carried-over units and the list
 * of changes, each accepted or rejected by the consultant, until it is written into prescriptions
 * and a draft proposal. One draft per property and season.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE season_drafts (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      season INTEGER NOT NULL CHECK (season BETWEEN 2000 AND 2100),
      plan JSONB NOT NULL,
      status TEXT NOT NULL DEFAULT 'draft' CHECK (status IN ('draft','written')),
      prescription_ids JSONB NOT NULL DEFAULT '[]'::jsonb,
      proposal_id INTEGER REFERENCES proposals(id) ON DELETE SET NULL,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      UNIQUE (property_id, season)
    )`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS season_drafts');
};
