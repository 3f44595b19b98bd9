/** Runtime configuration from the environment, with the documented defaults. */
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));
export const projectRoot = path.resolve(here, '..');

const env = process.env;
const int = (value: string | undefined, fallback: number): number => {
  const n = Number.parseInt(value ?? '', 10);
  return Number.isFinite(n) ? n : fallback;
};

export const config = {
  env: env.NODE_ENV ?? 'development',
  isProduction: env.NODE_ENV === 'production',
  isTest: env.NODE_ENV === 'test' || env.VITEST === 'true',
  port: int(env.PORT, 3000),
  host: env.HOST ?? '127.0.0.1',
  publicUrl: env.PUBLIC_URL ?? `http://127.0.0.1:${int(env.PORT, 3000)}`,
  databaseUrl: env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/browseline',
  sessionSecret: env.SESSION_SECRET ?? 'browseline-local-development-secret-change-me',
  cookieSecure: (env.COOKIE_SECURE ?? (env.PUBLIC_URL?.startsWith('https://') ? 'true' : 'false')) === 'true',
  trustProxy: env.TRUST_PROXY ?? 'loopback',
  smtp: {
    host: env.SMTP_HOST ?? '127.0.0.1',
    port: int(env.SMTP_PORT, 1025),
    secure: env.SMTP_SECURE === 'true',
    user: env.SMTP_USER ?? '',
    pass: env.SMTP_PASS ?? '',
    from: env.MAIL_FROM ?? 'Browseline <no-reply@browseline.test>',
  },
  /** The local SMTP capture server's HTTP reader (development only). */
  mailCaptureUrl: env.MAIL_CAPTURE_URL ?? `http://127.0.0.1:${int(env.MAIL_CAPTURE_HTTP_PORT, 1081)}`,
  outboxPollMs: int(env.OUTBOX_POLL_MS, 2000),
  /** How often the server looks for overdue invoices to remind (default hourly). */
  reminderPollMs: int(env.REMINDER_POLL_MS, 60 * 60 * 1000),
  loginRateLimit: { windowMs: int(env.LOGIN_RATE_WINDOW_MS, 15 * 60 * 1000), max: int(env.LOGIN_RATE_MAX, 10) },
  /** Sign-ups per IP address per window. */
  signupRateLimit: { windowMs: int(env.SIGNUP_RATE_WINDOW_MS, 60 * 60 * 1000), max: int(env.SIGNUP_RATE_MAX, 5) },
  uploadsDir: path.resolve(env.UPLOADS_DIR ?? path.join(projectRoot, '.data', 'uploads')),
  clientDist: path.join(projectRoot, 'dist'),
  payments: {
    secretKey: env.PAYMENTS_SECRET_KEY ?? 'sk_test_browseline_local',
    webhookSecret: env.PAYMENTS_WEBHOOK_SECRET ?? 'whsec_browseline_local',
    /** Empty string means the real hosted service; set by default to the local fake. */
    apiBase: env.PAYMENTS_API_BASE ?? `http://127.0.0.1:${int(env.PAYMENTS_FAKE_PORT, 12111)}`,
  },
} as const;

export type AppConfig = typeof config;
