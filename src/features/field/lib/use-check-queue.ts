/** (Kept out of hooks/: that folder is bundled into the field sheet's first load; this one loads with the lazy check form.) The phone's check queue: the shared offline queue (src/lib/offline-queue.ts) with checks' send function and store. */
import { makeQueuedItem, useOfflineQueue, type NewQueuedItem, type SaveOutcome } from '../../../lib/offline-queue';
import { checkStore, type QueuedCheck } from '../lib/check-queue';
import { sendCheck } from '../api/send-check';

export type CheckSaveOutcome = SaveOutcome;

/** The signed-in person's check queue: what waits, what was refused, save and dismiss. */
export function useCheckQueue(userId: number) {
  const queue = useOfflineQueue<QueuedCheck>({ name: 'checks', userId, store: checkStore(), send: sendCheck, what: 'check' });
  /** Stores the check on the phone first, then tries to send it. */
  const save = (input: Omit<NewQueuedItem<QueuedCheck>, 'userId'>) => queue.save(makeQueuedItem<QueuedCheck>({ ...input, userId }));
  return { ...queue, save };
}
