/**
 * The idle timeout beside the absolute one: a session unused for longer than the firm's
 * `idleTimeoutHours` (default 8) ends, and the request goes on as signed out. The last activity is
 * kept in the session and written at most once a minute, so reads stay cheap.
 */
import type { NextFunction, Request, Response } from 'express';
import { requestFirmSettings } from '../services/firm/request-firm-settings';

declare module 'express-session' {
  interface SessionData {
    /** Milliseconds since the epoch of the session's last request (to the minute). */
    lastSeenAt?: number;
  }
}

/** How stale the stored last activity may get before it is written again. */
const TOUCH_EVERY_MS = 60_000;

/** True when a session last seen at `lastSeenAt` has been idle longer than `idleHours` at `now`. */
export const isIdleExpired = (lastSeenAt: number | undefined, idleHours: number, now: number): boolean =>
  typeof lastSeenAt === 'number' && now - lastSeenAt > idleHours * 3_600_000;

/** Middleware (after passport.session): ends an idle session, or notes this request's activity. */
export async function idleTimeout(req: Request, res: Response, next: NextFunction): Promise<void> {
  if (!req.user || !req.session) return next();
  const now = Date.now();
  const { idleTimeoutHours } = await requestFirmSettings(req, req.user.firmId);
  if (isIdleExpired(req.session.lastSeenAt, idleTimeoutHours, now)) {
    // A fresh, empty session replaces the idle one (whose row is deleted): the request is signed out.
    await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
    req.user = undefined;
    res.setHeader('X-Session-Ended', 'idle');
    return next();
  }
  if (typeof req.session.lastSeenAt !== 'number' || now - req.session.lastSeenAt > TOUCH_EVERY_MS) req.session.lastSeenAt = now;
  next();
}
