/**
 * Soil tests of a unit: the lab's numbers, the lime and fertilizer recommendation worked by the
 * firm's state method when the test was stored, and the prescription it was written into.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE soil_tests (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER NOT NULL REFERENCES properties(id) ON DELETE CASCADE,
      unit_id INTEGER NOT NULL REFERENCES units(id) ON DELETE CASCADE,
      sampled_on DATE NOT NULL,
      lab TEXT NOT NULL,
      ph NUMERIC(4,2) NOT NULL CHECK (ph BETWEEN 3 AND 10),
      buffer_ph NUMERIC(4,2) CHECK (buffer_ph IS NULL OR buffer_ph BETWEEN 3 AND 10),
      buffer_method TEXT,
      p_ppm NUMERIC(8,2) CHECK (p_ppm IS NULL OR p_ppm >= 0),
      k_ppm NUMERIC(8,2) CHECK (k_ppm IS NULL OR k_ppm >= 0),
      organic_matter_pct NUMERIC(5,2),
      cec NUMERIC(6,2),
      enm_lb_per_acre NUMERIC(8,1),
      crop_group TEXT NOT NULL,
      recommendation JSONB NOT NULL,
      retest_due DATE NOT NULL,
      applied_prescription_id INTEGER REFERENCES prescriptions(id) ON DELETE SET NULL,
      created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      updated_at TIMESTAMPTZ NOT NULL DEFAULT now()
    )`);
  await qi.sequelize.query('CREATE INDEX soil_tests_unit_idx ON soil_tests (unit_id, sampled_on)');
  await qi.sequelize.query('CREATE INDEX soil_tests_retest_idx ON soil_tests (firm_id, retest_due)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS soil_tests');
};
