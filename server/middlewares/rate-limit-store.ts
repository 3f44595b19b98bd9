/** An express-rate-limit store in PostgreSQL, so limits hold across several server instances. */
import type { Store, ClientRateLimitInfo, Options } from 'express-rate-limit';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';

export class PostgresRateLimitStore implements Store {
  private windowMs = 60_000;
  prefix: string;
  localKeys = false;

  constructor(prefix: string) {
    this.prefix = prefix;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const rows = await sequelize.query<{ hits: number; reset_at: Date }>(
      `INSERT INTO rate_limit_hits (key, hits, reset_at) VALUES (:key, 1, now() + (:ms || ' milliseconds')::interval)
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN rate_limit_hits.reset_at <= now() THEN 1 ELSE rate_limit_hits.hits + 1 END,
         reset_at = CASE WHEN rate_limit_hits.reset_at <= now() THEN EXCLUDED.reset_at ELSE rate_limit_hits.reset_at END
       RETURNING hits, reset_at`,
      { replacements: { key: this.prefix + key, ms: String(this.windowMs) }, type: QueryTypes.SELECT },
    );
    return { totalHits: rows[0].hits, resetTime: new Date(rows[0].reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await sequelize.query('UPDATE rate_limit_hits SET hits = GREATEST(hits - 1, 0) WHERE key = :key', {
      replacements: { key: this.prefix + key },
    });
  }

  async resetKey(key: string): Promise<void> {
    await sequelize.query('DELETE FROM rate_limit_hits WHERE key = :key', { replacements: { key: this.prefix + key } });
  }
}
