/** passport-local: e-mail + password against bcrypt hashes; the session keeps only the user id. */
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db/sequelize';
import { Firm, User } from '../../models';
import { verifyPassword } from './passwords';
import { AppError } from '../../errors';
import { usableZone } from '../clock';
import type { SessionUser } from '../../../shared/schemas/auth';
import type { Request } from 'express';
import { firmSettingsOf, sessionUnits, sessionUserOf, type SessionUserRow } from './session-user';
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

/** The session view of a user. */
export async function toSessionUser(user: User & { Firm?: Firm }): Promise<SessionUser> {
  const firm = user.Firm ?? (await Firm.findByPk(user.firmId, { attributes: ['name', 'timezone', 'settings'] }));
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    firmId: user.firmId,
    firmName: firm?.name ?? '',
    firmTimezone: usableZone(firm?.timezone),
    ...sessionUnits(firm?.settings?.areaUnit, firm?.settings?.lengthUnit),
    clientId: user.clientId,
  };
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

passport.deserializeUser((req: Request, id: number, done: (err: unknown, user?: Express.User | false) => void) => {
  // A session from before ids were numbers, or tampered with, is simply signed out.
  if (!Number.isSafeInteger(id)) return done(null, false);
  const signedIn = (row: SessionUserRow | null) => {
    if (!row) return done(null, false);
    primeRequestFirmSettings(req, firmSettingsOf(row));
    return done(null, sessionUserOf(row));
  };
  // Usually read along with the session itself (session-store.ts): no query of its own.
  const along = takeUserReadAlong(req.sessionID, id);
  if (along) return signedIn(along);
  readSessionUserRow(id).then(signedIn, (err: unknown) => done(err));
});

export { passport };
