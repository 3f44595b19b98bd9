/** Identified bucks seen on a sit, from the property's camera roster (ids checked against the property when written). */
import type { MigrationFn } from '../migrator';

export const up: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE sits ADD COLUMN buck_ids INTEGER[] NOT NULL DEFAULT '{}'`);
};

export const down: MigrationFn = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE sits DROP COLUMN IF EXISTS buck_ids`);
};
