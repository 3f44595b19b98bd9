/** createApp(): the Express application without listen, for the server and for tests. */
import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import session from 'express-session';
import { SessionStore } from './services/auth/session-store';
import pg from 'pg';
import { pinoHttp } from 'pino-http';
import { config } from './config';
import { logger } from './logger';
import { passport } from './services/auth/passport';
import { csrfProtection } from './middlewares/csrf';
import { errorHandler } from './middlewares/error-handler';
import { notFound } from './errors';
import { LIMITS } from '../shared/limits';
import { apiRouters } from './routes';
import { closeConnectionsWhileDraining } from './lifecycle';
import { contentSecurityPolicy, firmContentSecurityPolicy, PERMISSIONS_POLICY } from './middlewares/content-security-policy';
import { idleTimeout } from './middlewares/idle-timeout';
import { clientAssets, compressAnswers } from './middlewares/static-assets';
import './models';

let sessionPool: pg.Pool | null = null;
/** The pg pool the session store uses (one per process). */
function sessionStorePool(): pg.Pool {
  if (!sessionPool) {
    sessionPool = new pg.Pool({ connectionString: config.databaseUrl, max: 5, connectionTimeoutMillis: 5000 });
    // An idle client whose server went away emits 'error'; without a listener Node would exit.
    sessionPool.on('error', (err) => logger.warn({ err: err.message }, 'session store: an idle database connection was lost'));
  }
  return sessionPool;
}

/** Closes the session store's pool (tests and shutdown). */
export async function closeSessionPool(): Promise<void> {
  if (sessionPool) await sessionPool.end();
  sessionPool = null;
}

/** Builds the application: security headers, sessions in PostgreSQL, the API, the built client. */
export function createApp(): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  // Shutting down: answers ask keep-alive clients to reconnect (to another instance).
  app.use(closeConnectionsWhileDraining);

  app.use(
    helmet({
      // The strict policy by default; firmContentSecurityPolicy widens it per request for the firm's own tile service.
      contentSecurityPolicy: false,
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: config.cookieSecure,
    }),
    (_req, res, next) => {
      res.setHeader('Content-Security-Policy', contentSecurityPolicy());
      res.setHeader('Permissions-Policy', PERMISSIONS_POLICY);
      next();
    },
  );

  app.use(compressAnswers());

  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') || req.url === '/api/health' },
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    }),
  );

  // The session's read also reads its user and firm settings (one round trip per signed-in request).
  const sessionStore = new SessionStore({ pool: sessionStorePool(), errorLog: (...args: unknown[]) => logger.warn({ args: args.map(String) }, 'session store error'), tableName: 'session', createTableIfMissing: false, disableTouch: true, pruneSessionInterval: config.isTest ? false : 15 * 60 });
  // Expired rows go now and every 15 minutes after (the store's own timer starts with its first prune).
  if (!config.isTest) sessionStore.pruneSessions();
  // Signed webhooks are verified on the exact bytes sent, so this path takes its body raw, before the JSON parser.
  app.use('/api/webhooks/payments', express.raw({ type: 'application/json', limit: LIMITS.jsonBodyBytes }));
  // API answers are about one person's data at one moment: no browser or proxy keeps them (a route may say otherwise).
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  const sessions = [
    session({
      name: 'browseline.sid',
      // No touch on every request: a session lasts 14 days from sign-in, and reads stay reads.
      store: sessionStore,
      secret: config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: 14 * 24 * 3600 * 1000 },
    }),
    passport.session(),
    idleTimeout,
    firmContentSecurityPolicy,
  ];
  app.use('/api', express.json({ limit: LIMITS.jsonBodyBytes }), ...sessions, csrfProtection);

  for (const { path: mount, router } of apiRouters) app.use(`/api${mount}`, router);
  app.use('/api', (req, _res, next) => next(notFound(`The API path ${req.method} ${req.originalUrl.split('?')[0]}`)));

  // The page itself carries the firm's policy (the map's tiles load under it), so it reads the session too.
  if (fs.existsSync(path.join(config.clientDist, 'index.html'))) app.use(clientAssets(config.clientDist, { production: config.isProduction, beforePage: sessions }));

  app.use(errorHandler);
  return app;
}
