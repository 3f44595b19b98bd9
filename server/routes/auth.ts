/** Sign-in, sign-out, the current user, CSRF token, invitations and password reset. */
import type { NextFunction, Request, Response } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { z } from 'zod';
import { defineRoutes } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { typed } from '../middlewares/typed-route';
import { csrfToken } from '../middlewares/csrf';
import { PostgresRateLimitStore } from '../middlewares/rate-limit-store';
import { passport } from '../services/auth/passport';
import { LoginSchema, PasswordChangeSchema, PasswordResetRequestSchema, TokenPasswordSchema, VerifyEmailSchema, type SessionUser } from '../../shared/schemas/auth';
import { verifySignupEmail } from '../commands/firm-signup';
import { tooManyRequests, unauthorized } from '../errors';
import { config } from '../config';
import { changePassword, findLiveToken, requestPasswordReset, setPasswordFromToken } from '../commands/password-setter';
import { toSessionUser } from '../services/auth/passport';
import { Firm } from '../models';
import { recordAudit } from '../commands/audit-recorder';

const r = defineRoutes('/auth');

const publicUser = (u: SessionUser) => ({ id: u.id, email: u.email, name: u.name, role: u.role, firmId: u.firmId, firmName: u.firmName, firmTimezone: u.firmTimezone, firmAreaUnit: u.firmAreaUnit, firmLengthUnit: u.firmLengthUnit, clientId: u.clientId });

/** Signs the user in on a fresh session (passport regenerates it) and answers the user and CSRF token. */
function signIn(req: Request, res: Response, next: NextFunction, user: SessionUser, status = 200) {
  req.login(user, (err) => {
    if (err) return next(err);
    const token = csrfToken(req);
    req.session.save((saveErr) => {
      if (saveErr) return next(saveErr);
      const body = publicUser(user);
      res.status(status).json({ user: body, data: { user: body }, csrfToken: token });
    });
  });
}

const loginLimiter = rateLimit({
  windowMs: config.loginRateLimit.windowMs,
  limit: config.loginRateLimit.max,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  skipSuccessfulRequests: true,
  store: new PostgresRateLimitStore('login:'),
  keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
  handler: (_req, _res, next) => next(tooManyRequests('Too many sign-in attempts. Wait a few minutes, then try again or reset your password.')),
});

/** The e-mail a sign-in names, as the account key of the per-account limit. */
const accountOf = (req: Request) => String(req.body?.email ?? '').trim().toLowerCase();

// However many addresses the attempts come from, one account takes only so many failed sign-ins.
const accountLoginLimiter = rateLimit({
  windowMs: config.loginRateLimit.windowMs,
  limit: config.loginRateLimit.accountMax,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  skipSuccessfulRequests: true,
  store: new PostgresRateLimitStore('login-account:'),
  keyGenerator: accountOf,
  handler: (_req, _res, next) => next(tooManyRequests('Too many sign-in attempts on this account. Wait a few minutes, then try again or reset your password.')),
});

/** A per-address limit with its own bucket, so asking for a reset cannot use up, say, invitation acceptance. */
function bucketLimiter(prefix: string, limit: number, message: string, keyGenerator?: (req: Request) => string) {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PostgresRateLimitStore(prefix),
    ...(keyGenerator ? { keyGenerator } : {}),
    handler: (_req, _res, next) => next(tooManyRequests(message)),
  });
}
const resetRequestLimiter = bucketLimiter('reset:', 20, 'Too many reset requests. Wait a few minutes and try again.');
const resetCompleteLimiter = bucketLimiter('reset-complete:', 20, 'Too many attempts to set a new password. Wait a few minutes and try again.');
const verifyEmailLimiter = bucketLimiter('verify-email:', 20, 'Too many attempts to confirm an e-mail address. Wait a few minutes and try again.');
const invitationAcceptLimiter = bucketLimiter('invite-accept:', 20, 'Too many attempts to accept an invitation. Wait a few minutes and try again.');
// Guessing the current password through the change form is limited per account.
const passwordChangeLimiter = bucketLimiter('password-change:', 10, 'Too many attempts to change the password. Wait a few minutes and try again.', (req) => `user-${req.user?.id ?? 0}`);

