/**
 * CSRF protection for cookie-authenticated writes (synchronizer token kept in the session).
 * The client reads the token from GET /api/auth/csrf and sends it in the X-CSRF-Token header.
 */
import crypto from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The session's CSRF token, made on first use. */
export function csrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = crypto.randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && crypto.timingSafeEqual(x, y);
}

/** Paths that take writes without a session token: sign-in style forms and signed webhooks. */
const EXEMPT = [/^\/api\/auth\/login$/, /^\/api\/auth\/password-reset/, /^\/api\/auth\/invitations\/accept$/, /^\/api\/webhooks\//];

/** Middleware: refuse unsafe methods whose X-CSRF-Token does not match the session's. */
export function csrfProtection(req: Request, _res: Response, next: NextFunction) {
  const fullPath = req.baseUrl + req.path;
  if (SAFE.has(req.method) || EXEMPT.some((re) => re.test(fullPath))) return next();
  const sent = req.get('x-csrf-token');
  const expected = req.session?.csrfToken;
  if (!sent || !expected || !sameToken(sent, expected)) {
    return next(new AppError(403, 'csrf', 'This request is missing its security token. Reload the page and try again.'));
  }
  next();
}
