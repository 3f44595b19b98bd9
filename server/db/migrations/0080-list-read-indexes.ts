/**
 * Indexes for the paged lists, so a page costs about the same however much the firm holds: the
 * task list's date order (the schedule and the consultant's week read `COALESCE(start_date,
 * earliest)` ranges in that order) and the invoice list's newest-first order.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('CREATE INDEX IF NOT EXISTS tasks_firm_planned_on_idx ON tasks (firm_id, (COALESCE(start_date, earliest)), property_id, unit_name, position, id)');
  await qi.sequelize.query('CREATE INDEX IF NOT EXISTS invoices_firm_created_idx ON invoices (firm_id, created_at DESC, id DESC)');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS invoices_firm_created_idx');
  await qi.sequelize.query('DROP INDEX IF EXISTS tasks_firm_planned_on_idx');
};
