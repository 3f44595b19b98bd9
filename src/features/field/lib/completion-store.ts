/** The completion queue's store on the phone: IndexedDB through idb-keyval (photos kept as Blobs), memory when IndexedDB is missing. */
import { browserStore } from '../../../lib/offline-queue';
import type { CompletionStore, QueuedCompletion } from './completion-queue';

/** The phone's completion store (one per page). */
export function completionStore(): CompletionStore {
  return browserStore<QueuedCompletion>('browseline-field', 'completions');
}
