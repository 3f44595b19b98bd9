/** The one Sequelize instance, on the configured PostgreSQL. */
import { Sequelize } from 'sequelize';
import { config } from '../config';
import { logger } from '../logger';

export const sequelize = new Sequelize(config.databaseUrl, {
  dialect: 'postgres',
  logging: process.env.SQL_LOG ? (sql: string) => logger.debug({ sql }) : false,
  define: { underscored: true },
  pool: { max: Number(process.env.DB_POOL_MAX ?? 10), min: 0, idle: 10000, acquire: 20000 },
});

/** True when the database answers a trivial query. */
export async function databaseIsUp(): Promise<boolean> {
  try {
    await sequelize.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
