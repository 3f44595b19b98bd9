/** The practice library: materials, service rates and practices of the firm. */
import { z } from 'zod';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Material, Practice, Prescription, ServiceRateEntry } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { MATERIAL_KINDS, MaterialCreateSchema, PracticeCreateSchema, PracticeUpdateSchema, RateCreateSchema, RateUpdateSchema } from '../../shared/schemas/library';
import { materialKind, presentMaterial, presentPractice, presentRate } from '../presenters/library';
import { actor, findInFirm } from '../policies/firm-scope';
import { newLibraryKey, toMaterialDefinition } from '../commands/material-writer';
import { loadLibrary } from '../services/library/library-reader';
import { validatePracticeDefinition, type PracticeDefinition } from '../../shared/domain/practice';
import { validateServiceRate, type ServiceRate } from '../../shared/domain/service-rates';
import { conflict, unprocessable } from '../errors';

const materials = defineRoutes('/materials');
const rates = defineRoutes('/rates');
const practices = defineRoutes('/practices');

// ---- materials ----

const MaterialListQuery = z.object({ kind: z.enum(MATERIAL_KINDS).optional(), includeArchived: z.enum(['true', 'false']).optional() });

materials.get('/', STAFF, ...typed({ query: MaterialListQuery }, async ({ query }, req, res) => {
  const { kind, includeArchived } = query;
  const rows = await Material.findAll({ where: { firmId: actor(req).firmId, ...(includeArchived === 'true' ? {} : { archived: false }) }, order: [['name', 'ASC']] });
  res.json({ data: rows.map(presentMaterial).filter((m) => !kind || m.kind === kind) });
}));

materials.post('/', STAFF, ...typed({ body: MaterialCreateSchema }, async ({ body }, req, res) => {
  const { firmId } = actor(req);
  const key = newLibraryKey(body.kind, body.name);
  const definition = toMaterialDefinition(body, key);
  const row = await Material.create({ firmId, key, name: definition.name, definition });
  res.status(201).json({ data: presentMaterial(row) });
}));

materials.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: presentMaterial(await findInFirm(Material, params.id, actor(req).firmId, 'That material')) });
}));

materials.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: MaterialCreateSchema }, async ({ params, body }, req, res) => {
  const row = await findInFirm(Material, params.id, actor(req).firmId, 'That material');
  if (materialKind(row.definition.type) !== body.kind) throw unprocessable(`kind: this material is ${materialKind(row.definition.type)}; add a new material instead of changing its kind.`);
  const definition = toMaterialDefinition(body, row.key);
  await row.update({ name: definition.name, definition });
  res.json({ data: presentMaterial(row) });
}));

/** Names of the firm's practices that use a library key (material or rate). */
async function practicesUsing(firmId: number, key: string): Promise<string[]> {
  const all = await Practice.findAll({ where: { firmId, archived: false } });
  return all.filter((p) => JSON.stringify(p.definition.steps).includes(`"${key}"`)).map((p) => p.name);
}

materials.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Material, params.id, firmId, 'That material');
  const users = await practicesUsing(firmId, row.key);
  if (users.length) throw conflict(`“${row.name}” is used by ${users.slice(0, 3).join(', ')}${users.length > 3 ? ' and others' : ''}. Change those practices first.`);
  // Prescriptions keep pointing at the key, so the entry is archived rather than deleted.
  await row.update({ archived: true });
  res.status(204).end();
}));

// ---- service rates ----

const RateListQuery = z.object({ includeArchived: z.enum(['true', 'false']).optional() });

rates.get('/', STAFF, ...typed({ query: RateListQuery }, async ({ query }, req, res) => {
  const { includeArchived } = query;
  const rows = await ServiceRateEntry.findAll({ where: { firmId: actor(req).firmId, ...(includeArchived === 'true' ? {} : { archived: false }) }, order: [['name', 'ASC']] });
  res.json({ data: rows.map(presentRate) });
}));

rates.post('/', STAFF, ...typed({ body: RateCreateSchema }, async ({ body }, req, res) => {
  const { firmId } = actor(req);
  const key = newLibraryKey('rate', body.name);
  const definition = { key, ...body };
  validateServiceRate(definition, 'rate');
  const row = await ServiceRateEntry.create({ firmId, key, name: definition.name, definition });
  res.status(201).json({ data: presentRate(row) });
}));

rates.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: RateUpdateSchema }, async ({ params, body }, req, res) => {
  const row = await findInFirm(ServiceRateEntry, params.id, actor(req).firmId, 'That rate');
  const { minimumCents, ...changes } = body;
  const definition: ServiceRate = { ...row.definition, ...changes, key: row.key };
  if (minimumCents === null) delete definition.minimumCents;
  else if (minimumCents !== undefined) definition.minimumCents = minimumCents;
  validateServiceRate(definition, 'rate');
  await row.update({ name: definition.name, definition });
  res.json({ data: presentRate(row) });
}));

rates.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(ServiceRateEntry, params.id, firmId, 'That rate');
  const users = await practicesUsing(firmId, row.key);
  if (users.length) throw conflict(`“${row.name}” is used by ${users.slice(0, 3).join(', ')}. Change those practices first.`);
  await row.update({ archived: true });
  res.status(204).end();
}));

// ---- practices ----

practices.get('/', STAFF, async (req, res) => {
  const { firmId } = actor(req);
  const [rows, library] = await Promise.all([Practice.findAll({ where: { firmId, archived: false }, order: [['name', 'ASC']] }), loadLibrary(firmId)]);
  res.json({ data: rows.map((p) => presentPractice(p, library.materials)) });
});

/** Validates a practice against the firm's library; answers the library for presenting it. */
async function checkedPractice(firmId: number, definition: PracticeDefinition) {
  const library = await loadLibrary(firmId);
  validatePracticeDefinition(definition, library.materials, library.rates);
  return { definition, library };
}

practices.post('/', STAFF, ...typed({ body: PracticeCreateSchema }, async ({ body }, req, res) => {
  const { firmId } = actor(req);
  const key = newLibraryKey('practice', body.name);
  const { definition, library } = await checkedPractice(firmId, { ...(body as Omit<PracticeDefinition, 'key'>), key });
  const row = await Practice.create({ firmId, key, name: definition.name, definition });
  res.status(201).json({ data: presentPractice(row, library.materials) });
}));

practices.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, params.id, firmId, 'That practice');
  res.json({ data: presentPractice(row, (await loadLibrary(firmId)).materials) });
}));

practices.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: PracticeUpdateSchema }, async ({ params, body }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, params.id, firmId, 'That practice');
  const { definition, library } = await checkedPractice(firmId, { ...row.definition, ...(body as Partial<PracticeDefinition>), key: row.key });
  await row.update({ name: definition.name, definition });
  res.json({ data: presentPractice(row, library.materials) });
}));

practices.post('/:id/duplicate', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, params.id, firmId, 'That practice');
  const key = newLibraryKey('practice', row.name);
  const name = `${row.name} (copy)`.slice(0, 120);
  const copy = await Practice.create({ firmId, key, name, definition: { ...row.definition, key, name } });
  res.status(201).json({ data: presentPractice(copy, (await loadLibrary(firmId)).materials) });
}));

practices.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, params.id, firmId, 'That practice');
  const inUse = await Prescription.count({ where: { firmId, practiceId: row.id } });
  await row.update({ archived: true });
  res.status(200).json({ data: { archived: true, prescriptionsKept: inUse } });
}));

export const materialsRouter = materials.router;
export const ratesRouter = rates.router;
export const practicesRouter = practices.router;
