/**
 * Acres, perimeters and lengths were measured on turf's sphere (off by up to ±0.6 % with latitude);
 * they are now measured on the WGS84 ellipsoid. Re-measures every stored boundary and unit so old
 * plans agree with new ones (and bumps the revision of each plan that changed). Documents already
 * sent keep their own numbers: they are stored apart and never change. Down: nothing to undo — the
 * spherical numbers were wrong, and the next write would re-measure anyway.
 */
import type { MigrationFn } from '../migrator';
import { remeasureStoredMeasures } from '../../commands/measure-refresher';

export const up: MigrationFn = async ({ context: qi }) => {
  // The migrator already runs this migration in one transaction on its own connection.
  await remeasureStoredMeasures(qi.sequelize);
};

export const down: MigrationFn = async () => {};
