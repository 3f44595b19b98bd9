/** Enables or disables a person of the firm, with its audit record. */
import { sequelize } from '../db/sequelize';
import { User } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import { findInFirm } from '../policies/firm-scope';
import { forbidden } from '../errors';
import { recordAudit } from './audit-recorder';

/** Turns a person's account on or off (never the actor's own); a disabled person is signed out on their next request. */
export async function setMemberActive(me: SessionUser, userId: number, active: boolean, ip: string | null): Promise<User> {
  return sequelize.transaction(async (transaction) => {
    const user = await findInFirm(User, userId, me.firmId, 'That person', { transaction, lock: true });
    if (user.id === me.id) throw forbidden('You cannot disable your own account.');
    await user.update({ active }, { transaction });
    await recordAudit({ firmId: me.firmId, userId: me.id, action: active ? 'user.enabled' : 'user.disabled', subjectType: 'User', subjectId: user.id, ip }, transaction);
    return user;
  });
}
