/** Shared files: consultant documents for a client, and the client's own uploads where allowed. */
import type { NextFunction, Request, Response } from 'express';
import { defineRoutes, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { singleUpload } from '../middlewares/upload';
import { SharedFile } from '../models';
import { IdParamsSchema } from '../../shared/schemas/common';
import { ClientFileUploadSchema, FILE_LIMITS, FileListQuerySchema, FileUpdateSchema, StaffFileUploadSchema } from '../../shared/schemas/file';
import { downloadName } from '../../shared/domain/file-kinds';
import { actor, findInFirm } from '../policies/firm-scope';
import { clientVisibleFiles, presentFiles, staffFiles } from '../services/files/file-reader';
import { assertClientMayUpload, removeSharedFile, shareFile, updateSharedFile, uploadClientFile } from '../commands/file-sharer';
import { sendStoredFile } from '../services/storage/storage';
import { notFound } from '../errors';

const r = defineRoutes('/files');
const STAFF_AND_CLIENT = ['owner', 'consultant', 'client'] as const;

r.get('/', STAFF_AND_CLIENT, ...typed({ query: FileListQuerySchema }, async ({ query }, req, res) => {
  const me = actor(req);
  const q = query;
  if (me.role === 'client') {
    res.json({ data: me.clientId ? await clientVisibleFiles(me.firmId, me.clientId, q.propertyId) : [] });
    return;
  }
  res.json({ data: await staffFiles(me.firmId, q) });
}));

/** A client is refused before the upload is even read when uploads are not allowed for them. */
async function clientMayUpload(req: Request, _res: Response, next: NextFunction) {
  const me = actor(req);
  if (me.role === 'client') await assertClientMayUpload(me);
  next();
}

r.post('/', STAFF_AND_CLIENT, clientMayUpload, singleUpload('file', FILE_LIMITS.maxBytes), async (req, res) => {
  const me = actor(req);
  const file = req.file ? { buffer: req.file.buffer, originalname: req.file.originalname } : undefined;
  const row =
    me.role === 'client'
      ? await uploadClientFile(me, ClientFileUploadSchema.parse(req.body ?? {}), file, req.ip ?? null)
      : await shareFile(me, StaffFileUploadSchema.parse(req.body ?? {}), file, req.ip ?? null);
  res.status(201).json({ data: (await presentFiles([row]))[0] });
});

r.get('/:id', STAFF_AND_CLIENT, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  const me = actor(req);
  const file = await findInFirm(SharedFile, params.id, me.firmId, 'That file');
  if (me.role === 'client' && (file.clientId !== me.clientId || !file.visibleToClient)) throw notFound('That file');
  const extension = file.storageKey.split('.').pop() ?? 'bin';
  const name = downloadName(file.title, extension);
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${name}"; filename*=UTF-8''${encodeURIComponent(name)}`);
  // Never run anything from a stored file, whatever a browser makes of it.
  res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
  res.setHeader('Cache-Control', 'private, no-store');
  await sendStoredFile(res, file.storageKey);
}));

r.patch('/:id', STAFF, ...typed({ params: IdParamsSchema, body: FileUpdateSchema }, async ({ params, body }, req, res) => {
  const file = await updateSharedFile(actor(req), params.id, body, req.ip ?? null);
  res.json({ data: (await presentFiles([file]))[0] });
}));

r.delete('/:id', STAFF, ...typed({ params: IdParamsSchema }, async ({ params }, req, res) => {
  await removeSharedFile(actor(req), params.id, req.ip ?? null);
  res.status(204).end();
}));

export const filesRouter = r.router;
