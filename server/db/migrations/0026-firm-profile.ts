/**
 * The firm's profile: website, licence or certification numbers to print, and the logo (a stored
 * file; a new logo gets a new key so documents already sent keep theirs). Defaults for new proposals
 * and invoices and the display units live in `firms.settings`.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE firms ADD COLUMN website TEXT, ADD COLUMN licence_numbers TEXT, ADD COLUMN logo_key TEXT, ADD COLUMN logo_content_type TEXT`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE firms DROP COLUMN IF EXISTS logo_content_type, DROP COLUMN IF EXISTS logo_key, DROP COLUMN IF EXISTS licence_numbers, DROP COLUMN IF EXISTS website`);
};
