/**
 * A queue of writes for poor signal, for any write that carries an idempotency key (task
 * completions, checks, field observations, sits). An item is written to the phone's store BEFORE it
 * is sent, with its key made once; a runner sends what is queued and removes an item only after the
 * server accepted it (2xx, or 200 replayed) or refused it for good (a 4xx other than "signed out").
 * Network failures and server hiccups keep the item, and every retry carries the same key, so the
 * server records the write exactly once.
 *
 * The logic is pure over a small store interface (the browser uses IndexedDB through
 * `browserStore`, the unit tests memory); `useOfflineQueue` runs it in React for one kind of write,
 * with that kind's send function.
 */
import { useCallback, useEffect, useMemo, useState } from 'react';
import { createStore, del, set, values } from 'idb-keyval';

/** A refusal the server gave for good: shown to the person until they dismiss it. */
export interface QueueRejection {
  status: number;
  message: string;
  at: string;
}

/** What every queued write carries besides its own fields. */
export interface QueuedItem {
  /** The idempotency key, made once when the person tapped Save; also the store key. */
  key: string;
  /** Who queued it: only their own items are sent under their session. */
  userId: number;
  queuedAt: string;
  attempts: number;
  lastError: string | null;
  rejected: QueueRejection | null;
}

/** Where queued items live. */
export interface OfflineStore<T extends QueuedItem> {
  all(): Promise<T[]>;
  put(item: T): Promise<void>;
  remove(key: string): Promise<void>;
}

/** What one send attempt came to. */
export type SendOutcome = { kind: 'sent'; replayed: boolean } | { kind: 'retry'; message: string } | { kind: 'rejected'; status: number; message: string };

/**
 * Whether a failed send is worth retrying: the network (status 0), a timeout, too many requests,
 * a server error, or being signed out (the person signs in again and it goes) keep the item;
 * any other 4xx is the server's final word on it.
 */
export function classifySendError(error: unknown, what = 'completion'): SendOutcome {
  const status = typeof (error as { status?: unknown })?.status === 'number' ? (error as { status: number }).status : 0;
  const message = error instanceof Error && error.message ? error.message : `The ${what} could not be sent.`;
  if (status === 0 || status === 408 || status === 429 || status >= 500) return { kind: 'retry', message };
  if (status === 401) return { kind: 'retry', message: `You are signed out. Sign in again and the ${what} will be sent.` };
  if (status === 403 && (error as { code?: string }).code === 'csrf') return { kind: 'retry', message };
  return { kind: 'rejected', status, message };
}

export interface SyncReport {
  sent: string[];
  replayed: string[];
  rejected: string[];
  stillQueued: string[];
  /** True when nothing was tried because the phone is offline. */
  skippedOffline: boolean;
}

export interface SyncOptions {
  /** Whether the phone thinks it has a connection (navigator.onLine). */
  isOnline?: () => boolean;
  /** Only this person's items are sent. */
  userId?: number;
  now?: () => Date;
  /** The word for an item in messages ("completion", "observation"). */
  what?: string;
}

/** The items still waiting to be sent (not rejected), oldest first, for one person if given. */
export function waitingItems<T extends QueuedItem>(items: readonly T[], userId?: number): T[] {
  return items
    .filter((i) => i.rejected === null && (userId === undefined || i.userId === userId))
    .sort((a, b) => a.queuedAt.localeCompare(b.queuedAt) || a.key.localeCompare(b.key));
}

/**
 * Sends every waiting item once, oldest first. A sent item is removed; a rejected one is kept with
 * the server's message; a retryable failure keeps it with its attempt count. After a network
 * failure the rest wait too (no point hammering a dead link).
 */
export async function syncQueue<T extends QueuedItem>(store: OfflineStore<T>, send: (item: T) => Promise<{ replayed: boolean }>, options: SyncOptions = {}): Promise<SyncReport> {
  const report: SyncReport = { sent: [], replayed: [], rejected: [], stillQueued: [], skippedOffline: false };
  const waiting = waitingItems(await store.all(), options.userId);
  if (options.isOnline && !options.isOnline()) {
    report.skippedOffline = true;
    report.stillQueued = waiting.map((i) => i.key);
    return report;
  }
  const now = options.now ?? (() => new Date());
  let networkDown = false;
  for (const item of waiting) {
    if (networkDown) {
      report.stillQueued.push(item.key);
      continue;
    }
    let outcome: SendOutcome;
    try {
      const answer = await send(item);
      outcome = { kind: 'sent', replayed: answer.replayed };
    } catch (error) {
      outcome = classifySendError(error, options.what);
      if (outcome.kind === 'retry' && ((error as { status?: number })?.status ?? 0) === 0) networkDown = true;
    }
    if (outcome.kind === 'sent') {
      await store.remove(item.key);
      report.sent.push(item.key);
      if (outcome.replayed) report.replayed.push(item.key);
    } else if (outcome.kind === 'rejected') {
      await store.put({ ...item, attempts: item.attempts + 1, lastError: outcome.message, rejected: { status: outcome.status, message: outcome.message, at: now().toISOString() } });
      report.rejected.push(item.key);
    } else {
      await store.put({ ...item, attempts: item.attempts + 1, lastError: outcome.message });
      report.stillQueued.push(item.key);
    }
  }
  return report;
}

