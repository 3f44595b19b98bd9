/** Password hashing (bcryptjs) and random single-use tokens stored only as SHA-256. */
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';

const COST = process.env.VITEST ? 4 : 11;

/** Hashes a password with bcrypt. */
export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, COST);

/** Compares a password with a bcrypt hash; false for a missing hash. */
export const verifyPassword = (password: string, hash: string | null): Promise<boolean> =>
  hash ? bcrypt.compare(password, hash) : bcrypt.compare(password, DUMMY_HASH).then(() => false);

// Compared against when the user does not exist, so timing does not reveal which e-mails exist.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', 4);

/** A new random token (sent to the person) and its SHA-256 (kept in the database). */
export function newToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

/** SHA-256 hex of a token. */
export const hashToken = (token: string): string => crypto.createHash('sha256').update(token).digest('hex');
