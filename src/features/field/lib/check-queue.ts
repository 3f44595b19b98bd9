/**
 * Establishment and browse checks waiting on the phone: the shared offline queue
 * (src/lib/offline-queue.ts) with a check's body. Stored in IndexedDB (idb-keyval, db
 * "browseline-checks") before anything is sent; every retry carries the same Idempotency-Key, so
 * the server records the check once.
 */
import { createStore, del, set, values } from 'idb-keyval';
import { memoryStore, type OfflineStore, type QueuedItem } from '../../../lib/offline-queue';
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
export function makeQueuedCheck(input: Omit<QueuedCheck, 'queuedAt' | 'attempts' | 'lastError' | 'rejected'>, now = new Date()): QueuedCheck {
  return { ...input, queuedAt: now.toISOString(), attempts: 0, lastError: null, rejected: null };
}

let store: OfflineStore<QueuedCheck> | null = null;

/** The phone's check store (one per page; memory where there is no IndexedDB). */
export function checkStore(): OfflineStore<QueuedCheck> {
  if (store) return store;
  if (typeof indexedDB === 'undefined') {
    store = memoryStore<QueuedCheck>();
    return store;
  }
  const idb = createStore('browseline-checks', 'checks');
  store = { all: () => values<QueuedCheck>(idb), put: (item) => set(item.key, item, idb), remove: (key) => del(key, idb) };
  return store;
}
