/** The firm's people: list, invite, enable or disable. */
import { z } from 'zod';
import { defineRoutes, OWNER, STAFF } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { User } from '../models';
import { InviteCreateSchema } from '../../shared/schemas/auth';
import { IdParamsSchema } from '../../shared/schemas/common';
import { presentTeamMember } from '../presenters/user';
import { sendInvitation } from '../commands/invitation-sender';
import { actor } from '../policies/firm-scope';
import { setMemberActive } from '../commands/member-writer';

const r = defineRoutes('/team');

r.get('/', STAFF, async (req, res) => {
  const users = await User.findAll({ where: { firmId: actor(req).firmId }, order: [['role', 'ASC'], ['name', 'ASC']] });
  res.json({ data: users.map(presentTeamMember) });
});

r.post('/invitations', STAFF, ...typed({ body: InviteCreateSchema }, async ({ body }, req, res) => {
  const user = await sendInvitation(actor(req), body, req.ip ?? null);
  res.status(201).json({ data: presentTeamMember(user) });
}));

const MemberPatchSchema = z.object({ active: z.boolean() });

r.patch('/:id', OWNER, ...typed({ params: IdParamsSchema, body: MemberPatchSchema }, async ({ params, body }, req, res) => {
  const user = await setMemberActive(actor(req), params.id, body.active, req.ip ?? null);
  res.json({ data: presentTeamMember(user) });
}));

export const teamRouter = r.router;
