/**
 * The outbox keeps trying a message until `retry_until` (3 days after it was queued or resent)
 * instead of giving up after 8 tries; failed messages can be resent by the owner.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE outbox_messages ADD COLUMN retry_until TIMESTAMPTZ NOT NULL DEFAULT (now() + interval '3 days')`);
  await qi.sequelize.query(`UPDATE outbox_messages SET retry_until = created_at + interval '3 days'`);
  await qi.sequelize.query(`CREATE INDEX outbox_messages_failed_idx ON outbox_messages (firm_id, updated_at) WHERE status = 'failed'`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS outbox_messages_failed_idx');
  await qi.sequelize.query('ALTER TABLE outbox_messages DROP COLUMN IF EXISTS retry_until');
};
