/** Invites a consultant, crew member or client contact: user row, token and e-mail in one transaction. */
import { Op } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { AuthToken, Client, Firm, User } from '../models';
import { issueAuthToken } from './auth-token-issuer';
import { enqueueEmail } from '../services/mail/outbox';
import { invitationEmail } from '../../templates/email/invitation';
import { config } from '../config';
import { LIMITS } from '../../shared/limits';
import type { InviteCreateInput, SessionUser } from '../../shared/schemas/auth';
import { conflict, forbidden, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';

/** Creates (or re-invites) the person and queues the invitation e-mail; answers the user row. */
export async function sendInvitation(actor: SessionUser, input: InviteCreateInput, ip: string | null): Promise<User> {
  if (input.role === 'consultant' && actor.role !== 'owner') throw forbidden('Only the firm’s owner can invite consultants.');
  return sequelize.transaction(async (transaction) => {
    if (input.role === 'client') {
      const client = await Client.findOne({ where: { id: input.clientId, firmId: actor.firmId }, transaction });
      if (!client) throw unprocessable('clientId: choose one of your firm’s clients.');
    }
    let user = await User.findOne({ where: { email: { [Op.iLike]: input.email } }, transaction });
    if (user && (user.firmId !== actor.firmId || user.passwordHash)) {
      // Same neutral answer whether the address belongs to another firm or an active account here.
      throw conflict('That e-mail address already has a Browseline account. Ask the person to sign in, or use another address.');
    }
    if (user) {
      await user.update({ name: input.name, role: input.role, clientId: input.role === 'client' ? input.clientId! : null }, { transaction });
      await AuthToken.update({ usedAt: new Date() }, { where: { userId: user.id, purpose: 'invite', usedAt: null }, transaction });
    } else {
      user = await User.create(
        {
          firmId: actor.firmId,
          clientId: input.role === 'client' ? input.clientId! : null,
          email: input.email,
          name: input.name,
          role: input.role,
          phone: null,
          passwordHash: null,
          lastSignInAt: null,
        },
        { transaction },
      );
    }
    const token = await issueAuthToken(user.id, 'invite', LIMITS.inviteTtlHours * 3600_000, actor.id, transaction);
    const firm = await Firm.findByPk(actor.firmId, { transaction });
    await enqueueEmail(
      {
        firmId: actor.firmId,
        kind: 'invitation',
        to: user.email,
        email: invitationEmail({
          firmName: firm?.name ?? 'Your consultant',
          inviterName: actor.name,
          name: user.name,
          role: user.role,
          url: `${config.publicUrl}/invite/${token}`,
          ttlHours: LIMITS.inviteTtlHours,
        }),
      },
      transaction,
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'user.invited', subjectType: 'User', subjectId: user.id, data: { role: user.role }, ip }, transaction);
    return user;
  });
}
