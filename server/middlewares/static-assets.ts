/**
 * The built client and compressed answers.
 *
 * - `compressAnswers()`: brotli or gzip for every compressible answer (JSON, HTML, …); an answer
 *   that already carries a Content-Encoding (a pre-compressed asset or cached body) is left alone.
 * - `clientAssets(dist)`: hashed files under /assets are served from the build's `.br`/`.gz` twins
 *   with immutable caching; a missing asset is a 404, never the HTML page; source maps are not
 *   served in production; the service worker and manifest are always revalidated; `/login` answers
 *   index.html (the sign-in page) and every other GET src/app.html (the app), both revalidated on each
 *   load (no-cache + ETag).
 */
import fs from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type NextFunction, type Request, type RequestHandler, type Response, type Router } from 'express';

/** Compresses dynamic answers (brotli preferred, gzip otherwise) above 1 KB; skips what is already encoded. */
export function compressAnswers() {
  return compression({ threshold: 1024 });
}

/** The encodings the build writes beside each text asset, in order of preference. */
const PRECOMPRESSED = [
  { encoding: 'br', suffix: '.br' },
  { encoding: 'gzip', suffix: '.gz' },
] as const;

const IMMUTABLE = 'public, max-age=31536000, immutable';
/** Files whose name never changes between versions: the browser must ask every time. */
const ALWAYS_REVALIDATE = new Set(['/sw.js', '/registerSW.js', '/manifest.webmanifest', '/index.html', '/src/app.html']);

/** Picks the pre-compressed twin of an asset the browser accepts, or none. */
export function pickEncoding(acceptEncoding: string | undefined, available: (suffix: string) => boolean): { encoding: string; suffix: string } | null {
  const accepted = new Set(
    (acceptEncoding ?? '')
      .split(',')
      .map((part) => part.trim().split(';'))
      .filter(([, q]) => !q || Number.parseFloat(q.split('=')[1] ?? '1') > 0)
      .map(([name]) => name.trim().toLowerCase()),
  );
  for (const choice of PRECOMPRESSED) if (accepted.has(choice.encoding) && available(choice.suffix)) return choice;
  return null;
}

const notFoundText = (res: Response, what: string) => res.status(404).type('text/plain').set('Cache-Control', 'no-store').send(`${what} is not part of this version of Browseline. Reload the page to get the current version.`);

/** Serves the built client from `dist` (see the module comment). */
export function clientAssets(dist: string, options: { production: boolean; beforePage?: RequestHandler[] }): Router {
  const router = express.Router();
  const assetsDir = path.join(dist, 'assets');
  const exists = (file: string) => {
    try {
      return fs.statSync(file).isFile();
    } catch {
      return false;
    }
  };

  router.use((req: Request, res: Response, next: NextFunction) => {
    if (options.production && req.path.endsWith('.map')) return notFoundText(res, 'This file');
    next();
  });

  // A middleware, not a route: the route registry (defineRoutes) holds the API's routes only.
  router.use('/assets', (req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    let relative: string;
    try {
      relative = decodeURIComponent(req.path.slice(1));
    } catch {
      return notFoundText(res, 'This file');
    }
    const file = path.resolve(assetsDir, relative);
    if (!file.startsWith(assetsDir + path.sep) || !exists(file)) return notFoundText(res, `The file /assets/${relative}`);
    const choice = pickEncoding(req.get('accept-encoding'), (suffix) => exists(file + suffix));
    res.setHeader('Vary', 'Accept-Encoding');
    res.type(path.extname(file));
    const headers: Record<string, string> = { 'Cache-Control': IMMUTABLE };
    if (choice) headers['Content-Encoding'] = choice.encoding;
    res.sendFile(choice ? file + choice.suffix : file, { headers, cacheControl: false }, (err) => {
      if (err && !res.headersSent) next(err);
    });
  });

  router.use(
    express.static(dist, {
      index: false,
      maxAge: '1h',
      setHeaders: (res, filePath) => {
        const name = `/${path.relative(dist, filePath).split(path.sep).join('/')}`;
        if (ALWAYS_REVALIDATE.has(name)) res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );

  // index.html is the small sign-in page; src/app.html is the app, for every other address.
  const appPage = exists(path.join(dist, 'src/app.html')) ? 'src/app.html' : 'index.html';
  router.use((req: Request, _res: Response, next: NextFunction) => (req.method === 'GET' || req.method === 'HEAD' ? next() : next('router')), ...(options.beforePage ?? []), (req: Request, res: Response) => {
    const page = req.path === '/login' ? 'index.html' : appPage;
    res.sendFile(path.join(dist, page), { headers: { 'Cache-Control': 'no-cache' } });
  });
  return router;
}
