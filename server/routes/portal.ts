/**
 * What the client portal reads. Clients see only their own client's records; staff of the same firm
 * may preview a client's portal through /portal/preview/:clientId/… — the same answers, read with the
 * client's scope, without ever signing in as the client.
 */
import type { Request } from 'express';
import { z } from 'zod';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Client, Firm, Property } from '../models';
import { actor, findInFirm } from '../policies/firm-scope';
import { forbidden } from '../errors';
import { IdSchema } from '../../shared/schemas/common';
import type { PortalHome } from '../../shared/schemas/desk';
import { readPortalProperties, readPortalProperty, type PortalScope } from '../services/portal/portal-reader';
import { clientVisibleFiles } from '../services/files/file-reader';

const r = defineRoutes('/portal');

const PropertyParamsSchema = z.object({ id: IdSchema });
const PreviewParamsSchema = z.object({ clientId: IdSchema });
const PreviewPropertyParamsSchema = z.object({ clientId: IdSchema, id: IdSchema });

/** The signed-in client's scope. */
function ownScope(req: Request): PortalScope {
  const me = actor(req);
  if (!me.clientId) throw forbidden();
  return { firmId: me.firmId, clientId: me.clientId };
}

/** A staff member's preview scope: the client must be of their firm (404 otherwise). */
async function previewScope(req: Request, clientId: number): Promise<PortalScope> {
  const me = actor(req);
  const client = await findInFirm(Client, clientId, me.firmId, 'That client');
  return { firmId: me.firmId, clientId: client.id };
}

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

r.get('/properties', ['client'], async (req, res) => {
  res.json({ data: await readPortalProperties(ownScope(req)) });
});

r.get('/properties/:id', ['client'], ...typed({ params: PropertyParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readPortalProperty(ownScope(req), params.id) });
}));

r.get('/preview/:clientId/properties', STAFF, ...typed({ params: PreviewParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readPortalProperties(await previewScope(req, params.clientId)) });
}));

r.get('/preview/:clientId/properties/:id', STAFF, ...typed({ params: PreviewPropertyParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readPortalProperty(await previewScope(req, params.clientId), params.id) });
}));

r.get('/preview/:clientId/files', STAFF, ...typed({ params: PreviewParamsSchema }, async ({ params }, req, res) => {
  const scope = await previewScope(req, params.clientId);
  res.json({ data: await clientVisibleFiles(scope.firmId, scope.clientId) });
}));

export const portalRouter = r.router;
