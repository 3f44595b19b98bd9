/**
 * Where the last data a person saw is kept on the phone (IndexedDB, db `browseline-cache`), so the
 * field sheet and the portal open with no signal. Only the small `idb-keyval` is needed here: the
 * sign-in page clears it before anyone else's data could show.
 */
import { createStore, del, get, promisifyRequest } from 'idb-keyval';

const store = typeof indexedDB === 'undefined' ? undefined : createStore('browseline-cache', 'queries');
export const PERSISTED_CACHE_KEY = 'query-cache';
/** localStorage key of the copy written as the page is left (an IndexedDB write may be cut off by the unload). */
export const UNLOAD_COPY_KEY = 'browseline-cache-unload';
/** A larger copy is not written to localStorage (its quota is a few MB for the whole site). */
const UNLOAD_COPY_MAX_CHARS = 2_000_000;

/** The IndexedDB storage the query persister writes through. A write is committed at once (`commit()`), not when the page next idles. */
export const persistedCacheStorage = {
  getItem: (key: string) => (store ? get<string>(key, store) : Promise.resolve(undefined)),
  setItem: (key: string, value: string) =>
    store
      ? store('readwrite', (s) => {
          s.put(value, key);
          s.transaction.commit?.();
          return promisifyRequest(s.transaction);
        })
      : Promise.resolve(),
  removeItem: (key: string) => (store ? del(key, store) : Promise.resolve()),
};

const local = (): Storage | undefined => {
  try {
    return typeof localStorage === 'undefined' ? undefined : localStorage;
  } catch {
    return undefined; // storage blocked by the browser's settings
  }
};

/** Keeps a copy synchronously as the page is left (pagehide): it survives the unload whatever happens to IndexedDB's write. */
export function keepUnloadCopy(value: string): void {
  if (value.length > UNLOAD_COPY_MAX_CHARS) return;
  try {
    local()?.setItem(UNLOAD_COPY_KEY, value);
  } catch {
    /* over quota: IndexedDB's write is all there is */
  }
}

/** The copy kept as the page was last left, if any. */
export function readUnloadCopy(): string | undefined {
  try {
    return local()?.getItem(UNLOAD_COPY_KEY) ?? undefined;
  } catch {
    return undefined;
  }
}

/** Removes the copy kept as the page was left. */
export function dropUnloadCopy(): void {
  try {
    local()?.removeItem(UNLOAD_COPY_KEY);
  } catch {
    /* nothing was kept */
  }
}

/** Forgets every persisted answer (sign-in, sign-out, another person's session). */
export async function clearPersistedCache(): Promise<void> {
  dropUnloadCopy();
  try {
    await persistedCacheStorage.removeItem(PERSISTED_CACHE_KEY);
  } catch {
    /* a private window without IndexedDB: nothing was kept */
  }
}
