/** The firm's own settings. */
import { defineRoutes, OWNER, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Firm } from '../models';
import { FirmProfileUpdateSchema, FirmSettingsUpdateSchema } from '../../shared/schemas/firm';
import { singleUpload } from '../middlewares/upload';
import { LOGO_LIMITS } from '../../shared/limits';
import { checkLogo, LOGO_TOO_LARGE } from '../services/firm-logo';
import { readFile, saveFile } from '../services/storage/storage';
import { presentFirm } from '../presenters/firm';
import { actor } from '../policies/firm-scope';
import { setFirmLogo, updateFirmProfile, updateFirmSettings } from '../commands/firm-writer';
import { badRequest, notFound, payloadTooLarge } from '../errors';
import { MulterError } from 'multer';
import type { RequestHandler } from 'express';

const r = defineRoutes('/firm');

r.get('/', STAFF, async (req, res) => {
  const firm = await Firm.findByPk(actor(req).firmId);
  if (!firm) throw notFound('Your firm');
  res.json({ data: presentFirm(firm) });
});

r.patch('/settings', OWNER, ...typed({ body: FirmSettingsUpdateSchema }, async ({ body }, req, res) => {
  const me = actor(req);
  const firm = await updateFirmSettings(me, body, req.ip ?? null);
  res.json({ data: presentFirm(firm) });
}));

/** The logo's upload, its size limit answered with the same sentence as the content checks. */
const logoUpload: RequestHandler = (req, res, next) =>
  singleUpload('file', LOGO_LIMITS.maxBytes)(req, res, (err?: unknown) => {
    if (err instanceof MulterError && err.code === 'LIMIT_FILE_SIZE') return next(payloadTooLarge(LOGO_TOO_LARGE));
    next(err);
  });

/** The profile: what documents and e-mails print, and the defaults of new proposals and invoices. */
r.patch('/', OWNER, ...typed({ body: FirmProfileUpdateSchema }, async ({ body }, req, res) => {
  const me = actor(req);
  const firm = await updateFirmProfile(me, body, req.ip ?? null);
  res.json({ data: presentFirm(firm) });
}));

r.post('/logo', OWNER, logoUpload, async (req, res) => {
  const me = actor(req);
  if (!req.file) throw badRequest('Attach the logo in the form field “file” (PNG or JPEG).');
  const size = checkLogo(req.file.buffer);
  // A new key every time: documents already sent keep printing the logo they were sent with.
  const key = await saveFile('logos', req.file.buffer, size.kind === 'png' ? 'png' : 'jpg');
  const firm = await setFirmLogo(me, { key, contentType: size.kind === 'png' ? 'image/png' : 'image/jpeg', width: size.width, height: size.height }, req.ip ?? null);
  res.status(201).json({ data: presentFirm(firm) });
});

r.get('/logo', STAFF, async (req, res) => {
  const firm = await Firm.findByPk(actor(req).firmId, { attributes: ['id', 'logoKey', 'logoContentType'] });
  if (!firm?.logoKey) throw notFound('The firm’s logo');
  const bytes = await readFile(firm.logoKey);
  res.setHeader('Content-Type', firm.logoContentType ?? 'application/octet-stream');
  res.setHeader('Cache-Control', 'private, max-age=86400');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.send(bytes);
});

export const firmRouter = r.router;
