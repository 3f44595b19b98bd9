/**
 * Sign-up: a firm's first owner confirms the e-mail address before signing in. Everyone created
 * before, or through an invitation (which itself comes by e-mail), counts as confirmed.
 */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE users ADD COLUMN email_verified BOOLEAN NOT NULL DEFAULT true`);
  await qi.sequelize.query(`ALTER TABLE auth_tokens DROP CONSTRAINT IF EXISTS auth_tokens_purpose_check`);
  await qi.sequelize.query(`ALTER TABLE auth_tokens ADD CONSTRAINT auth_tokens_purpose_check CHECK (purpose IN ('invite','reset','verify'))`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`DELETE FROM auth_tokens WHERE purpose = 'verify'`);
  await qi.sequelize.query(`ALTER TABLE auth_tokens DROP CONSTRAINT IF EXISTS auth_tokens_purpose_check`);
  await qi.sequelize.query(`ALTER TABLE auth_tokens ADD CONSTRAINT auth_tokens_purpose_check CHECK (purpose IN ('invite','reset'))`);
  await qi.sequelize.query(`ALTER TABLE users DROP COLUMN IF EXISTS email_verified`);
};
