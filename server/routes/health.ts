/** GET /api/health: the server and its database. */
import { defineRoutes } from '../middlewares/access';
import { databaseIsUp } from '../db/sequelize';
import { isDraining } from '../lifecycle';

const r = defineRoutes('/health');

r.get('/', 'public', async (_req, res) => {
  // Shutting down: the load balancer takes this instance out while its requests finish.
  if (isDraining()) return res.status(503).json({ status: 'draining', database: 'ok' });
  const up = await databaseIsUp();
  res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', database: up ? 'ok' : 'unreachable' });
});

export const healthRouter = r.router;
