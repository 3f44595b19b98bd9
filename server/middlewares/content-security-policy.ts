/**
 * The content security policy, built per request: the only outside origin it allows is the imagery
 * tile service of the signed-in person's own firm (https only), read from the database for this
 * request. Another firm's setting never widens it, and every instance agrees at once.
 */
import type { NextFunction, Request, Response } from 'express';
import { requestFirmSettings } from '../services/firm/request-firm-settings';

/** The policy's text, allowing `tileOrigins` (already https origins) for images and fetches. */
export function contentSecurityPolicy(tileOrigins: readonly string[] = []): string {
  const tiles = tileOrigins.length ? ` ${tileOrigins.join(' ')}` : '';
  return [
    "default-src 'self'",
    "script-src 'self'",
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' data: blob:${tiles}`,
    "font-src 'self' data:",
    `connect-src 'self'${tiles}`,
    "worker-src 'self' blob:",
    "child-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

/** Browser features the product never uses are switched off; the camera (photos) and the position ("Log sign", "Use this phone’s position") stay for our own pages, never for a frame. */
export const PERMISSIONS_POLICY = 'accelerometer=(), autoplay=(), camera=(self), display-capture=(), geolocation=(self), gyroscope=(), magnetometer=(), microphone=(), midi=(), payment=(), usb=(), interest-cohort=()';

/** Middleware (after the session): sets the policy for the signed-in firm, or the strict one. */
/** The policy text per tile origin, made once each (it is set on every answer). */
const policies = new Map<string, string>();
function policyFor(origin: string | null): string {
  const key = origin ?? '';
  let policy = policies.get(key);
  if (policy === undefined) {
    policy = contentSecurityPolicy(origin ? [origin] : []);
    if (policies.size < 1000) policies.set(key, policy);
  }
  return policy;
}

export async function firmContentSecurityPolicy(req: Request, res: Response, next: NextFunction): Promise<void> {
  const origin = req.user ? (await requestFirmSettings(req, req.user.firmId)).tileOrigin : null;
  res.setHeader('Content-Security-Policy', policyFor(origin));
  next();
}
