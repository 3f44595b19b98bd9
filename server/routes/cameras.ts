/** The camera fleet: cameras, deployments, card pulls, card photos and their review, events and the buck roster. */
import type { Request, Response } from 'express';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed, type Parsed } from '../middlewares/typed-route';
import { arrayUpload } from '../middlewares/upload';
import { Camera, CameraDeployment, CameraPhoto, CardPull, Property } from '../models';
import { actor, findInFirm } from '../policies/firm-scope';
import { notFound } from '../errors';
import { todayInZone } from '../services/clock';
import { sendStoredFile } from '../services/storage/storage';
import { readCardPhoto } from '../services/cameras/card-photo';
import { addCardPhotos, tagPhoto } from '../commands/camera-photo-writer';
import { createBuck, createCamera, createDeployment, createPull, updateBuck, updateCamera, updateDeployment } from '../commands/camera-fleet-writer';
import { deploymentEvents, listBucks, listCameraDeployments, listCameras, listDeploymentPhotos, listDuePulls, listPropertyDeployments, readDeployment } from '../queries/camera-fleet';
import { buckFields, presentCameraPhoto } from '../presenters/camera';
import { IdParamsSchema, IdSchema } from '../../shared/schemas/common';
import { z } from 'zod';
import {
  BuckCreateSchema,
  BuckUpdateSchema,
  CameraCreateSchema,
  CameraPhotoTagSchema,
  CameraUpdateSchema,
  CARD_LIMITS,
  CardPullCreateSchema,
  DeploymentCreateSchema,
  DeploymentUpdateSchema,
  PhotoHashQuerySchema,
  PhotoListQuerySchema,
} from '../../shared/schemas/cameras';
import type { CardPullDto } from '../../shared/schemas/cameras';

const cameras = defineRoutes('/cameras');
const deployments = defineRoutes('/deployments');
const photos = defineRoutes('/camera-photos');
const perProperty = defineRoutes('/properties');
/** Staff and crew: the crew pulls cards and reads which are due. */
const WORKERS = ['owner', 'consultant', 'crew'] as const;
const BuckParamsSchema = z.object({ id: IdSchema, buckId: IdSchema });

const ip = (req: Request) => req.ip ?? null;
const presentPull = (p: CardPull): CardPullDto => ({ id: p.id, deploymentId: p.deploymentId, pulledOn: p.pulledOn, batteryPct: p.batteryPct, photoCount: p.photoCount, notes: p.notes });

// ---- cameras ----

cameras.get('/', STAFF, async (req, res) => {
  res.json({ data: await listCameras(actor(req).firmId) });
});

cameras.post('/', STAFF, ...typed({ body: CameraCreateSchema }, async ({ body }, req, res) => {
  const camera = await createCamera(actor(req), body, ip(req));
  res.status(201).json({ data: (await listCameras(camera.firmId)).find((c) => c.id === camera.id) });
}));

cameras.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: CameraUpdateSchema }, async ({ params, body }, req, res) => {
  const camera = await updateCamera(actor(req), params.id, body, ip(req));
  res.json({ data: (await listCameras(camera.firmId)).find((c) => c.id === camera.id) });
}));

cameras.get('/:id/deployments', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const camera = await findInFirm(Camera, params.id, actor(req).firmId, 'That camera');
  res.json({ data: await listCameraDeployments(camera.firmId, camera.id) });
}));

cameras.post('/:id/deployments', STAFF, ...typed({ params: IdParamsSchema, body: DeploymentCreateSchema }, async ({ params, body }, req, res) => {
  const { deployment, ended } = await createDeployment(actor(req), params.id, body, ip(req));
  res.status(201).json({ data: await readDeployment(deployment.firmId, deployment.id), ended: ended ? await readDeployment(ended.firmId, ended.id) : null });
}));

// ---- deployments ----

deployments.get('/due', WORKERS, async (req, res) => {
  const me = actor(req);
  res.json({ data: await listDuePulls(me.firmId, todayInZone(me.firmTimezone)) });
});

deployments.get('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  res.json({ data: await readDeployment(actor(req).firmId, params.id) });
}));

deployments.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: DeploymentUpdateSchema }, async ({ params, body }, req, res) => {
  const deployment = await updateDeployment(actor(req), params.id, body, ip(req));
  res.json({ data: await readDeployment(deployment.firmId, deployment.id) });
}));

deployments.get('/:id/pulls', WORKERS, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const deployment = await findInFirm(CameraDeployment, params.id, actor(req).firmId, 'That deployment');
  const pulls = await CardPull.findAll({ where: { deploymentId: deployment.id }, order: [['pulledOn', 'ASC'], ['id', 'ASC']] });
  res.json({ data: pulls.map(presentPull) });
}));

deployments.post('/:id/pulls', WORKERS, ...typed({ params: IdParamsSchema, body: CardPullCreateSchema }, async ({ params, body }, req, res) => {
  const pull = await createPull(actor(req), params.id, body, ip(req));
  res.status(201).json({ data: presentPull(pull) });
}));

deployments.get('/:id/events', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  res.json({ data: await deploymentEvents(me.firmId, params.id, todayInZone(me.firmTimezone)) });
}));

