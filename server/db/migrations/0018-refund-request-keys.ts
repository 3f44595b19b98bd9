/**
 * Refunds keyed by the owner's request: each refund remembers the key of the request that made it
 * (unique per firm), so a retry after a lost answer finds it instead of refunding again.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE invoice_refunds ADD COLUMN request_key TEXT');
  await qi.sequelize.query('CREATE UNIQUE INDEX invoice_refunds_request_key ON invoice_refunds (firm_id, request_key) WHERE request_key IS NOT NULL');
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS invoice_refunds_request_key');
  await qi.sequelize.query('ALTER TABLE invoice_refunds DROP COLUMN IF EXISTS request_key');
};
