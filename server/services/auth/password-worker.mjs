/**
 * Entry of a password worker thread (see passwords.ts): bcrypt's rounds run here, synchronously,
 * so a sign-in's fifth of a second of hashing never holds up the request thread. Plain JavaScript:
 * bcryptjs needs nothing else, and the thread starts in a few milliseconds.
 */
import bcrypt from 'bcryptjs';

/** A new bcrypt hash of `password` at `cost`. */
export function hash({ password, cost }) {
  return bcrypt.hashSync(password, cost);
}

/** Whether `password` matches the bcrypt `hash`. */
export function compare({ password, hash: stored }) {
  return bcrypt.compareSync(password, stored);
}
