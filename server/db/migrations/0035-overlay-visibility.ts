/**
 * Image overlays can be hidden on the plan map without deleting them, and chosen to print under
 * the plan in the plan PDF and the proposal map.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE overlays ADD COLUMN visible BOOLEAN NOT NULL DEFAULT true`);
  await qi.sequelize.query(`ALTER TABLE overlays ADD COLUMN in_documents BOOLEAN NOT NULL DEFAULT false`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE overlays DROP COLUMN IF EXISTS in_documents`);
  await qi.sequelize.query(`ALTER TABLE overlays DROP COLUMN IF EXISTS visible`);
};
