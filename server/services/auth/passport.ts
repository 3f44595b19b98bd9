/** passport-local: e-mail + password against bcrypt hashes; the session keeps only the user id. */
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { User } from '../../models';
import { verifyPassword } from './passwords';
import { AppError, unauthorized } from '../../errors';
import type { SessionUser } from '../../../shared/schemas/auth';
import type { Request } from 'express';
import { firmSettingsOf, sessionUserOf, type SessionUserRow } from './session-user';
import { SESSION_USER_COLUMNS, takeUserReadAlong } from './session-store';
import { primeRequestFirmSettings } from '../firm/request-firm-settings';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

/** The session view of a signed-in user (the same read as every request's, so both agree). */
export async function toSessionUser(user: Pick<User, 'id'>): Promise<SessionUser> {
  const row = await readSessionUserRow(user.id);
  if (!row) throw unauthorized('This account is not active. Ask your firm’s owner to turn it back on.');
  return sessionUserOf(row);
}

passport.use(
  new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
    try {
      const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
      const ok = await verifyPassword(password, user?.passwordHash ?? null);
      if (!user || !ok || !user.active) return done(null, false);
      // Only someone who knows the password learns the address is waiting for its confirmation.
      if (!user.emailVerified) return done(new AppError(403, 'email_unconfirmed', 'Confirm your e-mail address first: open the link we sent when you signed up, then sign in.'));
      await user.update({ lastSignInAt: new Date() });
      return done(null, await toSessionUser(user));
    } catch (err) {
      return done(err);
    }
  }),
);

passport.serializeUser((user, done) => done(null, user.id));
/**
 * The signed-in user of a session, read lean on every request: one indexed query for exactly what
 * authorization and the answers need (never the password hash, no model instances).
 */
export async function readSessionUser(id: number): Promise<SessionUser | null> {
  const row = await readSessionUserRow(id);
  return row ? sessionUserOf(row) : null;
}

async function readSessionUserRow(id: number): Promise<SessionUserRow | null> {
  const rows = await sequelize.query<SessionUserRow>(`SELECT ${SESSION_USER_COLUMNS} FROM users u JOIN firms f ON f.id = u.firm_id WHERE u.id = $1 AND u.active`, {
    bind: [id],
    type: QueryTypes.SELECT,
  });
  return rows[0] ?? null;
}

/** Hands passport the session's user (or false when it is no longer active), priming the request's firm settings. */
function signedIn(req: Request, row: SessionUserRow | null, done: (err: unknown, user?: Express.User | false) => void): void {
  if (!row) return done(null, false);
  primeRequestFirmSettings(req, firmSettingsOf(row));
  done(null, sessionUserOf(row));
}

passport.deserializeUser((req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
  // A session from before ids were numbers, or tampered with, is simply signed out.
  if (!Number.isSafeInteger(id)) return done(null, false);
  // Usually read along with the session itself (session-store.ts): no query of its own.
  const along = takeUserReadAlong(req.sessionID, id);
  if (along) return signedIn(req, along, done);
  readSessionUserRow(id).then(
    (row) => signedIn(req, row, done),
    (err: unknown) => done(err),
  );
});

export { passport };
