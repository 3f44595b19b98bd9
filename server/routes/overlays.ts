/** Georeferenced image overlays of a property (drone or purchased orthophotos). */
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { singleUpload } from '../middlewares/upload';
import { Overlay, Property, type Corners } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { OverlayCornersSchema, OverlayUpdateSchema } from '../../shared/schemas/firm';
import { OverlayUploadFieldsSchema } from '../../shared/schemas/overlay';
import { GEOMETRY_LIMITS } from '../../shared/limits';
import { presentOverlay } from '../presenters/firm';
import { actor, findInFirm } from '../policies/firm-scope';
import { sendStoredFile } from '../services/storage/storage';
import { badRequest, unprocessable } from '../errors';
import { describeZodError } from '../middlewares/error-handler';
import { addOverlay, deleteOverlay, updateOverlay } from '../commands/overlay-writer';

const perProperty = defineRoutes('/properties');
const r = defineRoutes('/overlays');

perProperty.get('/:id/overlays', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, params.id, firmId, 'That property');
  const overlays = await Overlay.findAll({ where: { propertyId: property.id, firmId }, order: [['id', 'ASC']] });
  res.json({ data: overlays.map(presentOverlay) });
}));

/** The corners field (JSON text in a multipart form), checked by the shared schema. */
function readCorners(text: string | undefined): Corners | null {
  if (!text) return null;
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw unprocessable('corners: write them as JSON, e.g. [[-90.94,43.27],[-90.93,43.27],[-90.93,43.26],[-90.94,43.26]].');
  }
  const parsed = OverlayCornersSchema.safeParse(raw);
  if (!parsed.success) throw unprocessable(describeZodError(parsed.error).message);
  return parsed.data as Corners;
}

perProperty.post('/:id/overlays', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  if (!req.file) throw badRequest('Attach the image in the form field “file” (GeoTIFF, or PNG/JPEG with its world file or corners).');
  const fields = OverlayUploadFieldsSchema.safeParse(req.body ?? {});
  if (!fields.success) throw unprocessable(describeZodError(fields.error).message);
  const { name, corners, worldFile, epsg } = fields.data;
  const overlay = await addOverlay(
    actor(req),
    params.id,
    { bytes: req.file.buffer, fileName: req.file.originalname, name, corners: readCorners(corners), worldFile: worldFile && epsg !== undefined ? { text: worldFile, epsg } : null },
    req.ip ?? null,
  );
  res.status(201).json({ data: presentOverlay(overlay) });
}, { upload: singleUpload('file', GEOMETRY_LIMITS.overlayMaxBytes, 'image') }));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: OverlayUpdateSchema }, async ({ params, body }, req, res) => {
  const overlay = await updateOverlay(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: presentOverlay(overlay) });
}));

r.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await deleteOverlay(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

r.get('/:id/image', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const overlay = await findInFirm(Overlay, params.id, actor(req).firmId, 'That image');
  res.setHeader('Content-Type', overlay.contentType);
  res.setHeader('Cache-Control', 'private, max-age=86400');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  await sendStoredFile(res, overlay.storageKey);
}));

export const propertyOverlaysRouter = perProperty.router;
export const overlaysRouter = r.router;
