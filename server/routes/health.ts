/** GET /api/health: the server and its database. */
import { defineRoutes } from '../middlewares/access';
import { databaseIsUp } from '../db/sequelize';

const r = defineRoutes('/health');

r.get('/', 'public', async (_req, res) => {
  const up = await databaseIsUp();
  res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', database: up ? 'ok' : 'unreachable' });
});

export const healthRouter = r.router;
