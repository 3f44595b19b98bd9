/** The header search over the firm's clients, properties, proposals, invoices and contacts. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { SearchQuerySchema } from '../../shared/schemas/search';
import { searchFirm } from '../queries/search';
import { actor } from '../policies/firm-scope';
import { badRequest } from '../errors';
import { describeZodError } from '../middlewares/error-handler';

const r = defineRoutes('/search');

r.get('/', STAFF, async (req, res) => {
  const parsed = SearchQuerySchema.safeParse(req.query);
  if (!parsed.success) throw badRequest(describeZodError(parsed.error).message);
  res.json({ data: await searchFirm(actor(req).firmId, parsed.data.q) });
});

export const searchRouter = r.router;
