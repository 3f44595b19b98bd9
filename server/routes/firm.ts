/** The firm's own settings. */
import { defineRoutes, OWNER, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { Firm } from '../models';
import { FirmProfileUpdateSchema, FirmSettingsUpdateSchema } from '../../shared/schemas/firm';
import { singleUpload } from '../middlewares/upload';
import { LOGO_LIMITS } from '../../shared/limits';
import { checkLogo, LOGO_TOO_LARGE } from '../services/firm-logo';
import { settingsFromProfile } from '../services/firm-profile';
import { readFile, saveFile } from '../services/storage/storage';
import { presentFirm } from '../presenters/firm';
import { actor } from '../policies/firm-scope';
import { recordAudit } from '../commands/audit-recorder';
import { sequelize } from '../db/sequelize';
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
  const firm = await sequelize.transaction(async (transaction) => {
    const row = await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Your firm');
    const { timezone, ...rest } = body;
    const settings = { ...row.settings };
    for (const [key, value] of Object.entries(rest)) if (value !== undefined) settings[key] = value;
    await row.update({ settings, ...(timezone !== undefined ? { timezone } : {}) }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'firm.settings-changed', subjectType: 'Firm', subjectId: me.firmId, data: { keys: Object.keys(body) }, ip: req.ip ?? null }, transaction);
    return row;
  });
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
  const firm = await sequelize.transaction(async (transaction) => {
    const row = await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Your firm');
    const { name, address, phone, email, website, licenceNumbers, timezone, ...defaults } = body;
    const columns = Object.fromEntries(Object.entries({ name, address, phone, email, website, licenceNumbers, timezone }).filter(([, v]) => v !== undefined));
    await row.update({ ...columns, settings: { ...row.settings, ...settingsFromProfile(defaults) } }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'firm.profile-changed', subjectType: 'Firm', subjectId: me.firmId, data: { keys: Object.keys(body) }, ip: req.ip ?? null }, transaction);
    return row;
  });
  res.json({ data: presentFirm(firm) });
}));

r.post('/logo', OWNER, logoUpload, async (req, res) => {
  const me = actor(req);
  if (!req.file) throw badRequest('Attach the logo in the form field “file” (PNG or JPEG).');
  const size = checkLogo(req.file.buffer);
  // A new key every time: documents already sent keep printing the logo they were sent with.
  const key = await saveFile('logos', req.file.buffer, size.kind === 'png' ? 'png' : 'jpg');
  const firm = await sequelize.transaction(async (transaction) => {
    const row = await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Your firm');
    await row.update({ logoKey: key, logoContentType: size.kind === 'png' ? 'image/png' : 'image/jpeg' }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'firm.logo-changed', subjectType: 'Firm', subjectId: me.firmId, data: { width: size.width, height: size.height }, ip: req.ip ?? null }, transaction);
    return row;
  });
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
