import { describe, expect, it } from 'vitest';
import { routeRegistry } from '../../server/middlewares/access';
import { anonymousAgent, signedInAgent, testApp } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';

// Routes anyone may call without a session.
// The calendar feed is public to whoever holds its unguessable token (calendar apps cannot sign in).
const PUBLIC_ALLOWED = [/^\/health/, /^\/auth\/(csrf|login|password-reset|invitations|verify-email)/, /^\/signup$/, /^\/signup\/places$/, /^\/webhooks\//, /^\/calendar\/:file$/];

const concrete = (path: string) => `/api${path.replace(/:token/g, 'x'.repeat(43)).replace(/:[a-zA-Z]+/g, '1')}`;

/** Counts the routes Express actually has under /api, through every mounted router. */
function countExpressRoutes(): number {
  const app = testApp() as unknown as { router: { stack: { handle?: { stack?: { route?: { methods: Record<string, boolean> } }[] } }[] } };
  let n = 0;
  for (const layer of app.router.stack) {
    for (const inner of layer.handle?.stack ?? []) {
      if (inner.route) n += Object.keys(inner.route.methods).filter((m) => m !== '_all').length;
    }
  }
  return n;
}

describe('every /api route declares who may call it', () => {
  it('registers every Express route through a declaration', () => {
    testApp();
    expect(routeRegistry.length).toBeGreaterThan(10);
    expect(countExpressRoutes()).toBe(routeRegistry.length);
  });

  it('declares public access only for health, sign-in, CSRF, tokens and webhooks', () => {
    const publicRoutes = routeRegistry.filter((r) => r.access === 'public');
    for (const r of publicRoutes) expect(PUBLIC_ALLOWED.some((re) => re.test(r.path)), `${r.method} ${r.path} is public`).toBe(true);
  });

  it('answers 401 to anonymous requests on every non-public route', async () => {
    const agent = await anonymousAgent();
    const checked: string[] = [];
    for (const r of routeRegistry.filter((x) => x.access !== 'public')) {
      const url = concrete(r.path);
      const res = await agent[r.method](url).set('X-CSRF-Token', agent.csrf).send({});
      expect(res.status, `${r.method.toUpperCase()} ${url}`).toBe(401);
      expect(res.body.error).toMatch(/sign in/i);
      checked.push(url);
    }
    expect(checked.length).toBeGreaterThan(5);
  });

  it('refuses crew and client on staff routes with 403, and allows consultants', async () => {
    const { users } = await makeFirm();
    const crew = await signedInAgent(users.crew.email, PASSWORD);
    const client = await signedInAgent(users.client.email, PASSWORD);
    const consultant = await signedInAgent(users.consultant.email, PASSWORD);
    expect((await crew.get('/api/clients')).status).toBe(403);
    expect((await client.get('/api/clients')).status).toBe(403);
    expect((await consultant.get('/api/clients')).status).toBe(200);
    const staffOnly = routeRegistry.filter((r) => Array.isArray(r.access) && !r.access.includes('crew') && !r.access.includes('client'));
    for (const r of staffOnly) {
      const res = await crew[r.method](concrete(r.path)).set('X-CSRF-Token', crew.csrf).send({});
      expect(res.status, `crew ${r.method} ${r.path}`).toBe(403);
    }
  });
});
