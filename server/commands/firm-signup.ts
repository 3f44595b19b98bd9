/** Sign-up: a new firm and its owner, confirmed by an e-mail link before the first sign-in. */
import crypto from 'node:crypto';
import { Op, UniqueConstraintError } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { AuthToken, Firm, User } from '../models';
import { hashPassword, hashToken } from '../services/auth/passwords';
import { issueAuthToken } from './auth-token-issuer';
import { assertStrongPassword } from '../services/auth/password-strength';
import { enqueueEmail } from '../services/mail/outbox';
import { signupExistingEmail, signupVerifyEmail } from '../../templates/email/signup';
import { installStarterLibrary } from './library-installer';
import { recordAudit } from './audit-recorder';
import { config } from '../config';
import { LIMITS } from '../../shared/limits';
import type { SignupInput } from '../../shared/schemas/auth';
import { AppError } from '../errors';

/** A URL-safe slug from the firm's name, with a random tail so two firms of one name never collide. */
export function firmSlug(name: string): string {
  const base = name
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40);
  return `${base || 'firm'}-${crypto.randomBytes(3).toString('hex')}`;
}

/**
 * Makes the firm (with the starter library, nothing else) and its owner, unconfirmed, and queues the
 * confirmation link. When the address already has an account nothing is made and that person gets
 * a note instead: the caller answers both cases alike, so sign-up never tells whether an address is
 * registered. The password is hashed in both cases so the time taken does not tell either.
 */
export async function signUpFirm(input: SignupInput, ip: string | null): Promise<void> {
  assertStrongPassword(input.password, [input.email, input.name, input.firmName]);
  const passwordHash = await hashPassword(input.password);
  try {
    await sequelize.transaction(async (transaction) => {
      const existing = await User.findOne({ where: { email: { [Op.iLike]: input.email } }, transaction });
      if (existing) {
        await enqueueEmail(
          { firmId: existing.firmId, kind: 'signup-existing', to: existing.email, email: signupExistingEmail({ name: existing.name, signInUrl: `${config.publicUrl}/login`, resetUrl: `${config.publicUrl}/forgot-password` }) },
          transaction,
        );
        return;
      }
      const firm = await Firm.create({ name: input.firmName, slug: firmSlug(input.firmName), email: input.email, phone: null, address: null, ...(input.homeArea ? { settings: { homeArea: input.homeArea } } : {}) }, { transaction });
      await installStarterLibrary(firm.id, transaction);
      const user = await User.create(
        { firmId: firm.id, clientId: null, role: 'owner', email: input.email, name: input.name, phone: null, passwordHash, active: true, emailVerified: false, lastSignInAt: null },
        { transaction },
      );
      const token = await issueAuthToken(user.id, 'verify', LIMITS.verifyTtlHours * 3_600_000, null, transaction);
      await enqueueEmail(
        { firmId: firm.id, kind: 'signup-verify', to: user.email, email: signupVerifyEmail({ firmName: firm.name, name: user.name, url: `${config.publicUrl}/verify-email/${token}`, ttlHours: LIMITS.verifyTtlHours }) },
        transaction,
      );
      await recordAudit({ firmId: firm.id, userId: user.id, action: 'firm.signed-up', subjectType: 'Firm', subjectId: firm.id, ip }, transaction);
    });
  } catch (err) {
    // Two sign-ups with one address at once: the second meets the unique index; answer as for a used address.
    if (err instanceof UniqueConstraintError) return;
    throw err;
  }
}

/** Confirms the address from a single-use, expiring link; answers the e-mail so the page can offer sign-in. */
export async function verifySignupEmail(token: string, ip: string | null): Promise<{ email: string }> {
  return sequelize.transaction(async (transaction) => {
    const row = await AuthToken.findOne({ where: { tokenHash: hashToken(token), purpose: 'verify' }, lock: transaction.LOCK.UPDATE, transaction });
    const invalid = new AppError(400, 'invalid_token', 'This confirmation link is no longer valid: it was used already or has expired. Sign up again to get a new one.');
    if (!row || row.usedAt || row.expiresAt.getTime() < Date.now()) throw invalid;
    const user = await User.findByPk(row.userId, { transaction });
    if (!user || !user.active) throw invalid;
    await row.update({ usedAt: new Date() }, { transaction });
    await user.update({ emailVerified: true }, { transaction });
    await recordAudit({ firmId: user.firmId, userId: user.id, action: 'user.email-confirmed', subjectType: 'User', subjectId: user.id, ip }, transaction);
    return { email: user.email };
  });
}
