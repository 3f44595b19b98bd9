/** Georeferenced image overlays of a property (drone or purchased orthophotos). */
import { z } from 'zod';
import { defineRoutes, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { singleUpload } from '../middlewares/upload';
import { Overlay, Property, type Corners } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { OverlayCornersSchema, OverlayUpdateSchema } from '../../shared/schemas/firm';
import { GEOMETRY_LIMITS } from '../../shared/limits';
import { presentOverlay } from '../presenters/firm';
import { actor, findInFirm } from '../policies/firm-scope';
import { runOverlayPrep } from '../services/geo-work/geo-pool';
import { deleteFile, saveFile, sendStoredFile } from '../services/storage/storage';
import { sequelize } from '../db/sequelize';
import { badRequest, unprocessable } from '../errors';
import { recordAudit } from '../commands/audit-recorder';
import { describeZodError } from '../middlewares/error-handler';

const perProperty = defineRoutes('/properties');
const r = defineRoutes('/overlays');

perProperty.get('/:id/overlays', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const { firmId } = actor(req);
  const property = await findInFirm(Property, Number(req.params.id), firmId, 'That property');
  const overlays = await Overlay.findAll({ where: { propertyId: property.id, firmId }, order: [['id', 'ASC']] });
  res.json({ data: overlays.map(presentOverlay) });
});

const UploadFieldsSchema = z.object({ name: z.string().trim().max(120).optional(), corners: z.string().optional() });

perProperty.post('/:id/overlays', STAFF, validate({ params: IdParamsSchema }), singleUpload('file', GEOMETRY_LIMITS.overlayMaxBytes, 'image'), async (req, res) => {
  const me = actor(req);
  const property = await findInFirm(Property, Number(req.params.id), me.firmId, 'That property');
  if (!req.file) throw badRequest('Attach the image in the form field “file” (GeoTIFF, or PNG/JPEG with its corners).');
  const fields = UploadFieldsSchema.parse(req.body ?? {});
  let corners: Corners | null = null;
  if (fields.corners) {
    let raw: unknown;
    try {
      raw = JSON.parse(fields.corners);
    } catch {
      throw unprocessable('corners: write them as JSON, e.g. [[-90.94,43.27],[-90.93,43.27],[-90.93,43.26],[-90.94,43.26]].');
    }
    const parsed = OverlayCornersSchema.safeParse(raw);
    if (!parsed.success) throw unprocessable(describeZodError(parsed.error).message);
    corners = parsed.data as Corners;
  }
  // Checked and converted in a worker thread: a large GeoTIFF never holds up other requests.
  const answer = await runOverlayPrep({ bytes: req.file.buffer, corners });
  const prepared = { ...answer, bytes: Buffer.from(answer.bytes.buffer, answer.bytes.byteOffset, answer.bytes.byteLength) };
  const key = await saveFile('overlays', prepared.bytes, prepared.extension);
  try {
    const overlay = await sequelize.transaction(async (transaction) => {
      const row = await Overlay.create(
        { firmId: me.firmId, propertyId: property.id, name: fields.name || req.file!.originalname.slice(0, 120) || 'Image', storageKey: key, contentType: prepared.contentType, byteSize: prepared.bytes.length, corners: prepared.corners, createdById: me.id },
        { transaction },
      );
      await recordAudit({ firmId: me.firmId, userId: me.id, action: 'overlay.added', subjectType: 'Property', subjectId: property.id, ip: req.ip ?? null }, transaction);
      return row;
    });
    res.status(201).json({ data: presentOverlay(overlay) });
  } catch (err) {
    await deleteFile(key);
    throw err;
  }
});

r.patch('/:id', STAFF, validate({ params: IdParamsSchema, body: OverlayUpdateSchema }), async (req, res) => {
  const overlay = await findInFirm(Overlay, Number(req.params.id), actor(req).firmId, 'That image');
  await overlay.update(req.body);
  res.json({ data: presentOverlay(overlay) });
});

r.delete('/:id', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const overlay = await findInFirm(Overlay, Number(req.params.id), actor(req).firmId, 'That image');
  await overlay.destroy();
  await deleteFile(overlay.storageKey);
  res.status(204).end();
});

r.get('/:id/image', STAFF, validate({ params: IdParamsSchema }), async (req, res) => {
  const overlay = await findInFirm(Overlay, Number(req.params.id), actor(req).firmId, 'That image');
  res.setHeader('Content-Type', overlay.contentType);
  res.setHeader('Cache-Control', 'private, max-age=86400');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  await sendStoredFile(res, overlay.storageKey);
});

export const propertyOverlaysRouter = perProperty.router;
export const overlaysRouter = r.router;
