/** The Idempotency-Key header of a write sent from a phone's queue: the same key answers the first write again. */
import type { Request } from 'express';
import { IDEMPOTENCY_HEADER, IdempotencyKeySchema } from '../../shared/schemas/task';
import { badRequest, unprocessable } from '../errors';

/** The request's key, checked (422 naming the header when it is malformed), or null when none was sent. */
export function optionalIdempotencyKey(req: Request): string | null {
  const raw = req.get(IDEMPOTENCY_HEADER);
  if (!raw) return null;
  const parsed = IdempotencyKeySchema.safeParse(raw);
  if (!parsed.success) throw unprocessable(`${IDEMPOTENCY_HEADER}: ${parsed.error.issues[0]?.message ?? 'is not valid'}.`);
  return parsed.data;
}

/** The request's key, required: 400 saying one key stands for one `record` (e.g. "sit") when none was sent. */
export function idempotencyKey(req: Request, record: string): string {
  const key = optionalIdempotencyKey(req);
  if (key === null) throw badRequest(`Send an ${IDEMPOTENCY_HEADER} header: one new random key per ${record}, reused when the same ${record} is sent again.`);
  return key;
}
