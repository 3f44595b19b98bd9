/**
 * Establishment and browse checks waiting on the phone: the shared offline queue
 * (src/lib/offline-queue.ts) with a check's body. Stored in IndexedDB (idb-keyval, db
 * "browseline-checks") before anything is sent; every retry carries the same Idempotency-Key, so
 * the server records the check once.
 */
import { browserStore, makeQueuedItem, type NewQueuedItem, type OfflineStore, type QueuedItem } from '../../../lib/offline-queue';
import type { UnitCheckCreateInput } from '../../../../shared/schemas/checks';

/** The kinds the field sheet offers (a timber cruise is the forester's, on the unit's page). */
export const FIELD_CHECK_KINDS = ['establishment', 'browse'] as const;
export type FieldCheckKind = (typeof FIELD_CHECK_KINDS)[number];

export interface QueuedCheck extends QueuedItem {
  unitId: number;
  unitName: string;
  body: UnitCheckCreateInput;
}

/** A new idempotency key for one check (fits the server's 8–200 [A-Za-z0-9_.:-] rule). */
export function newCheckKey(randomUuid: () => string = () => crypto.randomUUID()): string {
  return `check-${randomUuid()}`;
}

/** The queue item for a check the person just saved. */
export function makeQueuedCheck(input: NewQueuedItem<QueuedCheck>, now = new Date()): QueuedCheck {
  return makeQueuedItem<QueuedCheck>(input, now);
}

/** The phone's check store (one per page; memory where there is no IndexedDB). */
export function checkStore(): OfflineStore<QueuedCheck> {
  return browserStore<QueuedCheck>('browseline-checks', 'checks');
}
