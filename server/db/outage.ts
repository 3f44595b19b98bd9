/**
 * Telling a database outage (server restarting, connection refused or cut) from a bug, so that the
 * error handler answers 503 "try again" instead of 500, and nothing crashes while PostgreSQL is away.
 */
import { ConnectionError, DatabaseError } from 'sequelize';

/** SQLSTATE classes and codes that mean "the database is not there right now" (PostgreSQL appendix A). */
const OUTAGE_SQLSTATES = new Set(['57P01', '57P02', '57P03', '53300']);
const OUTAGE_ERRNOS = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EAI_AGAIN']);
const OUTAGE_MESSAGES = [/Connection terminated/i, /connection .*closed/i, /server closed the connection/i, /Client has encountered a connection error/i, /terminating connection/i, /the database system is (starting up|shutting down|in recovery mode)/i, /timeout exceeded when trying to connect/i, /Client was closed/i];

/** True when an error (from Sequelize, pg or a session store) means the database is unreachable. */
export function isDatabaseOutage(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  if (err instanceof ConnectionError) return true;
  const seen = new Set<unknown>();
  let e: unknown = err;
  // Sequelize wraps the driver's error in `parent`/`original`; look through the chain.
  while (e && typeof e === 'object' && !seen.has(e)) {
    seen.add(e);
    const x = e as { code?: unknown; errno?: unknown; message?: unknown; parent?: unknown; original?: unknown; cause?: unknown };
    if (typeof x.code === 'string' && (OUTAGE_SQLSTATES.has(x.code) || x.code.startsWith('08') || OUTAGE_ERRNOS.has(x.code))) return true;
    if (typeof x.message === 'string' && OUTAGE_MESSAGES.some((re) => re.test(x.message as string))) return true;
    e = x.parent ?? x.original ?? x.cause;
  }
  return false;
}

/** The driver's SQLSTATE of a database error, if any (Sequelize keeps it on `parent`). */
export function sqlState(err: unknown): string | null {
  if (!(err instanceof DatabaseError)) return null;
  const code = (err.parent as { code?: unknown } | undefined)?.code;
  return typeof code === 'string' ? code : null;
}
