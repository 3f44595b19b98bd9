/** Password hashing (bcryptjs) and random single-use tokens stored only as SHA-256. */
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';

/** The bcrypt cost of new hashes: BCRYPT_COST, else 11 (4 under the test runner, for speed). */
export const BCRYPT_COST = Number(process.env.BCRYPT_COST ?? (process.env.VITEST ? 4 : 11));

/** Hashes a password with bcrypt. */
export const hashPassword = (password: string): Promise<string> => bcrypt.hash(password, BCRYPT_COST);

const BCRYPT_ALPHABET = './ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

// Compared against when the user does not exist (or has no password yet), so that path costs what a
// real comparison costs and timing does not reveal which e-mails exist: same cost as real hashes.
// A comparison's cost is set by the stored hash's cost and salt alone, so a well-formed hash with a
// random salt and a random digest serves; no password matches it, and making it costs nothing (a
// real `hashSync` here held up the server's start for a fifth of a second).
const DUMMY_HASH = bcrypt.genSaltSync(BCRYPT_COST) + Array.from(crypto.randomBytes(31), (b) => BCRYPT_ALPHABET[b & 63]).join('');

/** The cost factor of the hash compared when there is no account (equal to BCRYPT_COST). */
export const dummyHashCost = (): number => bcrypt.getRounds(DUMMY_HASH);

/** Compares a password with a bcrypt hash; false for a missing hash (after the same work). */
export const verifyPassword = (password: string, hash: string | null): Promise<boolean> =>
  hash ? bcrypt.compare(password, hash) : bcrypt.compare(password, DUMMY_HASH).then(() => false);

/** A new random token (sent to the person) and its SHA-256 (kept in the database). */
export function newToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

/** SHA-256 hex of a token. */
export const hashToken = (token: string): string => crypto.createHash('sha256').update(token).digest('hex');
