/** Properties of the firm: list, create, read, edit, delete. Units, imports, exports and the printed plan have their own route files. */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Property } from '../models';
import { IdParamsSchema, pageOf } from '../../shared/schemas/common';
import { PropertyCreateSchema, PropertyListQuerySchema, PropertyUpdateSchema } from '../../shared/schemas/property';
import { actor, findInFirm } from '../policies/firm-scope';
import { createProperty, deleteProperty, updateProperty } from '../commands/property-writer';
import { listProperties, propertyAnswer } from '../queries/properties';

const r = defineRoutes('/properties');

r.get('/', STAFF, ...typed({ query: PropertyListQuerySchema }, async ({ query }, req, res) => {
  const { rows, total } = await listProperties(actor(req).firmId, query);
  res.json({ data: rows, page: pageOf(query, total) });
}));

r.post('/', STAFF, ...typed({ body: PropertyCreateSchema }, async ({ body }, req, res) => {
  const me = actor(req);
  const property = await createProperty(me, body, req.ip ?? null);
  res.status(201).json({ data: await propertyAnswer(me.firmId, property) });
}));

r.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, params.id, firmId, 'That property');
  res.json({ data: await propertyAnswer(firmId, property) });
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: PropertyUpdateSchema }, async ({ params, body }, req, res) => {
  const me = actor(req);
  const property = await updateProperty(me, params.id, body, req.ip ?? null);
  res.json({ data: await propertyAnswer(me.firmId, property) });
}));

r.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deleteProperty(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

export const propertiesRouter = r.router;
