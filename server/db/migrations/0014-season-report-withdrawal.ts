/**
 * A sent season report can be withdrawn from the landowner's portal: the row and its PDF stay on
 * file for the firm, the portal no longer lists or serves it.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE season_reports ADD COLUMN withdrawn_at TIMESTAMPTZ');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE season_reports DROP COLUMN IF EXISTS withdrawn_at');
};
