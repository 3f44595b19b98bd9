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
  /**
   * The owner's reader of captured mail (/api/dev/mail): off unless DEV_MAIL_READER=true, and the
   * server refuses to start with it in production (see configurationProblems).
   */
  devMailReader: env.DEV_MAIL_READER === 'true',
  /** The local SMTP capture server's HTTP reader (development only). */
  mailCaptureUrl: env.MAIL_CAPTURE_URL ?? `http://127.0.0.1:${int(env.MAIL_CAPTURE_HTTP_PORT, 1081)}`,
  outboxPollMs: int(env.OUTBOX_POLL_MS, 2000),
  /** How often the server looks for overdue invoices to remind (default hourly). */
  reminderPollMs: int(env.REMINDER_POLL_MS, 60 * 60 * 1000),
  loginRateLimit: {
    windowMs: int(env.LOGIN_RATE_WINDOW_MS, 15 * 60 * 1000),
    /** Failed sign-ins per address and account in the window. */
    max: int(env.LOGIN_RATE_MAX, 10),
    /** Failed sign-ins per account, from all addresses together, in the window. */
    accountMax: int(env.LOGIN_ACCOUNT_RATE_MAX, 30),
  },
  /** Sign-ups per IP address per window. */
  signupRateLimit: { windowMs: int(env.SIGNUP_RATE_WINDOW_MS, 60 * 60 * 1000), max: int(env.SIGNUP_RATE_MAX, 5) },
  /** A sign-up answers no sooner than this after it arrives, so a used address takes as long as a new one. */
  signupAnswerFloorMs: int(env.SIGNUP_ANSWER_FLOOR_MS, 1000),
  uploadsDir: path.resolve(env.UPLOADS_DIR ?? path.join(projectRoot, '.data', 'uploads')),
  /** Where files live: 'disk' (UPLOADS_DIR, one machine) or 's3' (object storage shared by every instance). */
  storage: {
    kind: (env.STORAGE === 's3' ? 's3' : 'disk') as 'disk' | 's3',
    s3: {
      bucket: env.S3_BUCKET ?? 'browseline',
      region: env.S3_REGION ?? 'us-east-1',
      endpoint: env.S3_ENDPOINT ?? '',
      accessKeyId: env.S3_ACCESS_KEY_ID ?? env.AWS_ACCESS_KEY_ID ?? '',
      secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? env.AWS_SECRET_ACCESS_KEY ?? '',
      forcePathStyle: env.S3_FORCE_PATH_STYLE ? env.S3_FORCE_PATH_STYLE === 'true' : undefined,
      prefix: env.S3_PREFIX ?? '',
    },
  },
  /** Migrations at start-up (one machine); production runs `npm run db:migrate` as its own step and sets false. */
  migrateOnStart: env.MIGRATE_ON_START !== 'false',
  /** A direct connection (not through PgBouncer) for migrations and their advisory lock. */
  migrationDatabaseUrl: env.MIGRATION_DATABASE_URL || env.DATABASE_URL || 'postgres://postgres@127.0.0.1:54329/browseline',
  /** How long a SIGTERM waits for requests in flight (and running jobs) before closing anyway. */
  shutdownGraceMs: int(env.SHUTDOWN_GRACE_MS, 25_000),
  /** Background jobs (pg-boss): run the workers in this process ('true') or only in `npm run worker`. */
  jobs: {
    workersInApp: env.JOB_WORKERS_IN_APP !== 'false',
    schema: env.JOB_SCHEMA ?? 'pgboss',
    pollSeconds: Math.max(0.5, Number(env.JOB_POLL_SECONDS ?? 2) || 2),
    /** How long a request that started a job waits for it before answering 202 with the job to poll. */
    waitMs: int(env.JOB_WAIT_MS, 20_000),
  },
  clientDist: path.join(projectRoot, 'dist'),
  payments: {
    secretKey: env.PAYMENTS_SECRET_KEY ?? 'sk_test_browseline_local',
    webhookSecret: env.PAYMENTS_WEBHOOK_SECRET ?? 'whsec_browseline_local',
    /** Empty string means the real hosted service; set by default to the local fake. */
    apiBase: env.PAYMENTS_API_BASE ?? `http://127.0.0.1:${int(env.PAYMENTS_FAKE_PORT, 12111)}`,
  },
} as const;

export type AppConfig = typeof config;

/** Settings the server refuses to start with: each a sentence saying what to change. */
export function configurationProblems(c: Pick<AppConfig, 'isProduction' | 'devMailReader'>): string[] {
  const problems: string[] = [];
  if (c.isProduction && c.devMailReader) problems.push('DEV_MAIL_READER=true is refused with NODE_ENV=production: the captured-mail reader shows sign-in links. Unset it.');
  return problems;
}
