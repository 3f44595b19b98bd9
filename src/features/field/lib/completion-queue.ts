/**
 * The crew's completion queue for poor signal. A completion is written to the phone's store BEFORE
 * it is sent, with its idempotency key made once; a runner sends what is queued and removes an item
 * only after the server accepted it (201, or 200 replayed) or refused it for good (a 4xx other than
 * "signed out"). Network failures and server hiccups keep the item queued, and every retry carries
 * the same key, so the server records the completion exactly once.
 *
 * Pure logic over a small store interface: the browser uses IndexedDB (completion-store.ts), the
 * unit tests an in-memory map.
 */
import type { TaskQuantityUsed } from '../../../../shared/domain/tasks';
import type { SprayApplicationInput } from '../../../../shared/schemas/spray-records';

/** A photo as it waits on the phone. */
export interface QueuedPhoto {
  name: string;
  type: string;
  blob: Blob;
}

/** The fields of a completion as the form gave them (multipart text fields when sent). */
export interface CompletionFields {
  doneOn: string;
  notes: string;
  /** Hours as typed; empty for none. */
  hours: string;
  quantitiesUsed: TaskQuantityUsed[];
  /** A herbicide step's spray record (7 CFR Part 110 fields and weather). */
  spray?: SprayApplicationInput;
}

/** A refusal the server gave for good: shown to the person until they dismiss it. */
export interface CompletionRejection {
  status: number;
  message: string;
  at: string;
}

export interface QueuedCompletion {
  /** The idempotency key, made once when the person tapped Save; also the store key. */
  key: string;
  taskId: number;
  taskName: string;
  unitName: string;
  /** Who queued it: only their own items are sent under their session. */
  userId: number;
  fields: CompletionFields;
  photos: QueuedPhoto[];
  queuedAt: string;
  attempts: number;
  lastError: string | null;
  rejected: CompletionRejection | null;
}

/** Where queued completions live. */
export interface QueueStore {
  all(): Promise<QueuedCompletion[]>;
  put(item: QueuedCompletion): Promise<void>;
  remove(key: string): Promise<void>;
}

/** What one send attempt came to. */
export type SendOutcome = { kind: 'sent'; replayed: boolean } | { kind: 'retry'; message: string } | { kind: 'rejected'; status: number; message: string };

/** Sends one completion with its key; throws on any failure (an error with a `status`, 0 for the network). */
export type SendCompletion = (item: QueuedCompletion) => Promise<{ replayed: boolean }>;

export const OFFLINE_MESSAGE = 'Saved on this phone — will send when you’re back online.';

/** The idempotency key of a new completion: a random UUID with a short prefix (fits the server's 8–200 [A-Za-z0-9_.:-] rule). */
export function newCompletionKey(randomUuid: () => string = () => crypto.randomUUID()): string {
  return `done-${randomUuid()}`;
}

/** Makes the queue item for a completion the person just saved. */
export function makeQueuedCompletion(input: { key: string; taskId: number; taskName: string; unitName: string; userId: number; fields: CompletionFields; photos: QueuedPhoto[] }, now: Date = new Date()): QueuedCompletion {
  return { ...input, queuedAt: now.toISOString(), attempts: 0, lastError: null, rejected: null };
}

/**
 * Whether a failed send is worth retrying: the network (status 0), a timeout, too many requests,
 * a server error, or being signed out (the person signs in again and it goes) keep the item;
 * any other 4xx is the server's final word on this completion.
 */
export function classifySendError(error: unknown): SendOutcome {
  const status = typeof (error as { status?: unknown })?.status === 'number' ? (error as { status: number }).status : 0;
  const message = error instanceof Error && error.message ? error.message : 'The completion could not be sent.';
  if (status === 0 || status === 408 || status === 429 || status >= 500) return { kind: 'retry', message };
  if (status === 401) return { kind: 'retry', message: 'You are signed out. Sign in again and the completion will be sent.' };
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
}

/** The items still waiting to be sent (not rejected), oldest first, for one person if given. */
export function waitingItems(items: readonly QueuedCompletion[], userId?: number): QueuedCompletion[] {
  return items
    .filter((i) => i.rejected === null && (userId === undefined || i.userId === userId))
    .sort((a, b) => a.queuedAt.localeCompare(b.queuedAt) || a.key.localeCompare(b.key));
}

/**
 * Sends every waiting completion once, oldest first. A sent item is removed; a rejected one is kept
 * with the server's message; a retryable failure keeps it with its attempt count. After a network
 * failure the rest wait too (no point hammering a dead link).
 */
export async function syncQueue(store: QueueStore, send: SendCompletion, options: SyncOptions = {}): Promise<SyncReport> {
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
      outcome = classifySendError(error);
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

/** The multipart body of a completion: doneOn, notes, hours, quantitiesUsed (JSON) and the photos. */
export function completionForm(item: QueuedCompletion): FormData {
  const form = new FormData();
  form.append('doneOn', item.fields.doneOn);
  if (item.fields.notes.trim()) form.append('notes', item.fields.notes.trim());
  if (item.fields.hours.trim()) form.append('hours', item.fields.hours.trim());
  form.append('quantitiesUsed', JSON.stringify(item.fields.quantitiesUsed));
  if (item.fields.spray) form.append('spray', JSON.stringify(item.fields.spray));
  for (const photo of item.photos) form.append('photos', photo.blob, photo.name);
  return form;
}

/** An in-memory store (tests, and the fallback when the browser has no IndexedDB). */
export function memoryStore(): QueueStore & { items: Map<string, QueuedCompletion> } {
  const items = new Map<string, QueuedCompletion>();
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
