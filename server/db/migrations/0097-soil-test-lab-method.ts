/**
 * The extractant a soil test's P and K were read with: Bray P1 with ammonium-acetate K (what the Tri-State
 * rules are calibrated on; every earlier row) or Mehlich-3 (converted before the rules).
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE soil_tests
      ADD COLUMN lab_method TEXT NOT NULL DEFAULT 'bray-nh4oac'
        CONSTRAINT soil_tests_lab_method_check CHECK (lab_method IN ('bray-nh4oac', 'mehlich-3'))`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE soil_tests DROP COLUMN IF EXISTS lab_method');
};
