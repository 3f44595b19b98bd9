/** Sends the phone's waiting observations: on start, when the phone comes online, and every 10 s while any wait. */
import { useCallback, useEffect, useMemo, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createSyncRunner, syncQueue, waitingItems } from '../../../lib/offline-queue';
import { makeQueuedObservation, observationStore, type QueuedObservation } from '../lib/observation-queue';
import { sendObservation } from '../api/create-observation';
import { observationKeys } from '../api/keys';

export const OBSERVATION_SYNC_MS = 10_000;

export type LogOutcome = { kind: 'sent' } | { kind: 'queued' } | { kind: 'rejected'; message: string };

const runners = new Map<number, () => Promise<unknown>>();

/** The signed-in person's observation queue: what waits, what was refused, save and dismiss. */
export function useObservationQueue(userId: number) {
  const qc = useQueryClient();
  const store = observationStore();
  const [items, setItems] = useState<QueuedObservation[]>([]);

  const refresh = useCallback(async () => setItems((await store.all()).filter((i) => i.userId === userId)), [store, userId]);

  const run = useMemo(() => {
    let runner = runners.get(userId);
    if (!runner) {
      runner = createSyncRunner(async () => {
        const report = await syncQueue(store, sendObservation, { userId, isOnline: () => navigator.onLine, what: 'observation' });
        if (report.sent.length) await qc.invalidateQueries({ queryKey: observationKeys.all });
        return report;
      });
      runners.set(userId, runner);
    }
    return runner;
  }, [store, qc, userId]);

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
    const timer = window.setInterval(syncNow, OBSERVATION_SYNC_MS);
    return () => window.clearInterval(timer);
  }, [waiting.length, syncNow]);

  /** Stores the observation on the phone first, then tries to send it. */
  const save = useCallback(
    async (input: Omit<QueuedObservation, 'queuedAt' | 'attempts' | 'lastError' | 'rejected' | 'userId'>): Promise<LogOutcome> => {
      await store.put(makeQueuedObservation({ ...input, userId }));
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

  return { waiting, rejected, save, dismiss, syncNow };
}
