/**
 * The session store: connect-pg-simple on the `session` table, whose read of a session also reads
 * its signed-in user and the firm settings every answer needs, in the same query. A signed-in
 * request then costs one round trip before its route instead of three (session, user, firm
 * settings). The user read along is kept for that session's id only until the same request's
 * `deserializeUser` takes it (passport.ts); when it is missing (another request took it, or the
 * session has no user), the user is read on its own, as before.
 */
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { SessionData } from 'express-session';
import type { SessionUserRow } from './session-user';

const PgStore = connectPgSimple(session);

/** Columns of the session's user and firm, as `SessionUserRow` names them (u: users, f: firms). */
export const SESSION_USER_COLUMNS = `u.id, u.email, u.name, u.role, u.firm_id AS "firmId", u.client_id AS "clientId",
  f.name AS "firmName", f.timezone AS "firmTimezone", f.settings->>'areaUnit' AS "firmAreaUnit", f.settings->>'lengthUnit' AS "firmLengthUnit",
  f.settings->>'tileUrlTemplate' AS "firmTileUrlTemplate", f.settings->>'idleTimeoutHours' AS "firmIdleTimeoutHours"`;

/** Users read along with their session, by session id, each waiting for its own request's deserializeUser. */
const readAlong = new Map<string, SessionUserRow>();
/** More waiting than this means nobody is taking them (a route that never deserializes): start over. */
const MAX_WAITING = 10_000;

/** The user read with session `sid` for user `userId`, taken once; undefined when there is none. */
export function takeUserReadAlong(sid: string | undefined, userId: number): SessionUserRow | undefined {
  if (!sid) return undefined;
  const row = readAlong.get(sid);
  if (!row) return undefined;
  readAlong.delete(sid);
  return row.id === userId ? row : undefined;
}

type GetCallback = (err: unknown, session?: SessionData | null) => void;
type PgStoreInternals = { query: (sql: string, params: unknown[], fn: (err: Error | null, row?: Record<string, unknown>) => void) => void; quotedTable: () => string; destroy: (sid: string, fn: GetCallback) => void };

/** connect-pg-simple whose `get` reads the session's user and firm in the same query. */
export class SessionStore extends PgStore {
  override get(sid: string, fn: GetCallback): void {
    const self = this as unknown as PgStoreInternals;
    // The user id is read from the session's own JSON; anything but a plain number joins nothing.
    const sql = `SELECT s.sess, ${SESSION_USER_COLUMNS}
      FROM ${self.quotedTable()} s
      LEFT JOIN users u ON u.id = CASE WHEN s.sess #>> '{passport,user}' ~ '^[0-9]{1,9}$' THEN (s.sess #>> '{passport,user}')::int END AND u.active
      LEFT JOIN firms f ON f.id = u.firm_id
      WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`;
    self.query(sql, [sid, Math.ceil(Date.now() / 1000)], (err, row) => {
      if (err) return fn(err);
      readAlong.delete(sid);
      if (!row) return fn(null, null);
      let sess: SessionData;
      try {
        sess = (typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess) as SessionData;
      } catch {
        return self.destroy(sid, fn);
      }
      if (row.id !== null && row.id !== undefined) {
        if (readAlong.size >= MAX_WAITING) readAlong.clear();
        const { sess: _sess, ...user } = row;
        readAlong.set(sid, user as unknown as SessionUserRow);
      }
      return fn(null, sess);
    });
  }
}
