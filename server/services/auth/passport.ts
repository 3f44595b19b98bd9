/** passport-local: e-mail + password against bcrypt hashes; the session keeps only the user id. */
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { Firm, User } from '../../models';
import { verifyPassword } from './passwords';
import { AppError } from '../../errors';
import { usableZone } from '../clock';
import type { SessionUser } from '../../../shared/schemas/auth';

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
  const firm = user.Firm ?? (await Firm.findByPk(user.firmId, { attributes: ['name', 'timezone'] }));
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    firmId: user.firmId,
    firmName: firm?.name ?? '',
    firmTimezone: usableZone(firm?.timezone),
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
passport.deserializeUser(async (id: number, done) => {
  try {
    const user = await User.findByPk(id, { include: [{ model: Firm, attributes: ['name', 'timezone'] }] });
    if (!user || !user.active) return done(null, false);
    done(null, await toSessionUser(user));
  } catch (err) {
    done(err);
  }
});

export { passport };