r.get('/csrf', 'public', (req, res) => {
  res.json({ csrfToken: csrfToken(req), data: { csrfToken: csrfToken(req) } });
});

r.post('/login', 'public', validate({ body: LoginSchema }), loginLimiter, accountLoginLimiter, (req, res, next) => {
  passport.authenticate('local', (err: unknown, user: SessionUser | false) => {
    if (err) return next(err);
    if (!user) return next(unauthorized('That e-mail and password do not match an account. Check both, or reset your password.'));
    void recordAudit({ firmId: user.firmId, userId: user.id, action: 'user.signed-in', ip: req.ip ?? null }).catch(() => undefined);
    signIn(req, res, next, user);
  })(req, res, next);
});

r.post('/logout', 'signed-in', (req, res, next) => {
  req.logout((err) => {
    if (err) return next(err);
    req.session.destroy(() => {
      res.clearCookie('browseline.sid');
      res.status(204).end();
    });
  });
});

r.get('/me', 'signed-in', (req, res) => {
  const user = publicUser(req.user!);
  res.json({ user, data: { user } });
});

const TokenParams = z.object({ token: z.string().min(20).max(200) });

r.get('/invitations/:token', 'public', ...typed({ params: TokenParams }, async ({ params }, _req, res) => {
  const { user } = await findLiveToken(params.token, 'invite');
  const firm = await Firm.findByPk(user.firmId);
  res.json({ data: { name: user.name, email: user.email, role: user.role, firmName: firm?.name ?? '' } });
}));

r.post('/invitations/accept', 'public', invitationAcceptLimiter, ...typed({ body: TokenPasswordSchema }, async ({ body }, req, res, next) => {
  const user = await setPasswordFromToken(body.token, 'invite', body.password, req.ip ?? null);
  signIn(req, res, next, await toSessionUser(user), 201);
}));

r.post('/password-reset', 'public', resetRequestLimiter, ...typed({ body: PasswordResetRequestSchema }, async ({ body }, _req, res) => {
  await requestPasswordReset(body.email);
  res.status(202).json({ data: { message: 'If that address belongs to an account, a reset link is on its way. It expires in an hour.' } });
}));

r.get('/password-reset/:token', 'public', ...typed({ params: TokenParams }, async ({ params }, _req, res) => {
  const { user } = await findLiveToken(params.token, 'reset');
  res.json({ data: { email: user.email } });
}));

r.post('/password-reset/complete', 'public', resetCompleteLimiter, ...typed({ body: TokenPasswordSchema }, async ({ body }, req, res) => {
  await setPasswordFromToken(body.token, 'reset', body.password, req.ip ?? null);
  res.json({ data: { message: 'Your password is changed. Sign in with the new one.' } });
}));

r.post('/verify-email', 'public', verifyEmailLimiter, ...typed({ body: VerifyEmailSchema }, async ({ body }, req, res) => {
  const { email } = await verifySignupEmail(body.token, req.ip ?? null);
  res.json({ data: { email, message: 'Your e-mail is confirmed. Sign in with the password you chose.' } });
}));

r.post('/password', 'signed-in', passwordChangeLimiter, ...typed({ body: PasswordChangeSchema }, async ({ body }, req, res) => {
  const { sessionsEnded } = await changePassword(req.user!.id, req.sessionID, body, req.ip ?? null);
  res.json({ data: { message: sessionsEnded > 0 ? `Your password is changed. You were signed out on ${sessionsEnded === 1 ? 'one other device' : `${sessionsEnded} other devices`}.` : 'Your password is changed.', sessionsEnded } });
}));

export const authRouter = r.router;
