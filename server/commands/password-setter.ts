/** Password reset requests and setting a password from an invitation or reset token. */
import { Op } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { AuthToken, Firm, User } from '../models';
import { hashPassword, hashToken, verifyPassword } from '../services/auth/passwords';
import { issueAuthToken } from './auth-token-issuer';
import { assertStrongPassword } from '../services/auth/password-strength';
import { endSessionsOf } from '../services/auth/session-control';
import { unauthorized, unprocessable } from '../errors';
import { enqueueEmail } from '../services/mail/outbox';
import { passwordResetEmail } from '../../templates/email/password-reset';
import { config } from '../config';
import { LIMITS } from '../../shared/limits';
import { AppError } from '../errors';
import { recordAudit } from './audit-recorder';

const invalidLink = () =>
  new AppError(400, 'invalid_token', 'This link is no longer valid: it was used already or has expired. Ask for a new one.');

/** Queues a reset e-mail when the address belongs to an active account; silent otherwise (no enumeration). */
export async function requestPasswordReset(email: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const user = await User.findOne({ where: { email: { [Op.iLike]: email }, active: true }, transaction });
    if (!user || !user.passwordHash) return;
    const token = await issueAuthToken(user.id, 'reset', LIMITS.resetTtlMinutes * 60_000, null, transaction);
    const firm = await Firm.findByPk(user.firmId, { transaction });
    await enqueueEmail(
      {
        firmId: user.firmId,
        kind: 'password-reset',
        to: user.email,
        email: passwordResetEmail({ firmName: firm?.name ?? 'Browseline', name: user.name, url: `${config.publicUrl}/reset-password/${token}`, ttlMinutes: LIMITS.resetTtlMinutes }),
      },
      transaction,
    );
  });
}

/** Looks up a live token of the given purpose; answers the user it belongs to. */
export async function findLiveToken(token: string, purpose: 'invite' | 'reset'): Promise<{ token: AuthToken; user: User }> {
  const row = await AuthToken.findOne({ where: { tokenHash: hashToken(token), purpose } });
  if (!row || row.usedAt || row.expiresAt.getTime() < Date.now()) throw invalidLink();
  const user = await User.findByPk(row.userId);
  if (!user || !user.active) throw invalidLink();
  return { token: row, user };
}

/**
 * Sets the password from a single-use token, marking it used in the same transaction. A guessable
 * password is refused (422) before the token is spent; a reset ends every session of the user.
 */
export async function setPasswordFromToken(token: string, purpose: 'invite' | 'reset', password: string, ip: string | null): Promise<User> {
  const { user: owner } = await findLiveToken(token, purpose);
  assertStrongPassword(password, [owner.email, owner.name]);
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    const row = await AuthToken.findOne({ where: { tokenHash: hashToken(token), purpose }, lock: transaction.LOCK.UPDATE, transaction });
    if (!row || row.usedAt || row.expiresAt.getTime() < Date.now()) throw invalidLink();
    const user = await User.findByPk(row.userId, { transaction });
    if (!user || !user.active) throw invalidLink();
    await row.update({ usedAt: new Date() }, { transaction });
    // Any other open reset links of this user stop working too.
    await AuthToken.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction });
    await user.update({ passwordHash }, { transaction });
    // Whoever held a session (perhaps the reason for the reset) is signed out everywhere.
    const ended = await endSessionsOf(user.id, null, transaction);
    await recordAudit({ firmId: user.firmId, userId: user.id, action: purpose === 'invite' ? 'user.joined' : 'user.password-reset', subjectType: 'User', subjectId: user.id, data: { sessionsEnded: ended }, ip }, transaction);
    return user;
  });
}

/**
 * The signed-in person changes their password: the current one must match, the new one must be
 * hard to guess; every other session of theirs ends, the one in use (`keepSid`) stays.
 */
export async function changePassword(userId: number, keepSid: string, input: { currentPassword: string; password: string }, ip: string | null): Promise<{ sessionsEnded: number }> {
  const user = await User.findByPk(userId);
  if (!user || !user.active) throw unauthorized();
  if (!(await verifyPassword(input.currentPassword, user.passwordHash))) {
    throw unprocessable('currentPassword: that is not your current password. Type it again, or sign out and reset it.', [{ path: 'currentPassword', message: 'that is not your current password' }]);
  }
  assertStrongPassword(input.password, [user.email, user.name]);
  const passwordHash = await hashPassword(input.password);
  return sequelize.transaction(async (transaction) => {
    await User.update({ passwordHash }, { where: { id: user.id }, transaction });
    // Open reset links stop working, and every other session of this person ends.
    await AuthToken.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null, purpose: 'reset' }, transaction });
    const sessionsEnded = await endSessionsOf(user.id, keepSid, transaction);
    await recordAudit({ firmId: user.firmId, userId: user.id, action: 'user.password-changed', subjectType: 'User', subjectId: user.id, data: { sessionsEnded }, ip }, transaction);
    return { sessionsEnded };
  });
}
