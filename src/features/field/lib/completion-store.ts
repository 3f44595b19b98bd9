/** The completion queue's store on the phone: IndexedDB through idb-keyval (photos kept as Blobs), memory when IndexedDB is missing. */
import { createStore, del, set, values } from 'idb-keyval';
import { memoryStore, type QueueStore, type QueuedCompletion } from './completion-queue';

let store: QueueStore | null = null;

/** The phone's completion store (one per page). */
export function completionStore(): QueueStore {
  if (store) return store;
  if (typeof indexedDB === 'undefined') {
    store = memoryStore();
    return store;
  }
  const idb = createStore('browseline-field', 'completions');
  store = {
    all: () => values<QueuedCompletion>(idb),
    put: (item) => set(item.key, item, idb),
    remove: (key) => del(key, idb),
  };
  return store;
}
