/** The consultant's Desk: what needs attention this week (the read lives in server/queries/desk.ts). */
import { defineRoutes, STAFF } from '../middlewares/access';
import { actor } from '../policies/firm-scope';
import { readDesk } from '../queries/desk';

const r = defineRoutes('/desk');

r.get('/', STAFF, async (req, res) => {
  const { firmId, firmTimezone } = actor(req);
  res.json({ data: await readDesk(firmId, firmTimezone) });
});

export const deskRouter = r.router;
