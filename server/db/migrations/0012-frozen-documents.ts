/**
 * Documents that never change: a proposal keeps the plan (boundary and units) it was sent with, and
 * an invoice keeps what its PDF showed when it was issued.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE proposals ADD COLUMN plan_snapshot JSONB`);
  await qi.sequelize.query(`ALTER TABLE invoices ADD COLUMN document_snapshot JSONB`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE invoices DROP COLUMN IF EXISTS document_snapshot`);
  await qi.sequelize.query(`ALTER TABLE proposals DROP COLUMN IF EXISTS plan_snapshot`);
};
