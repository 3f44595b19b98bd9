/** The phone's sit queue in React: save a sit (stored first, then sent), what waits or was refused, and the sync runner (on start, on `online`, every 10 s while anything waits). */
import { useCallback, useEffect, useMemo, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createSyncRunner, syncQueue, waitingItems } from '../../../lib/offline-queue';
import { makeQueuedSit, sitStore, type QueuedSit } from '../lib/sit-queue';
import { sendSit } from '../api/sits';
import { huntingKeys } from '../api/keys';
import type { SitCreateInput } from '../../../../shared/schemas/hunting';

export type SitSaveOutcome = { kind: 'sent' } | { kind: 'queued' } | { kind: 'rejected'; message: string };

/** Runs the sit queue for the signed-in person on this page. */
export function useSitQueue(userId: number) {
  const qc = useQueryClient();
  const store = sitStore();
  const [items, setItems] = useState<QueuedSit[]>([]);
  const [online, setOnline] = useState(() => (typeof navigator === 'undefined' ? true : navigator.onLine));

  const refresh = useCallback(async () => setItems((await store.all()).filter((i) => i.userId === userId)), [store, userId]);

  const run = useMemo(
    () =>
      createSyncRunner(async () => {
        const report = await syncQueue(store, sendSit, { userId, isOnline: () => navigator.onLine });
        await refresh();
        if (report.sent.length) await qc.invalidateQueries({ queryKey: huntingKeys.all });
        return report;
      }),
    [store, qc, userId, refresh],
  );
  const syncNow = useCallback(() => {
    run().catch(() => refresh());
  }, [run, refresh]);

  useEffect(() => {
    void refresh().then(syncNow);
    const goOnline = () => {
      setOnline(true);
      syncNow();
    };
    const goOffline = () => setOnline(false);
    window.addEventListener('online', goOnline);
    window.addEventListener('offline', goOffline);
    return () => {
      window.removeEventListener('online', goOnline);
      window.removeEventListener('offline', goOffline);
    };
  }, [refresh, syncNow]);

  const waiting = waitingItems(items, userId);
  useEffect(() => {
    if (waiting.length === 0) return;
    const timer = window.setInterval(syncNow, 10_000);
    return () => window.clearInterval(timer);
  }, [waiting.length, syncNow]);

  /** Stores the sit on the phone BEFORE sending it, then tries once. */
  const save = useCallback(
    async (input: { key: string; propertyId: number; standName: string; body: SitCreateInput }): Promise<SitSaveOutcome> => {
      const item = makeQueuedSit({ ...input, userId });
      await store.put(item);
      await refresh();
      const report = await run();
      if (report.sent.includes(item.key)) return { kind: 'sent' };
      if (report.rejected.includes(item.key)) {
        const after = (await store.all()).find((i) => i.key === item.key);
        return { kind: 'rejected', message: after?.rejected?.message ?? 'The sit was refused.' };
      }
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

  return { waiting, rejected: items.filter((i) => i.rejected !== null), online, save, dismiss, syncNow };
}
