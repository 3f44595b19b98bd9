/**
 * Where the last data a person saw is kept on the phone (IndexedDB, db `browseline-cache`), so the
 * field sheet and the portal open with no signal. Only the small `idb-keyval` is needed here: the
 * sign-in page clears it before anyone else's data could show.
 */
import { createStore, del, get, set } from 'idb-keyval';

const store = typeof indexedDB === 'undefined' ? undefined : createStore('browseline-cache', 'queries');
export const PERSISTED_CACHE_KEY = 'query-cache';

/** The IndexedDB storage the query persister writes through. */
export const persistedCacheStorage = {
  getItem: (key: string) => (store ? get<string>(key, store) : Promise.resolve(undefined)),
  setItem: (key: string, value: string) => (store ? set(key, value, store) : Promise.resolve()),
  removeItem: (key: string) => (store ? del(key, store) : Promise.resolve()),
};

/** Forgets every persisted answer (sign-in, sign-out, another person's session). */
export async function clearPersistedCache(): Promise<void> {
  try {
    await persistedCacheStorage.removeItem(PERSISTED_CACHE_KEY);
  } catch {
    /* a private window without IndexedDB: nothing was kept */
  }
}
