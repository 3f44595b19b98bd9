/**
 * Plant-back intervals on herbicides: `definition.plantBackDays` (from the product's label) is a
 * whole number of days ≥ 0 when present. The API checks it with zod; this constraint keeps a row
 * written any other way from carrying months, text or a fraction.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`
    ALTER TABLE materials ADD CONSTRAINT materials_plant_back_days_whole CHECK (
      CASE
        WHEN NOT (definition ? 'plantBackDays') THEN true
        WHEN jsonb_typeof(definition->'plantBackDays') <> 'number' THEN false
        ELSE (definition->>'plantBackDays')::numeric >= 0 AND (definition->>'plantBackDays')::numeric = trunc((definition->>'plantBackDays')::numeric)
      END
    )`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE materials DROP CONSTRAINT IF EXISTS materials_plant_back_days_whole');
};
