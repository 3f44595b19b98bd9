/**
 * Ending sessions: a password reset or change ends every other session of that user (sessions live
 * in the `session` table, so this holds across all server instances at once).
 */
import type { Transaction } from 'sequelize';
import { sequelize } from '../../db/sequelize';

/** Deletes every stored session of the user except `keepSid` (null: all of them); answers how many ended. */
export async function endSessionsOf(userId: number, keepSid: string | null, transaction?: Transaction): Promise<number> {
  const [, meta] = await sequelize.query(`DELETE FROM session WHERE (sess->'passport'->>'user') = :userId AND sid <> :keepSid`, {
    replacements: { userId: String(userId), keepSid: keepSid ?? '' },
    transaction,
  });
  return (meta as { rowCount?: number } | undefined)?.rowCount ?? 0;
}
