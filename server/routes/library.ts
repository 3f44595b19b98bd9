/** The practice library: materials, service rates and practices of the firm. */
import { z } from 'zod';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Material, Practice, ServiceRateEntry } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { MATERIAL_KINDS, MaterialCreateSchema, PracticeCreateSchema, PracticeUpdateSchema, RateCreateSchema, RateUpdateSchema } from '../../shared/schemas/library';
import { presentMaterial, presentPractice, presentRate } from '../presenters/library';
import { actor, findInFirm } from '../policies/firm-scope';
import { archiveMaterial, archivePractice, archiveRate, createMaterial, createPractice, createRate, duplicatePractice, updateMaterial, updatePractice, updateRate } from '../commands/library-writer';
import { loadLibrary } from '../services/library/library-reader';
import type { PracticeDefinition } from '../../shared/domain/practice';

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
  res.status(201).json({ data: presentMaterial(await createMaterial(actor(req), body, req.ip ?? null)) });
}));

materials.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: presentMaterial(await findInFirm(Material, params.id, actor(req).firmId, 'That material')) });
}));

materials.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: MaterialCreateSchema }, async ({ params, body }, req, res) => {
  res.json({ data: presentMaterial(await updateMaterial(actor(req), params.id, body, req.ip ?? null)) });
}));

materials.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  // Prescriptions keep pointing at the key, so the entry is archived rather than deleted.
  await archiveMaterial(actor(req), params.id, req.ip ?? null);
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
  res.status(201).json({ data: presentRate(await createRate(actor(req), body, req.ip ?? null)) });
}));

rates.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: RateUpdateSchema }, async ({ params, body }, req, res) => {
  res.json({ data: presentRate(await updateRate(actor(req), params.id, body, req.ip ?? null)) });
}));

rates.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await archiveRate(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

// ---- practices ----

practices.get('/', STAFF, async (req, res) => {
  const { firmId } = actor(req);
  const [rows, library] = await Promise.all([Practice.findAll({ where: { firmId, archived: false }, order: [['name', 'ASC']] }), loadLibrary(firmId)]);
  res.json({ data: rows.map((p) => presentPractice(p, library.materials)) });
});

practices.post('/', STAFF, ...typed({ body: PracticeCreateSchema }, async ({ body }, req, res) => {
  const { row, library } = await createPractice(actor(req), body as Omit<PracticeDefinition, 'key'>, req.ip ?? null);
  res.status(201).json({ data: presentPractice(row, library.materials) });
}));

practices.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const row = await findInFirm(Practice, params.id, firmId, 'That practice');
  res.json({ data: presentPractice(row, (await loadLibrary(firmId)).materials) });
}));

practices.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: PracticeUpdateSchema }, async ({ params, body }, req, res) => {
  const { row, library } = await updatePractice(actor(req), params.id, body as Partial<PracticeDefinition>, req.ip ?? null);
  res.json({ data: presentPractice(row, library.materials) });
}));

practices.post('/:id/duplicate', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const copy = await duplicatePractice(me, params.id, req.ip ?? null);
  res.status(201).json({ data: presentPractice(copy, (await loadLibrary(me.firmId)).materials) });
}));

practices.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const inUse = await archivePractice(actor(req), params.id, req.ip ?? null);
  res.status(200).json({ data: { archived: true, prescriptionsKept: inUse } });
}));

export const materialsRouter = materials.router;
export const ratesRouter = rates.router;
export const practicesRouter = practices.router;
