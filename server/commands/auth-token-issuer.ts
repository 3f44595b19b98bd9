/** One-time links (invitation, password reset, e-mail check): a random token whose hash alone is stored. */
import type { Transaction } from 'sequelize';
import { AuthToken } from '../models';
import { newToken } from '../services/auth/passwords';

/**
 * Stores a new token of `purpose` for a user, living `ttlMs` from now, inside the caller's
 * transaction, and answers the token itself: the only copy, for the link in the e-mail.
 */
export async function issueAuthToken(
  userId: number,
  purpose: AuthToken['purpose'],
  ttlMs: number,
  createdById: number | null,
  transaction: Transaction,
): Promise<string> {
  const { token, tokenHash } = newToken();
  await AuthToken.create({ userId, purpose, tokenHash, expiresAt: new Date(Date.now() + ttlMs), usedAt: null, createdById }, { transaction });
  return token;
}
