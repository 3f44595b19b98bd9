/**
 * Each integration test file starts with empty sign-in and reset counters: every file's requests come
 * from the same loopback address, so one file's resets must not use up the next file's allowance.
 */
import { beforeAll } from 'vitest';
import { sequelize } from '../../server/db/sequelize';

beforeAll(async () => {
  await sequelize.query('DELETE FROM rate_limit_hits');
});
