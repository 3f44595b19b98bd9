/**
 * Refuses guessable passwords: length alone lets "password123" through. The check runs zxcvbn-ts
 * with its common-password dictionary (shipped from npm) and the person's own name and e-mail.
 */
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import { unprocessable } from '../../errors';

/** zxcvbn's score scale: 3 is "safely unguessable: moderate protection from offline slow-hash attacks". */
export const MIN_PASSWORD_SCORE = 3;

let checker: ZxcvbnFactory | null = null;
const zxcvbn = () => (checker ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs }));

const WARNINGS: Record<string, string> = {
  topTen: 'it is one of the ten most used passwords',
  topHundred: 'it is one of the hundred most used passwords',
  common: 'it is a commonly used password',
  similarToCommon: 'it is close to a commonly used password',
  wordByItself: 'a single word is easy to guess',
  namesByThemselves: 'a name by itself is easy to guess',
  commonNames: 'common names are easy to guess',
  userInputs: 'it contains your name or e-mail',
  straightRow: 'a row of keys is easy to guess',
  keyPattern: 'a keyboard pattern is easy to guess',
  simpleRepeat: 'repeated characters are easy to guess',
  extendedRepeat: 'repeated patterns are easy to guess',
  sequences: 'a sequence like abc or 123 is easy to guess',
  recentYears: 'recent years are easy to guess',
  dates: 'dates are easy to guess',
};

/** Why a password is too easy to guess, or null when it is strong enough. */
export function passwordWeakness(password: string, userInputs: string[] = []): string | null {
  const inputs = userInputs.flatMap((s) => [s, ...s.split(/[@.\s_-]+/)]).filter((s) => s.length >= 3);
  const result = zxcvbn().check(password, inputs);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  const why = (result.feedback.warning && WARNINGS[result.feedback.warning]) || 'it is too easy to guess';
  return `choose another password: ${why}. A few unrelated words together are strong and easy to remember`;
}

/** Throws a 422 naming the field when the password is too easy to guess. */
export function assertStrongPassword(password: string, userInputs: string[] = [], field = 'password'): void {
  const weakness = passwordWeakness(password, userInputs);
  if (weakness) throw unprocessable(`${field}: ${weakness}.`, [{ path: field, message: weakness }]);
}
