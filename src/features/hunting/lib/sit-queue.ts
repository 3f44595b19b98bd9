/**
 * Sits waiting on the phone: the same offline queue as the crew's completions (src/lib/offline-queue.ts),
 * kept in IndexedDB (db `browseline-hunting`) so a sit logged in a stand with no signal is sent later
 * with the same idempotency key.
 */
import { createStore, del, set, values } from 'idb-keyval';
import { memoryStore, type QueueItem, type QueueStore } from '../../../lib/offline-queue';
import type { SitCreateInput } from '../../../../shared/schemas/hunting';

export interface QueuedSit extends QueueItem {
  propertyId: number;
  standName: string;
  body: SitCreateInput;
}

/** The idempotency key of a new sit (fits the server's 8–200 [A-Za-z0-9_.:-] rule). */
export function newSitKey(randomUuid: () => string = () => crypto.randomUUID()): string {
  return `sit-${randomUuid()}`;
}

/** The queue item for a sit the person just saved. */
export function makeQueuedSit(input: { key: string; userId: number; propertyId: number; standName: string; body: SitCreateInput }, now: Date = new Date()): QueuedSit {
  return { ...input, queuedAt: now.toISOString(), attempts: 0, lastError: null, rejected: null };
}

let store: QueueStore<QueuedSit> | null = null;

/** The phone's sit store (one per page). */
export function sitStore(): QueueStore<QueuedSit> {
  if (store) return store;
  if (typeof indexedDB === 'undefined') {
    store = memoryStore<QueuedSit>();
    return store;
  }
  const idb = createStore('browseline-hunting', 'sits');
  store = { all: () => values<QueuedSit>(idb), put: (item) => set(item.key, item, idb), remove: (key) => del(key, idb) };
  return store;
}
