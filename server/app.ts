/** createApp(): the Express application without listen, for the server and for tests. */
import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
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
import { allowedTileOrigins } from './services/imagery/tile-origins';
import { clientAssets, compressAnswers } from './middlewares/static-assets';
import './models';

let sessionPool: pg.Pool | null = null;
/** The pg pool the session store uses (one per process). */
function sessionStorePool(): pg.Pool {
  if (!sessionPool) sessionPool = new pg.Pool({ connectionString: config.databaseUrl, max: 5 });
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

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:', () => allowedTileOrigins().join(' ')],
          fontSrc: ["'self'", 'data:'],
          // Firms may set an imagery tile service; its origin is allowed, nothing else.
          connectSrc: ["'self'", () => allowedTileOrigins().join(' ')],
          workerSrc: ["'self'", 'blob:'],
          childSrc: ["'self'", 'blob:'],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: config.cookieSecure,
    }),
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

  const PgStore = connectPgSimple(session);
  // Signed webhooks are verified on the exact bytes sent, so this path takes its body raw, before the JSON parser.
  app.use('/api/webhooks/payments', express.raw({ type: 'application/json', limit: LIMITS.jsonBodyBytes }));
  app.use(
    '/api',
    express.json({ limit: LIMITS.jsonBodyBytes }),
    session({
      name: 'browseline.sid',
      // No touch on every request: a session lasts 14 days from sign-in, and reads stay reads.
      store: new PgStore({ pool: sessionStorePool(), tableName: 'session', createTableIfMissing: false, disableTouch: true, pruneSessionInterval: config.isTest ? false : 15 * 60 }),
      secret: config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.cookieSecure, maxAge: 14 * 24 * 3600 * 1000 },
    }),
    passport.session(),
    csrfProtection,
  );

  for (const { path: mount, router } of apiRouters) app.use(`/api${mount}`, router);
  app.use('/api', (req, _res, next) => next(notFound(`The API path ${req.method} ${req.originalUrl.split('?')[0]}`)));

  if (fs.existsSync(path.join(config.clientDist, 'index.html'))) app.use(clientAssets(config.clientDist, { production: config.isProduction }));

  app.use(errorHandler);
  return app;
}
