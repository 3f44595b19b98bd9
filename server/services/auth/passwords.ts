/**
 * Password hashing (bcryptjs) and random single-use tokens stored only as SHA-256. Hashing and
 * comparing run in a worker thread (password-worker.mjs, `PASSWORD_WORKERS` threads, default 1):
 * bcryptjs is plain JavaScript, and a cost-11 comparison done on the request thread would hold it
 * up in slices of up to 100 ms. `PASSWORD_WORKERS=0` hashes in the calling thread (debugging).
 */
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Piscina } from 'piscina';
import { AppError } from '../../errors';

/** The bcrypt cost of new hashes: BCRYPT_COST, else 11 (4 under the test runner, for speed). */
export const BCRYPT_COST = Number(process.env.BCRYPT_COST ?? (process.env.VITEST ? 4 : 11));

/** How many password worker threads to run (0: hash in the calling thread). */
export function passwordWorkerCount(env: NodeJS.ProcessEnv = process.env): number {
  const raw = env.PASSWORD_WORKERS;
  if (raw !== undefined && /^\d+$/.test(raw)) return Math.min(4, Number(raw));
  return 1;
}

let pool: Piscina | null = null;

function thePool(): Piscina {
  pool ??= new Piscina({
    filename: new URL('./password-worker.mjs', import.meta.url).href,
    minThreads: 1,
    maxThreads: passwordWorkerCount(),
    idleTimeout: 60_000,
    // Sign-in is rate-limited; a burst beyond this waits in the queue rather than starting more work.
    maxQueue: 64,
  });
  pool.on('error', () => undefined); // a thread that dies is replaced; its task rejects
  return pool;
}

async function inWorker<T>(name: 'hash' | 'compare', task: Record<string, unknown>, here: () => Promise<T>): Promise<T> {
  if (passwordWorkerCount() === 0) return here();
  try {
    return (await thePool().run(task, { name })) as T;
  } catch (error) {
    if (/queue is full/i.test((error as Error).message ?? '')) {
      throw new AppError(503, 'service_unavailable', 'The server is busy signing many people in right now. Try again in a minute.');
    }
    throw error;
  }
}

/** Starts a password worker thread now (server start), so the first sign-in does not wait for one. */
export function warmPasswordWorkers(): void {
  if (passwordWorkerCount() > 0) thePool();
}

/** Hashes a password with bcrypt (in a worker thread). */
export const hashPassword = (password: string): Promise<string> =>
  inWorker('hash', { password, cost: BCRYPT_COST }, () => bcrypt.hash(password, BCRYPT_COST));

/** Whether the password matches the bcrypt hash (in a worker thread). */
const compareHash = (password: string, hash: string): Promise<boolean> =>
  inWorker('compare', { password, hash }, () => bcrypt.compare(password, hash));

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
  hash ? compareHash(password, hash) : compareHash(password, DUMMY_HASH).then(() => false);

/** Stops the password worker threads (shutdown). */
export async function closePasswordWorkers(): Promise<void> {
  const p = pool;
  pool = null;
  await p?.destroy();
}

/** A new random token (sent to the person) and its SHA-256 (kept in the database). */
export function newToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

/** SHA-256 hex of a token. */
export const hashToken = (token: string): string => crypto.createHash('sha256').update(token).digest('hex');
