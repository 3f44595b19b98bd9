/** Field observations: log (multipart, idempotent), list, counts by unit or month, and their photos. */
import type { Request } from 'express';
import { defineRoutes } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { idempotencyKey } from '../middlewares/idempotency-key';
import { arrayUpload } from '../middlewares/upload';
import { Firm, Observation, ObservationPhoto, Property } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { ObservationCreateSchema, ObservationListQuerySchema, ObservationSummaryQuerySchema } from '../../shared/schemas/observation';
import { PHOTO_LIMITS } from '../../shared/limits';
import { actor, findInFirm } from '../policies/firm-scope';
import { logObservation, propertyForObservations, propertyToLogOn } from '../commands/observation-logger';
import { countObservations, listObservations } from '../queries/observations';
import { presentObservation, presentObservationSummary } from '../presenters/observation';
import { inspectPhoto } from '../services/photos';
import { usableZone } from '../services/clock';
import { sendStoredFile } from '../services/storage/storage';
import { notFound } from '../errors';

const perProperty = defineRoutes('/properties');
const photos = defineRoutes('/observation-photos');
/** Who logs: staff and crew; a client's contacts where the consultant allowed it (checked in the command). */
const LOGGERS = ['owner', 'consultant', 'crew', 'client'] as const;
const READERS = ['owner', 'consultant', 'crew', 'client'] as const;


async function zoneOf(firmId: number): Promise<string> {
  const firm = await Firm.findByPk(firmId, { attributes: ['timezone'] });
  return usableZone(firm?.timezone);
}

async function answer(propertyId: number, id: number, zone: string) {
  const { rows, photos: list } = await listObservations(propertyId, {}, zone, [id]);
  if (!rows[0]) throw notFound('That observation');
  return presentObservation(rows[0], list);
}

perProperty.post('/:id/observations', LOGGERS, ...typed({ params: IdParamsSchema, body: ObservationCreateSchema }, async ({ params, body }, req, res) => {
  const me = actor(req);
  const files = (req.files as Express.Multer.File[] | undefined) ?? [];
  const inspected = [];
  for (const file of files) inspected.push(await inspectPhoto({ bytes: file.buffer, originalName: file.originalname || null }));
  const { id, replayed } = await logObservation(me, params.id, body, inspected, idempotencyKey(req, 'observation'), req.ip ?? null);
  res.status(replayed ? 200 : 201).json({ data: await answer(params.id, id, await zoneOf(me.firmId)), replayed });
}, {
  // Refuse before reading any file: no key, someone else's property, or logging not allowed stores nothing.
  before: async (params, req) => {
    idempotencyKey(req, 'observation');
    await propertyToLogOn(actor(req), params.id);
  },
  upload: arrayUpload('photos', PHOTO_LIMITS.maxBytes, PHOTO_LIMITS.perObservation, 'photo'),
}));

perProperty.get('/:id/observations', READERS, ...typed({ params: IdParamsSchema, query: ObservationListQuerySchema }, async ({ params, query }, req, res) => {
  const me = actor(req);
  const property = await propertyForObservations(me, params.id);
  const { rows, photos: list } = await listObservations(property.id, query, await zoneOf(me.firmId));
  res.json({ data: rows.map((r) => presentObservation(r, list)) });
}));

perProperty.get('/:id/observations/summary', READERS, ...typed({ params: IdParamsSchema, query: ObservationSummaryQuerySchema }, async ({ params, query }, req, res) => {
  const me = actor(req);
  const property = await propertyForObservations(me, params.id);
  res.json({ data: presentObservationSummary(query.by, await countObservations(property.id, query.by, query, await zoneOf(me.firmId))) });
}));

async function photoFor(req: Request, id: number): Promise<ObservationPhoto> {
  const me = actor(req);
  const photo = await findInFirm(ObservationPhoto, id, me.firmId, 'That photo');
  const observation = await Observation.findByPk(photo.observationId, { attributes: ['id', 'propertyId'] });
  if (!observation) throw notFound('That photo');
  if (me.role === 'client') {
    const property = await Property.findOne({ where: { id: observation.propertyId, firmId: me.firmId }, attributes: ['clientId'] });
    if (!property || property.clientId !== me.clientId) throw notFound('That photo');
  }
  return photo;
}

/** An observation photo: the firm's staff and crew, and the client whose land it shows. */
photos.get('/:id', READERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const photo = await photoFor(req, params.id);
  res.setHeader('Content-Type', photo.contentType);
  res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
  res.setHeader('Content-Disposition', 'inline');
  await sendStoredFile(res, photo.storageKey);
}));

photos.get('/:id/thumbnail', READERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const photo = await photoFor(req, params.id);
  if (!photo.thumbnailKey) throw notFound('A thumbnail of that photo');
  res.setHeader('Content-Type', 'image/jpeg');
  res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
  res.setHeader('Content-Disposition', 'inline');
  await sendStoredFile(res, photo.thumbnailKey);
}));

export const propertyObservationsRouter = perProperty.router;
export const observationPhotosRouter = photos.router;
