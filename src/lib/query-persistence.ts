/**
 * The query cache kept in IndexedDB (TanStack Query's persister): restored before the app's first
 * render, so the field sheet, a task and the portal open with no signal showing the last data this
 * person saw. Sign-in and sign-out clear it (lib/persisted-cache.ts).
 */
import { dehydrate, type DehydrateOptions, type QueryClient } from '@tanstack/react-query';
import { persistQueryClientRestore, type PersistedClient, type Persister } from '@tanstack/react-query-persist-client';
import { clearPersistedCache, dropUnloadCopy, keepUnloadCopy, PERSISTED_CACHE_KEY, persistedCacheStorage, readUnloadCopy } from './persisted-cache';
import { createCacheSaver, type CacheSaver } from './cache-saver';
import { shouldPersistQuery } from './persist-rules';
import type { SessionUser } from '../../shared/schemas/auth';

/** Kept data older than this is dropped. */
export const PERSIST_MAX_AGE_MS = 7 * 24 * 3600 * 1000;
/** The kept cache is written at most once per this many milliseconds while it changes (and at once when the page is left). */
export const PERSIST_INTERVAL_MS = 1000;

let stopPersisting: (() => void) | null = null;
/** Set at sign-out: a save already scheduled must not put the data back. */
let closed = false;

/** Stops keeping the cache and removes what was kept (sign-out): no write of this session can follow. */
export async function forgetPersistedQueries(): Promise<void> {
  closed = true;
  stopPersisting?.();
  stopPersisting = null;
  await clearPersistedCache();
}

const BUSTER = 'browseline-1';

/** Which queries are kept: answered ones this person's role may keep (persist-rules.ts), read when the cache is saved. */
function keptQueries(queryClient: QueryClient): DehydrateOptions {
  return {
    shouldDehydrateQuery: (query) => {
      const role = queryClient.getQueryData<SessionUser | null>(['auth', 'me'])?.role;
      return query.state.status === 'success' && shouldPersistQuery(query.queryKey, role);
    },
  };
}

/** What is written (the persister's format: buster, time, dehydrated queries). */
export function persistedSnapshot(queryClient: QueryClient, now = Date.now()): PersistedClient {
  return { buster: BUSTER, timestamp: now, clientState: dehydrate(queryClient, keptQueries(queryClient)) };
}

const parse = (text: string | undefined): PersistedClient | undefined => {
  if (!text) return undefined;
  try {
    return JSON.parse(text) as PersistedClient;
  } catch {
    return undefined;
  }
};

/**
 * Reads the kept cache: IndexedDB's copy, or the copy written as the page was last left when that is newer
 * (IndexedDB's last write was cut off by the unload). The newer copy goes into IndexedDB; the other is dropped.
 */
const persister: Persister = {
  persistClient: async (client) => {
    if (!closed) await persistedCacheStorage.setItem(PERSISTED_CACHE_KEY, JSON.stringify(client));
  },
  restoreClient: async () => {
    const stored = parse(await persistedCacheStorage.getItem(PERSISTED_CACHE_KEY));
    const unload = parse(readUnloadCopy());
    dropUnloadCopy();
    if (unload && (!stored || unload.timestamp > stored.timestamp)) {
      await persistedCacheStorage.setItem(PERSISTED_CACHE_KEY, JSON.stringify(unload)).catch(() => undefined);
      return unload;
    }
    return stored;
  },
  removeClient: () => clearPersistedCache(),
};

/**
 * Keeps the cache up to date: written through `saver` soon after it changes (at most once a second, when the
 * page is idle), and at once when the page is hidden or left — then also synchronously to localStorage, as an
 * IndexedDB write begun while the page unloads may never finish.
 */
function keepSaving(queryClient: QueryClient): () => void {
  const save = (leaving: boolean) => {
    if (closed) return;
    const text = JSON.stringify(persistedSnapshot(queryClient));
    if (leaving) keepUnloadCopy(text);
    void persistedCacheStorage.setItem(PERSISTED_CACHE_KEY, text).catch(() => undefined);
  };
  const saver: CacheSaver = createCacheSaver(save, { intervalMs: PERSIST_INTERVAL_MS });
  const unsubscribe = queryClient.getQueryCache().subscribe((event) => {
    if (event.type === 'added' || event.type === 'removed' || event.type === 'updated') saver.changed();
  });
  const leave = () => saver.flush();
  const hidden = () => {
    if (document.visibilityState === 'hidden') saver.flush();
  };
  window.addEventListener('pagehide', leave);
  document.addEventListener('visibilitychange', hidden);
  return () => {
    saver.stop();
    unsubscribe();
    window.removeEventListener('pagehide', leave);
    document.removeEventListener('visibilitychange', hidden);
  };
}

/** Restores the kept cache (at most `waitMs`), then keeps it up to date; answers when the app may render. */
export async function startQueryPersistence(queryClient: QueryClient, waitMs = 1500): Promise<void> {
  closed = false;
  stopPersisting?.();
  // Kept queries must live in memory as long as on disk, or an unmounted one would be dropped from both.
  for (const head of ['auth', 'tasks', 'field', 'portal', 'calendar-feeds']) queryClient.setQueryDefaults([head], { gcTime: PERSIST_MAX_AGE_MS });
  performance.mark('browseline:restore-start');
  const restored = persistQueryClientRestore({ queryClient, persister, maxAge: PERSIST_MAX_AGE_MS, buster: BUSTER });
  // Saving starts once the kept copy is back (or found unusable): a save before would overwrite it with less.
  let stopped = false;
  stopPersisting = () => {
    stopped = true;
  };
  void restored
    .catch(() => undefined)
    .then(() => {
      if (stopped || closed || typeof window === 'undefined') return;
      stopPersisting = keepSaving(queryClient);
    });
  // What was kept shows at once, but it may predate the person's last write (the kept copy is written
  // a moment after each answer): mark it stale so every page asks again as soon as there is signal.
  restored.then(() => queryClient.invalidateQueries()).catch(() => undefined);
  await Promise.race([restored.catch(() => undefined), new Promise((resolve) => setTimeout(resolve, waitMs))]);
  // Timing marks for the slow-phone bench's breakdown of a warm open (tests/bench/slow-phone.ts).
  performance.mark('browseline:restored');
}
