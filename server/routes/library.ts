/** The practice library: materials, service rates and practices of the firm. */
import { z } from 'zod';
import { defineRoutes, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { Material, Practice, Prescription, ServiceRateEntry } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { MATERIAL_KINDS, MaterialCreateSchema, PracticeCreateSchema, PracticeUpdateSchema, RateCreateSchema, RateUpdateSchema } from '../../shared/schemas/library';
import { materialKind, presentMaterial, presentPractice, presentRate } from '../presenters/library';
import { actor, findInFirm } from '../policies/firm-scope';
import { newLibraryKey, toMaterialDefinition } from '../commands/material-writer';
import { loadLibrary } from '../services/library/library-reader';
import { validatePracticeDefinition, type PracticeDefinition } from '../../shared/domain/practice';
import { validateServiceRate } from '../../shared/domain/service-rates';
import { conflict, unprocessable } from '../errors';

const materials = defineRoutes('/materials');
const rates = defineRoutes('/rates');
const practices = defineRoutes('/practices');

// ---- materials ----

const MaterialListQuery = z.object({ kind: z.enum(MATERIAL_KINDS).optional(), includeArchived: z.enum(['true', 'false']).optional() });

materials.get('/', STAFF, validate({ query: MaterialListQuery }), async (req, res) => {
  const { kind, includeArchived } = req.validQuery as z.infer<typeof MaterialListQuery>;
  const rows = await Material.findAll({ where: { firmId: actor(req).firmId, ...(includeArchived === 'true' ? {} : { archived: false }) }, order: [['name', 'ASC']] });
  res.json({ data: rows.map(presentMaterial).filter((m) => !kind || m.kind === kind) });
});

materials.post('/', STAFF, validate({ body: MaterialCreateSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const key = newLibraryKey(req.body.kind, req.body.name);
  const definition = toMaterialDefinition(req.body, key);
  const row = await Material.create({ firmId, key, name: definition.name, definition });
  res.status(201).json({ data: presentMaterial(row) });
});

materials.get('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  res.json({ data: presentMaterial(await findInFirm(Material, Number(req.params.id), actor(req).firmId, 'That material')) });
});

materials.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: MaterialCreateSchema }), async (req, res) => {
  const row = await findInFirm(Material, Number(req.params.id), actor(req).firmId, 'That material');
  if (materialKind(row.definition.type) !== req.body.kind) throw unprocessable(`kind: this material is ${materialKind(row.definition.type)}; add a new material instead of changing its kind.`);
  const definition = toMaterialDefinition(req.body, row.key);
  await row.update({ name: definition.name, definition });
  res.json({ data: presentMaterial(row) });
});

/** Names of the firm's practices that use a library key (material or rate). */
async function practicesUsing(firmId: number, key: string): Promise<string[]> {
  const all = await Practice.findAll({ where: { firmId, archived: false } });
  return all.filter((p) => JSON.stringify(p.definition.steps).includes(`"${key}"`)).map((p) => p.name);
}

materials.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Material, Number(req.params.id), firmId, 'That material');
  const users = await practicesUsing(firmId, row.key);
  if (users.length) throw conflict(`“${row.name}” is used by ${users.slice(0, 3).join(', ')}${users.length > 3 ? ' and others' : ''}. Change those practices first.`);
  // Prescriptions keep pointing at the key, so the entry is archived rather than deleted.
  await row.update({ archived: true });
  res.status(204).end();
});

// ---- service rates ----

const RateListQuery = z.object({ includeArchived: z.enum(['true', 'false']).optional() });

rates.get('/', STAFF, validate({ query: RateListQuery }), async (req, res) => {
  const { includeArchived } = req.validQuery as z.infer<typeof RateListQuery>;
  const rows = await ServiceRateEntry.findAll({ where: { firmId: actor(req).firmId, ...(includeArchived === 'true' ? {} : { archived: false }) }, order: [['name', 'ASC']] });
  res.json({ data: rows.map(presentRate) });
});

rates.post('/', STAFF, validate({ body: RateCreateSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const key = newLibraryKey('rate', req.body.name);
  const definition = { key, ...req.body };
  validateServiceRate(definition, 'rate');
  const row = await ServiceRateEntry.create({ firmId, key, name: definition.name, definition });
  res.status(201).json({ data: presentRate(row) });
});

rates.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: RateUpdateSchema }), async (req, res) => {
  const row = await findInFirm(ServiceRateEntry, Number(req.params.id), actor(req).firmId, 'That rate');
  const definition = { ...row.definition, ...req.body, key: row.key };
  if (req.body.minimumCents === null) delete definition.minimumCents;
  validateServiceRate(definition, 'rate');
  await row.update({ name: definition.name, definition });
  res.json({ data: presentRate(row) });
});

rates.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(ServiceRateEntry, Number(req.params.id), firmId, 'That rate');
  const users = await practicesUsing(firmId, row.key);
  if (users.length) throw conflict(`“${row.name}” is used by ${users.slice(0, 3).join(', ')}. Change those practices first.`);
  await row.update({ archived: true });
  res.status(204).end();
});

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

practices.post('/', STAFF, validate({ body: PracticeCreateSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const key = newLibraryKey('practice', req.body.name);
  const { definition, library } = await checkedPractice(firmId, { ...(req.body as Omit<PracticeDefinition, 'key'>), key });
  const row = await Practice.create({ firmId, key, name: definition.name, definition });
  res.status(201).json({ data: presentPractice(row, library.materials) });
});

practices.get('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, Number(req.params.id), firmId, 'That practice');
  res.json({ data: presentPractice(row, (await loadLibrary(firmId)).materials) });
});

practices.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: PracticeUpdateSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, Number(req.params.id), firmId, 'That practice');
  const { definition, library } = await checkedPractice(firmId, { ...row.definition, ...(req.body as Partial<PracticeDefinition>), key: row.key });
  await row.update({ name: definition.name, definition });
  res.json({ data: presentPractice(row, library.materials) });
});

practices.post('/:id/duplicate', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, Number(req.params.id), firmId, 'That practice');
  const key = newLibraryKey('practice', row.name);
  const name = `${row.name} (copy)`.slice(0, 120);
  const copy = await Practice.create({ firmId, key, name, definition: { ...row.definition, key, name } });
  res.status(201).json({ data: presentPractice(copy, (await loadLibrary(firmId)).materials) });
});

practices.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, Number(req.params.id), firmId, 'That practice');
  const inUse = await Prescription.count({ where: { firmId, practiceId: row.id } });
  await row.update({ archived: true });
  res.status(200).json({ data: { archived: true, prescriptionsKept: inUse } });
});

export const materialsRouter = materials.router;
export const ratesRouter = rates.router;
export const practicesRouter = practices.router;
