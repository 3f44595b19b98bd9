/**
 * A queue of writes for poor signal, for any write that carries an idempotency key (task
 * completions, field observations). An item is written to the phone's store BEFORE it is sent, with
 * its key made once; a runner sends what is queued and removes an item only after the server
 * accepted it (2xx, or 200 replayed) or refused it for good (a 4xx other than "signed out").
 * Network failures and server hiccups keep the item, and every retry carries the same key, so the
 * server records the write exactly once.
 *
 * Pure logic over a small store interface: the browser uses IndexedDB, the unit tests memory.
 */

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

/** The same shapes under the names the completion and sit queues use. */
export type QueueItem = QueuedItem;
export type QueueStore<T extends QueuedItem> = OfflineStore<T>;
/** Sends one item with its key; throws on any failure (an error with a `status`, 0 for the network). */
export type SendItem<T extends QueuedItem> = (item: T) => Promise<{ replayed: boolean }>;
