/** Clients of the firm. */
import { Op, type WhereOptions } from 'sequelize';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Client, User } from '../models';
import { presentTeamMember } from '../presenters/user';
import { clientStats } from '../queries/clients';
import { ClientCreateSchema, ClientListQuerySchema, ClientUpdateSchema } from '../../shared/schemas/client';
import { IdParamsSchema, pageOf } from '../../shared/schemas/common';
import { presentClient } from '../presenters/client';
import { actor, findInFirm } from '../policies/firm-scope';
import { createClient, updateClient } from '../commands/client-writer';

const r = defineRoutes('/clients');

const NONE = { propertyCount: 0, totalAcres: 0 };

r.get('/', STAFF, ...typed({ query: ClientListQuerySchema }, async ({ query }, req, res) => {
  const { firmId } = actor(req);
  const { q } = query;
  const where: WhereOptions = q ? { firmId, [Op.or]: [{ name: { [Op.iLike]: `%${q}%` } }, { email: { [Op.iLike]: `%${q}%` } }] } : { firmId };
  const { rows: clients, count } = await Client.findAndCountAll({ where, order: [['name', 'ASC'], ['id', 'ASC']], limit: query.limit, offset: query.offset });
  const stats = await clientStats(firmId, clients.map((c) => c.id));
  res.json({ data: clients.map((c) => presentClient(c, stats.get(c.id) ?? NONE)), page: pageOf(query, count) });
}));

r.post('/', STAFF, ...typed({ body: ClientCreateSchema }, async ({ body }, req, res) => {
  const me = actor(req);
  const client = await createClient(me, body, req.ip ?? null);
  res.status(201).json({ data: presentClient(client, NONE) });
}));

r.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const client = await findInFirm(Client, params.id, firmId, 'That client');
  const stats = await clientStats(firmId, [client.id]);
  res.json({ data: presentClient(client, stats.get(client.id) ?? NONE) });
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: ClientUpdateSchema }, async ({ params, body }, req, res) => {
  const me = actor(req);
  const client = await updateClient(me, params.id, body, req.ip ?? null);
  const stats = await clientStats(me.firmId, [client.id]);
  res.json({ data: presentClient(client, stats.get(client.id) ?? NONE) });
}));

r.get('/:id/contacts', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const client = await findInFirm(Client, params.id, firmId, 'That client');
  const contacts = await User.findAll({ where: { firmId, clientId: client.id, role: 'client' }, order: [['name', 'ASC']] });
  res.json({ data: contacts.map(presentTeamMember) });
}));

export const clientsRouter = r.router;