/**
 * A runner that never sends the queue twice at once: a call while a sync is under way waits for
 * it and then runs once more (so an item queued meanwhile is not left behind).
 */
export function createSyncRunner(run: () => Promise<SyncReport>): () => Promise<SyncReport> {
  let current: Promise<SyncReport> | null = null;
  let again: Promise<SyncReport> | null = null;
  const start = (): Promise<SyncReport> => {
    current = run().finally(() => {
      current = null;
    });
    return current;
  };
  return () => {
    if (!current) return start();
    if (!again) {
      again = current.catch(() => undefined).then(() => {
        again = null;
        return start();
      });
    }
    return again;
  };
}

/** An in-memory store (tests, and the fallback when the browser has no IndexedDB). */
export function memoryStore<T extends QueuedItem>(): OfflineStore<T> & { items: Map<string, T> } {
  const items = new Map<string, T>();
  return {
    items,
    all: async () => [...items.values()],
    put: async (item) => {
      items.set(item.key, item);
    },
    remove: async (key) => {
      items.delete(key);
    },
  };
}

/** Sends one item with its key; throws on any failure (an error with a `status`, 0 for the network). */
export type SendItem<T extends QueuedItem> = (item: T) => Promise<{ replayed: boolean }>;

/** A new item's own fields: everything but the queue's bookkeeping. */
export type NewQueuedItem<T extends QueuedItem> = Omit<T, 'queuedAt' | 'attempts' | 'lastError' | 'rejected'>;

/** The queue item for a write the person just saved: not yet tried, not refused. */
export function makeQueuedItem<T extends QueuedItem>(input: NewQueuedItem<T>, now: Date = new Date()): T {
  return { ...input, queuedAt: now.toISOString(), attempts: 0, lastError: null, rejected: null } as T;
}

const browserStores = new Map<string, OfflineStore<QueuedItem>>();

/**
 * The phone's store for one kind of write: IndexedDB (idb-keyval; database `dbName`, object store
 * `storeName`, photos kept as Blobs), or memory where the browser has no IndexedDB. One per page.
 */
export function browserStore<T extends QueuedItem>(dbName: string, storeName: string): OfflineStore<T> {
  const id = `${dbName}/${storeName}`;
  let store = browserStores.get(id) as OfflineStore<T> | undefined;
  if (!store) {
    if (typeof indexedDB === 'undefined') store = memoryStore<T>();
    else {
      const idb = createStore(dbName, storeName);
      store = { all: () => values<T>(idb), put: (item) => set(item.key, item, idb), remove: (key) => del(key, idb) };
    }
    browserStores.set(id, store as OfflineStore<QueuedItem>);
  }
  return store;
}

/** How often a waiting queue is retried while a page that uses it is open. */
export const OFFLINE_SYNC_INTERVAL_MS = 10_000;

/** What became of a write the person saved: sent now, kept on the phone, or refused for good. */
export type SaveOutcome = { kind: 'sent' } | { kind: 'queued' } | { kind: 'rejected'; message: string };

/** One kind of queued write, as `useOfflineQueue` runs it. */
export interface OfflineQueueConfig<T extends QueuedItem> {
  /** A name for this kind of write ("completions", "sits"): one runner per name and person. */
  name: string;
  /** The signed-in person: only their items are shown and sent. */
  userId: number;
  store: OfflineStore<T>;
  /** Sends one item with its idempotency key. */
  send: SendItem<T>;
  /** The word for an item in messages ("completion", "observation"). */
  what?: string;
  /** Runs after each pass over the queue (e.g. to refresh the lists the writes change). */
  afterSync?: (report: SyncReport) => Promise<unknown> | void;
  /** How often to retry while anything waits; OFFLINE_SYNC_INTERVAL_MS unless given. */
  intervalMs?: number;
}

