// @vitest-environment jsdom
/**
 * The kept query cache (src/lib/query-persistence.ts) in a browser-like page: jsdom for the window and
 * localStorage, fake-indexeddb for the phone's store, and a "reload" is a fresh copy of the module over
 * the same database. The cache is written when it changes — no pagehide needed — and sign-out removes it.
 */
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { waitFor } from '@testing-library/react';
import { QueryClient } from '@tanstack/react-query';

type Lib = typeof import('../../../../src/lib/query-persistence');
type Cache = typeof import('../../../../src/lib/persisted-cache');

/** The pages opened by a test: closed after it (in a browser a page's listeners end with it; here they would stay on the window). */
const opened: Lib[] = [];

/** A fresh page: the modules loaded anew (their state gone), the database and localStorage kept. */
async function openPage(): Promise<{ lib: Lib; cache: Cache; client: QueryClient }> {
  vi.resetModules();
  const lib = await import('../../../../src/lib/query-persistence');
  opened.push(lib);
  const cache = await import('../../../../src/lib/persisted-cache');
  const client = new QueryClient();
  await lib.startQueryPersistence(client, 1000);
  return { lib, cache, client };
}

/** The query keys written to IndexedDB now. */
async function storedKeys(cache: Cache): Promise<unknown[]> {
  const text = await cache.persistedCacheStorage.getItem(cache.PERSISTED_CACHE_KEY);
  return text ? (JSON.parse(text) as { clientState: { queries: { queryKey: unknown[] }[] } }).clientState.queries.map((q) => q.queryKey) : [];
}

const crewTasks = { tasks: [{ id: 1, name: 'Disk the plot' }] };

afterEach(async () => {
  vi.useRealTimers();
  for (const lib of opened.splice(0)) await lib.forgetPersistedQueries();
  const cache = await import('../../../../src/lib/persisted-cache');
  await cache.clearPersistedCache();
  localStorage.clear();
});

describe('the kept query cache', () => {
  it('is written when the data changes, with no pagehide, and the next page opens with it', async () => {
    const first = await openPage();
    first.client.setQueryData(['auth', 'me'], { id: 3, role: 'crew' });
    first.client.setQueryData(['tasks', 'mine'], crewTasks);
    // No pagehide, no visibilitychange: the save follows the change (at most once a second).
    await waitFor(async () => expect(await storedKeys(first.cache)).toEqual([['auth', 'me'], ['tasks', 'mine']]), { timeout: 5000 });
    expect(localStorage.getItem(first.cache.UNLOAD_COPY_KEY)).toBeNull(); // the unload copy is only for leaving

    const reloaded = await openPage();
    expect(reloaded.client.getQueryData(['tasks', 'mine'])).toEqual(crewTasks);
  });

  it('keeps a copy in localStorage as the page is left, used when IndexedDB’s last write was cut off', async () => {
    const first = await openPage();
    first.client.setQueryData(['auth', 'me'], { id: 3, role: 'crew' });
    await waitFor(async () => expect(await storedKeys(first.cache)).toEqual([['auth', 'me']]), { timeout: 5000 });
    first.client.setQueryData(['tasks', 'mine'], crewTasks);
    window.dispatchEvent(new Event('pagehide'));
    expect(localStorage.getItem(first.cache.UNLOAD_COPY_KEY)).toContain('Disk the plot');
    // The unload aborts IndexedDB's write: it still holds the older copy, without the tasks.
    const older = { buster: 'browseline-1', timestamp: Date.now() - 60_000, clientState: { mutations: [], queries: [] } };
    await first.cache.persistedCacheStorage.setItem(first.cache.PERSISTED_CACHE_KEY, JSON.stringify(older));

    const reloaded = await openPage();
    expect(reloaded.client.getQueryData(['tasks', 'mine'])).toEqual(crewTasks);
    expect(localStorage.getItem(reloaded.cache.UNLOAD_COPY_KEY)).toBeNull(); // moved into IndexedDB
    expect(await storedKeys(reloaded.cache)).toEqual([['auth', 'me'], ['tasks', 'mine']]);
  });

  it('is removed at sign-out, and a save already scheduled does not write it back', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] }); // IndexedDB's own scheduling (setImmediate) stays real
    const first = await openPage();
    first.client.setQueryData(['auth', 'me'], { id: 3, role: 'crew' });
    await vi.advanceTimersByTimeAsync(10);
    await waitForKeys(first.cache, [['auth', 'me']]);
    window.dispatchEvent(new Event('pagehide')); // an unload copy too
    first.client.setQueryData(['tasks', 'mine'], crewTasks); // a save is now scheduled, within the second

    await first.lib.forgetPersistedQueries();
    await vi.advanceTimersByTimeAsync(5000);
    window.dispatchEvent(new Event('pagehide'));
    expect(await storedKeys(first.cache)).toEqual([]);
    expect(localStorage.getItem(first.cache.UNLOAD_COPY_KEY)).toBeNull();

    vi.useRealTimers();
    const next = await openPage();
    expect(next.client.getQueryData(['tasks', 'mine'])).toBeUndefined();
    expect(next.client.getQueryData(['auth', 'me'])).toBeUndefined();
  });
});

/** Polls IndexedDB (with fake timers, where testing-library's waitFor would wait on a fake clock). */
async function waitForKeys(cache: Cache, keys: unknown[][]): Promise<void> {
  for (let i = 0; i < 100; i += 1) {
    if (JSON.stringify(await storedKeys(cache)) === JSON.stringify(keys)) return;
    await new Promise((resolve) => setImmediate(resolve));
  }
  expect(await storedKeys(cache)).toEqual(keys);
}
