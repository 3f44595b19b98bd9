/** The firm's own settings. */
import { defineRoutes, OWNER, STAFF } from '../middlewares/access';
import { validate } from '../middlewares/validate';
import { Firm } from '../models';
import { FirmSettingsUpdateSchema } from '../../shared/schemas/firm';
import { presentFirm } from '../presenters/firm';
import { actor } from '../policies/firm-scope';
import { recordAudit } from '../commands/audit-recorder';
import { sequelize } from '../db/sequelize';
import { notFound } from '../errors';

const r = defineRoutes('/firm');

r.get('/', STAFF, async (req, res) => {
  const firm = await Firm.findByPk(actor(req).firmId);
  if (!firm) throw notFound('Your firm');
  res.json({ data: presentFirm(firm) });
});

r.patch('/settings', OWNER, validate({ body: FirmSettingsUpdateSchema }), async (req, res) => {
  const me = actor(req);
  const firm = await sequelize.transaction(async (transaction) => {
    const row = await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Your firm');
    const { timezone, ...rest } = req.body;
    const settings = { ...row.settings };
    for (const [key, value] of Object.entries(rest)) if (value !== undefined) settings[key] = value;
    await row.update({ settings, ...(timezone !== undefined ? { timezone } : {}) }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: 'firm.settings-changed', subjectType: 'Firm', subjectId: me.firmId, data: { keys: Object.keys(req.body) }, ip: req.ip ?? null }, transaction);
    return row;
  });
  res.json({ data: presentFirm(firm) });
});

export const firmRouter = r.router;
