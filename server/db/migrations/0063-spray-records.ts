/**
 * Spray records (7 CFR Part 110): one row per product applied when a herbicide step is completed.
 * Each row is a self-contained copy (names, location, product, applicator) so it outlives edits to
 * the unit, task or library. A row younger than two years cannot be deleted (7 CFR 110.5): a trigger
 * refuses it, whatever path asks.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    CREATE TABLE spray_records (
      id SERIAL PRIMARY KEY,
      firm_id INTEGER NOT NULL REFERENCES firms(id) ON DELETE CASCADE,
      property_id INTEGER REFERENCES properties(id) ON DELETE SET NULL,
      unit_id INTEGER REFERENCES units(id) ON DELETE SET NULL,
      task_id INTEGER REFERENCES tasks(id) ON DELETE SET NULL,
      applied_on DATE NOT NULL,
      property_name TEXT NOT NULL,
      unit_name TEXT NOT NULL,
      latitude NUMERIC(9,6),
      longitude NUMERIC(9,6),
      crop_or_site TEXT NOT NULL,
      area_treated NUMERIC(10,2) NOT NULL CHECK (area_treated > 0),
      area_unit TEXT NOT NULL DEFAULT 'acres',
      material_key TEXT NOT NULL,
      product_name TEXT NOT NULL,
      epa_reg_no TEXT,
      restricted_use BOOLEAN NOT NULL DEFAULT false,
      amount NUMERIC(12,3) NOT NULL CHECK (amount > 0),
      amount_unit TEXT NOT NULL,
      applicator_name TEXT NOT NULL,
      applicator_cert_no TEXT,
      wind_mph NUMERIC(5,1) NOT NULL CHECK (wind_mph >= 0),
      wind_direction TEXT NOT NULL,
      air_temp_f NUMERIC(5,1) NOT NULL,
      recorded_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
      created_at TIMESTAMPTZ NOT NULL DEFAULT now(),
      CHECK (NOT restricted_use OR (applicator_cert_no IS NOT NULL AND epa_reg_no IS NOT NULL))
    )`);
  await qi.sequelize.query('CREATE INDEX spray_records_firm_idx ON spray_records (firm_id, applied_on)');
  await qi.sequelize.query(`
    CREATE FUNCTION spray_records_keep_two_years() RETURNS trigger AS $$
    BEGIN
      IF OLD.applied_on > current_date - interval '2 years' THEN
        RAISE EXCEPTION 'spray records are kept at least two years (7 CFR 110.5)' USING ERRCODE = 'check_violation';
      END IF;
      RETURN OLD;
    END $$ LANGUAGE plpgsql`);
  await qi.sequelize.query('CREATE TRIGGER spray_records_keep BEFORE DELETE ON spray_records FOR EACH ROW EXECUTE FUNCTION spray_records_keep_two_years()');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TABLE IF EXISTS spray_records');
  await qi.sequelize.query('DROP FUNCTION IF EXISTS spray_records_keep_two_years()');
};
