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
import { makeQueuedItem, memoryStore as genericMemoryStore, type OfflineStore, type QueuedItem, type SendItem } from '../../../lib/offline-queue';
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

/** A completion as it waits on the phone (the queue's bookkeeping plus the task and the form's fields). */
export interface QueuedCompletion extends QueuedItem {
  taskId: number;
  taskName: string;
  unitName: string;
  fields: CompletionFields;
  photos: QueuedPhoto[];
}

/** Where queued completions live. */
export type CompletionStore = OfflineStore<QueuedCompletion>;

/** Sends one completion with its key; throws on any failure (an error with a `status`, 0 for the network). */
export type SendCompletion = SendItem<QueuedCompletion>;

export { classifySendError, createSyncRunner, syncQueue, waitingItems, type SendOutcome, type SyncOptions, type SyncReport } from '../../../lib/offline-queue';

/** An in-memory store of completions (tests, and the fallback when the browser has no IndexedDB). */
export const memoryStore = (): CompletionStore & { items: Map<string, QueuedCompletion> } => genericMemoryStore<QueuedCompletion>();

export const OFFLINE_MESSAGE = 'Saved on this phone — will send when you’re back online.';

/** The idempotency key of a new completion: a random UUID with a short prefix (fits the server's 8–200 [A-Za-z0-9_.:-] rule). */
export function newCompletionKey(randomUuid: () => string = () => crypto.randomUUID()): string {
  return `done-${randomUuid()}`;
}

/** Makes the queue item for a completion the person just saved. */
export function makeQueuedCompletion(input: { key: string; taskId: number; taskName: string; unitName: string; userId: number; fields: CompletionFields; photos: QueuedPhoto[] }, now: Date = new Date()): QueuedCompletion {
  return makeQueuedItem<QueuedCompletion>(input, now);
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