/** One kind of queued write in React: what waits or was refused, saving, dismissing and sending. */
export interface OfflineQueue<T extends QueuedItem> {
  /** Waiting to be sent, oldest first. */
  waiting: T[];
  /** Refused by the server for good; kept until the person dismisses them. */
  rejected: T[];
  /** Whether the phone thinks it has a connection. */
  online: boolean;
  /** True while a pass over the queue is under way. */
  syncing: boolean;
  /** Stores the item on the phone FIRST, then tries to send it; says what became of it. */
  save: (item: T) => Promise<SaveOutcome>;
  /** Forgets a (refused) item. */
  dismiss: (key: string) => Promise<void>;
  /** Sends what waits now (errors are kept on the items). */
  syncNow: () => void;
}

/** The runner and listeners of one kind of write for one person, shared by every component using it. */
interface QueueRuntime<T extends QueuedItem> {
  config: OfflineQueueConfig<T>;
  run: () => Promise<SyncReport>;
  syncing: boolean;
  listeners: Set<() => void>;
}

const runtimes = new Map<string, unknown>();

function notify(runtime: { listeners: Set<() => void> }): void {
  for (const listener of runtime.listeners) listener();
}

/** The shared runtime for a kind and person, made on first use; later calls take the newest config. */
function queueRuntime<T extends QueuedItem>(config: OfflineQueueConfig<T>): QueueRuntime<T> {
  const id = `${config.name}:${config.userId}`;
  let runtime = runtimes.get(id) as QueueRuntime<T> | undefined;
  if (runtime) return runtime;
  const run = createSyncRunner(async () => {
    const self = runtime!;
    const { store, send, userId, what, afterSync } = self.config;
    self.syncing = true;
    notify(self);
    try {
      const report = await syncQueue(store, send, { userId, what, isOnline: () => navigator.onLine });
      await afterSync?.(report);
      return report;
    } finally {
      self.syncing = false;
      notify(self);
    }
  });
  runtime = { config, run, syncing: false, listeners: new Set() };
  runtimes.set(id, runtime);
  return runtime;
}

/**
 * Runs one kind of queued write for the signed-in person: loads what the phone kept (so a reload
 * loses nothing), sends it on start, when the phone comes back online and every `intervalMs` while
 * anything waits. Every component that uses the same `name` and person shares one runner, so an
 * item is never sent twice at once.
 */
export function useOfflineQueue<T extends QueuedItem>(config: OfflineQueueConfig<T>): OfflineQueue<T> {
  const { userId, store } = config;
  const runtime = queueRuntime(config);
  useEffect(() => {
    runtime.config = config;
  });
  const [items, setItems] = useState<T[]>([]);
  const [syncing, setSyncing] = useState(runtime.syncing);
  const [online, setOnline] = useState(() => navigator.onLine);

  const refresh = useCallback(async () => {
    const all = await store.all();
    setItems(all.filter((i) => i.userId === userId));
  }, [store, userId]);

  // Every pass tells each listener when it starts and ends, and they read the store again.
  const syncNow = useCallback(() => void runtime.run().catch(() => undefined), [runtime]);

  useEffect(() => {
    const listener = () => {
      setSyncing(runtime.syncing);
      void refresh();
    };
    const goOnline = () => {
      setOnline(true);
      syncNow();
    };
    const goOffline = () => setOnline(false);
    runtime.listeners.add(listener);
    void refresh().then(syncNow);
    window.addEventListener('online', goOnline);
    window.addEventListener('offline', goOffline);
    return () => {
      runtime.listeners.delete(listener);
      window.removeEventListener('online', goOnline);
      window.removeEventListener('offline', goOffline);
    };
  }, [runtime, refresh, syncNow]);

  const waiting = useMemo(() => waitingItems(items, userId), [items, userId]);
  const rejected = useMemo(() => items.filter((i) => i.rejected !== null), [items]);
  const intervalMs = config.intervalMs ?? OFFLINE_SYNC_INTERVAL_MS;

  useEffect(() => {
    if (waiting.length === 0) return;
    const timer = window.setInterval(syncNow, intervalMs);
    return () => window.clearInterval(timer);
  }, [waiting.length, syncNow, intervalMs]);

  const save = useCallback(
    async (item: T): Promise<SaveOutcome> => {
      await store.put(item);
      await refresh();
      await runtime.run().catch(() => undefined);
      // The store says what became of it, whichever pass sent it.
      const after = (await store.all()).find((i) => i.key === item.key);
      await refresh();
      if (!after) return { kind: 'sent' };
      if (after.rejected) return { kind: 'rejected', message: after.rejected.message };
      return { kind: 'queued' };
    },
    [store, refresh, runtime],
  );

  const dismiss = useCallback(
    async (key: string) => {
      await store.remove(key);
      await refresh();
    },
    [store, refresh],
  );

  return useMemo(() => ({ waiting, rejected, online, syncing, save, dismiss, syncNow }), [waiting, rejected, online, syncing, save, dismiss, syncNow]);
}
