/** The crew's field sheet home. */
import { Op } from 'sequelize';
import { defineRoutes } from '../middlewares/access';
import { Firm, User } from '../models';
import { actor } from '../policies/firm-scope';
import type { FieldHome } from '../../shared/schemas/desk';

const r = defineRoutes('/field');

r.get('/home', ['crew', 'owner', 'consultant'], async (req, res) => {
  const me = actor(req);
  const [firm, staff] = await Promise.all([
    Firm.findByPk(me.firmId),
    User.findAll({ where: { firmId: me.firmId, role: { [Op.in]: ['owner', 'consultant'] }, active: true }, order: [['name', 'ASC']] }),
  ]);
  const body: FieldHome = {
    firm: { name: firm?.name ?? '', phone: firm?.phone ?? null },
    contacts: staff.map((u) => ({ name: u.name, role: u.role, email: u.email, phone: u.phone })),
  };
  res.json({ data: body });
});

export const fieldRouter = r.router;
