/**
 * Sits waiting on the phone: the same offline queue as the crew's completions (src/lib/offline-queue.ts),
 * kept in IndexedDB (db `browseline-hunting`) so a sit logged in a stand with no signal is sent later
 * with the same idempotency key.
 */
import { browserStore, type OfflineStore, type QueuedItem } from '../../../lib/offline-queue';
import type { SitCreateInput } from '../../../../shared/schemas/hunting';

export interface QueuedSit extends QueuedItem {
  propertyId: number;
  standName: string;
  body: SitCreateInput;
}

/** The idempotency key of a new sit (fits the server's 8–200 [A-Za-z0-9_.:-] rule). */
export function newSitKey(randomUuid: () => string = () => crypto.randomUUID()): string {
  return `sit-${randomUuid()}`;
}

/** The phone's sit store (one per page). */
export function sitStore(): OfflineStore<QueuedSit> {
  return browserStore<QueuedSit>('browseline-hunting', 'sits');
}
