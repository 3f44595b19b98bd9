/**
 * The query cache kept in IndexedDB (TanStack Query's persister): restored before the app's first
 * render, so the field sheet, a task and the portal open with no signal showing the last data this
 * person saw. Sign-in and sign-out clear it (lib/persisted-cache.ts).
 */
import { dehydrate, type DehydrateOptions, type QueryClient } from '@tanstack/react-query';
import { persistQueryClient, type PersistedClient } from '@tanstack/react-query-persist-client';
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { clearPersistedCache, PERSISTED_CACHE_KEY, persistedCacheStorage } from './persisted-cache';
import { shouldPersistQuery } from './persist-rules';
import type { SessionUser } from '../../shared/schemas/auth';

/** Kept data older than this is dropped. */
export const PERSIST_MAX_AGE_MS = 7 * 24 * 3600 * 1000;

let stopPersisting: (() => void) | null = null;
/** Set at sign-out: the persister's throttled write, already scheduled, must not put the data back. */
let closed = false;

/** The storage the persister writes through; it writes nothing once this session is forgotten. */
const sessionStorageOfQueries = {
  getItem: persistedCacheStorage.getItem,
  setItem: (key: string, value: string) => (closed ? Promise.resolve() : persistedCacheStorage.setItem(key, value)),
  removeItem: persistedCacheStorage.removeItem,
};

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

/** What the persister would write now (its format: buster, time, dehydrated queries), for an immediate save. */
export function persistedSnapshot(queryClient: QueryClient, now = Date.now()): PersistedClient {
  return { buster: BUSTER, timestamp: now, clientState: dehydrate(queryClient, keptQueries(queryClient)) };
}

let flushArmed = false;
/**
 * Saves the cache at once when the page is hidden or left (a reload, another app): the persister's
 * throttled write could otherwise still be pending, and the page would open again without it and
 * wait for the network before showing anything.
 */
function saveWhenLeaving(queryClient: QueryClient): void {
  if (flushArmed || typeof window === 'undefined') return;
  flushArmed = true;
  const save = () => {
    if (closed) return;
    void sessionStorageOfQueries.setItem(PERSISTED_CACHE_KEY, JSON.stringify(persistedSnapshot(queryClient))).catch(() => undefined);
  };
  window.addEventListener('pagehide', save);
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'hidden') save();
  });
}

/** Restores the kept cache (at most `waitMs`), then keeps it up to date; answers when the app may render. */
export async function startQueryPersistence(queryClient: QueryClient, waitMs = 1500): Promise<void> {
  closed = false;
  // Kept queries must live in memory as long as on disk, or an unmounted one would be dropped from both.
  for (const head of ['auth', 'tasks', 'field', 'portal', 'calendar-feeds']) queryClient.setQueryDefaults([head], { gcTime: PERSIST_MAX_AGE_MS });
  const persister = createAsyncStoragePersister({ storage: sessionStorageOfQueries, key: PERSISTED_CACHE_KEY, throttleTime: 250 });
  const [unsubscribe, restored] = persistQueryClient({
    queryClient,
    persister,
    maxAge: PERSIST_MAX_AGE_MS,
    buster: BUSTER,
    dehydrateOptions: keptQueries(queryClient),
  });
  stopPersisting = unsubscribe;
  // What was kept shows at once, but it may predate the person's last write (the kept copy is written
  // a moment after each answer): mark it stale so every page asks again as soon as there is signal.
  restored.then(() => queryClient.invalidateQueries()).catch(() => undefined);
  saveWhenLeaving(queryClient);
  performance.mark('browseline:restore-start');
  await Promise.race([restored.catch(() => undefined), new Promise((resolve) => setTimeout(resolve, waitMs))]);
  // Timing marks for the slow-phone bench's breakdown of a warm open (tests/bench/slow-phone.ts).
  performance.mark('browseline:restored');
}
