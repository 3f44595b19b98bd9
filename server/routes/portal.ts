/** What the client portal reads. Clients see only their own client's records. */
import { defineRoutes } from '../middlewares/access';
import { Client, Firm, Property } from '../models';
import { actor } from '../policies/firm-scope';
import { forbidden } from '../errors';
import type { PortalHome } from '../../shared/schemas/desk';

const r = defineRoutes('/portal');

r.get('/home', ['client'], async (req, res) => {
  const me = actor(req);
  if (!me.clientId) throw forbidden();
  const [client, firm, properties] = await Promise.all([
    Client.findOne({ where: { id: me.clientId, firmId: me.firmId } }),
    Firm.findByPk(me.firmId),
    Property.findAll({ where: { clientId: me.clientId, firmId: me.firmId }, order: [['name', 'ASC']], attributes: ['id', 'name', 'acres', 'county', 'state', 'objectives'] }),
  ]);
  if (!client) throw forbidden();
  const body: PortalHome = {
    client: { id: client.id, name: client.name },
    firm: { name: firm?.name ?? '', email: firm?.email ?? null, phone: firm?.phone ?? null },
    properties: properties.map((p) => ({ id: p.id, name: p.name, acres: p.acres, county: p.county, state: p.state, objectives: p.objectives })),
  };
  res.json({ data: body });
});

export const portalRouter = r.router;