deployments.get('/:id/photos', STAFF, ...typed({ params: IdParamsSchema, query: PhotoListQuerySchema }, async ({ params, query }, req, res) => {
  const deployment = await findInFirm(CameraDeployment, params.id, actor(req).firmId, 'That deployment');
  const { photos: list, total } = await listDeploymentPhotos(deployment.id, query);
  res.json({ data: list, page: { total, limit: query.limit, offset: query.offset } });
}));

/** Which of these content hashes the deployment has already: the card upload skips them (and so resumes). */
deployments.post('/:id/photos/known', STAFF, ...typed({ params: IdParamsSchema, body: PhotoHashQuerySchema }, async ({ params, body }, req, res) => {
  const deployment = await findInFirm(CameraDeployment, params.id, actor(req).firmId, 'That deployment');
  const rows = await CameraPhoto.findAll({ where: { deploymentId: deployment.id, sha256: body.hashes }, attributes: ['sha256'] });
  res.json({ data: { known: rows.map((r) => r.sha256) } });
}));

deployments.post('/:id/photos', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const files = (req.files as Express.Multer.File[] | undefined) ?? [];
  if (files.length === 0) {
    res.status(400).json({ error: `Attach the card’s photos in the "photos" field (up to ${CARD_LIMITS.perRequest} per request).` });
    return;
  }
  const readings = [];
  for (const file of files) readings.push(await readCardPhoto(file.buffer, file.originalname || null));
  const result = await addCardPhotos(actor(req), params.id, readings, ip(req));
  res.status(result.added > 0 ? 201 : 200).json({ data: result });
}, {
  // Refuse another firm's deployment before reading any file.
  before: async (params, req) => {
    await findInFirm(CameraDeployment, params.id, actor(req).firmId, 'That deployment');
  },
  upload: arrayUpload('photos', CARD_LIMITS.maxBytes, CARD_LIMITS.perRequest, 'photo'),
}));

// ---- photos ----

photos.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: CameraPhotoTagSchema }, async ({ params, body }, req, res) => {
  const photo = await tagPhoto(actor(req), params.id, body, ip(req));
  res.json({ data: presentCameraPhoto(photo) });
}));

/** A photo's file for staff; a client sees only a featured photo of its own property (never a person). */
async function readablePhoto(req: Request, id: number): Promise<CameraPhoto> {
  const me = actor(req);
  const photo = await findInFirm(CameraPhoto, id, me.firmId, 'That photo');
  if (me.role === 'client') {
    const property = await Property.findOne({ where: { id: photo.propertyId, firmId: me.firmId }, attributes: ['clientId'] });
    if (!property || property.clientId !== me.clientId || !photo.featured || photo.tag === 'person') throw notFound('That photo');
  }
  return photo;
}

const sendPhoto = (thumbnail: boolean) => async ({ params }: Parsed<{ params: typeof IdParamsSchema }>, req: Request, res: Response) => {
  const photo = await readablePhoto(req, params.id);
  const key = thumbnail && photo.thumbnailKey ? photo.thumbnailKey : photo.storageKey;
  res.setHeader('Content-Type', key === photo.storageKey ? photo.contentType : 'image/jpeg');
  res.setHeader('Cache-Control', 'private, max-age=86400');
  res.setHeader('Content-Disposition', 'inline');
  await sendStoredFile(res, key);
};

photos.get('/:id/file', ['owner', 'consultant', 'client'], ...typed({ params: IdParamsSchema }, sendPhoto(false)));
photos.get('/:id/thumbnail', ['owner', 'consultant', 'client'], ...typed({ params: IdParamsSchema }, sendPhoto(true)));

// ---- per property: deployments, due pulls and the buck roster ----

perProperty.get('/:id/deployments', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const property = await findInFirm(Property, params.id, actor(req).firmId, 'That property');
  res.json({ data: await listPropertyDeployments(property.firmId, property.id) });
}));

perProperty.get('/:id/bucks', ['owner', 'consultant', 'client'], ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, params.id, me.firmId, 'That property');
  if (me.role === 'client' && property.clientId !== me.clientId) throw notFound('That property');
  // The landowner sees the roster's best photos the consultant chose, never a photo of a person.
  res.json({ data: await listBucks(property.id, { featuredOnly: me.role === 'client' }) });
}));

perProperty.post('/:id/bucks', STAFF, ...typed({ params: IdParamsSchema, body: BuckCreateSchema }, async ({ params, body }, req, res) => {
  const buck = await createBuck(actor(req), params.id, body, ip(req));
  res.status(201).json({ data: { ...buckFields(buck), photoCount: 0, firstSeen: null, lastSeen: null, photos: [] } });
}));

perProperty.patch('/:id/bucks/:buckId', STAFF, ...typed({ params: BuckParamsSchema, body: BuckUpdateSchema }, async ({ params, body }, req, res) => {
  const buck = await updateBuck(actor(req), params.id, params.buckId, body, ip(req));
  const [dto] = (await listBucks(buck.propertyId, { featuredOnly: false })).filter((b) => b.id === buck.id);
  res.json({ data: dto ?? { ...buckFields(buck), photoCount: 0, firstSeen: null, lastSeen: null, photos: [] } });
}));

/** The camera fleet's routers and their mount paths under /api. */
export const cameraRouters = [
  { path: '/cameras', router: cameras.router },
  { path: '/deployments', router: deployments.router },
  { path: '/camera-photos', router: photos.router },
  { path: '/properties', router: perProperty.router },
];
