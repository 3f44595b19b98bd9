import type { Request } from 'express';
import { describe, expect, it } from 'vitest';
import { idempotencyKey, optionalIdempotencyKey } from '../../../server/middlewares/idempotency-key';
import { IDEMPOTENCY_HEADER } from '../../../shared/schemas/task';

/** A request whose only header is the Idempotency-Key given (or none). */
const withKey = (value?: string) => ({ get: (name: string) => (name.toLowerCase() === IDEMPOTENCY_HEADER.toLowerCase() ? value : undefined) }) as unknown as Request;
const KEY = '6f1c2b8e-3d4a-4f5b-9c7d-1e2f3a4b5c6d';

describe('Idempotency-Key header', () => {
  it('answers the key when one is sent', () => {
    expect(idempotencyKey(withKey(KEY), 'sit')).toBe(KEY);
    expect(optionalIdempotencyKey(withKey(KEY))).toBe(KEY);
  });

  it('is null when optional and absent; a 400 saying what one key stands for when required', () => {
    expect(optionalIdempotencyKey(withKey())).toBeNull();
    expect(() => idempotencyKey(withKey(), 'completion')).toThrow(expect.objectContaining({ status: 400, message: `Send an ${IDEMPOTENCY_HEADER} header: one new random key per completion, reused when the same completion is sent again.` }));
  });

  it('refuses a malformed key with a 422 naming the header, required or not', () => {
    expect(() => optionalIdempotencyKey(withKey('x'))).toThrow(expect.objectContaining({ status: 422, message: expect.stringMatching(new RegExp(`^${IDEMPOTENCY_HEADER}: `)) }));
    expect(() => idempotencyKey(withKey('x'), 'observation')).toThrow(expect.objectContaining({ status: 422 }));
  });
});
