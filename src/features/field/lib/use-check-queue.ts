/** (Kept out of hooks/: that folder is bundled into the field sheet's first load; this one loads with the lazy check form.) Sends the phone's waiting checks: on start, when the phone comes online, and every 10 s while any wait. */
import { useCallback, useEffect, useMemo, useState } from 'react';
import { createSyncRunner, syncQueue, waitingItems } from '../../../lib/offline-queue';
import { checkStore, makeQueuedCheck, type QueuedCheck } from '../lib/check-queue';
import { sendCheck } from '../api/send-check';

export const CHECK_SYNC_MS = 10_000;

export type CheckSaveOutcome = { kind: 'sent' } | { kind: 'queued' } | { kind: 'rejected'; message: string };

const runners = new Map<number, () => Promise<unknown>>();

/** The signed-in person's check queue: what waits, what was refused, save and dismiss. */
export function useCheckQueue(userId: number) {
  const store = checkStore();
  const [items, setItems] = useState<QueuedCheck[]>([]);
  const refresh = useCallback(async () => setItems((await store.all()).filter((i) => i.userId === userId)), [store, userId]);

  const run = useMemo(() => {
    let runner = runners.get(userId);
    if (!runner) {
      runner = createSyncRunner(() => syncQueue(store, sendCheck, { userId, isOnline: () => navigator.onLine, what: 'check' }));
      runners.set(userId, runner);
    }
    return runner;
  }, [store, userId]);

  const syncNow = useCallback(() => {
    run()
      .catch(() => undefined)
      .finally(() => void refresh());
  }, [run, refresh]);

  useEffect(() => {
    void refresh().then(syncNow);
    window.addEventListener('online', syncNow);
    return () => window.removeEventListener('online', syncNow);
  }, [refresh, syncNow]);

  const waiting = useMemo(() => waitingItems(items), [items]);
  const rejected = useMemo(() => items.filter((i) => i.rejected !== null), [items]);
  useEffect(() => {
    if (waiting.length === 0) return;
    const timer = window.setInterval(syncNow, CHECK_SYNC_MS);
    return () => window.clearInterval(timer);
  }, [waiting.length, syncNow]);

  /** Stores the check on the phone first, then tries to send it. */
  const save = useCallback(
    async (input: Omit<QueuedCheck, 'queuedAt' | 'attempts' | 'lastError' | 'rejected' | 'userId'>): Promise<CheckSaveOutcome> => {
      await store.put(makeQueuedCheck({ ...input, userId }));
      await refresh();
      await run().catch(() => undefined);
      const after = (await store.all()).find((i) => i.key === input.key);
      await refresh();
      if (!after) return { kind: 'sent' };
      if (after.rejected) return { kind: 'rejected', message: after.rejected.message };
      return { kind: 'queued' };
    },
    [store, userId, refresh, run],
  );

  const dismiss = useCallback(
    async (key: string) => {
      await store.remove(key);
      await refresh();
    },
    [store, refresh],
  );

  return { waiting, rejected, save, dismiss };
}
