/** The phone's completion queue in React: what is waiting or refused, saving a completion, and the sync runner (on start, on `online`, on a timer while anything waits). */
import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createSyncRunner, makeQueuedCompletion, syncQueue, waitingItems, type CompletionFields, type QueuedCompletion, type QueuedPhoto } from '../lib/completion-queue';
import { completionStore } from '../lib/completion-store';
import { sendCompletion } from '../api/complete-task';
import { fieldKeys } from '../api/keys';

/** How often a waiting queue is retried while the page is open. */
export const SYNC_INTERVAL_MS = 10_000;

export type SaveOutcome = { kind: 'sent' } | { kind: 'queued' } | { kind: 'rejected'; message: string };

export interface SaveCompletionInput {
  key: string;
  taskId: number;
  taskName: string;
  unitName: string;
  fields: CompletionFields;
  photos: QueuedPhoto[];
}

interface CompletionQueue {
  /** Waiting to be sent, oldest first. */
  waiting: QueuedCompletion[];
  /** Refused by the server for good; kept until the person dismisses them. */
  rejected: QueuedCompletion[];
  online: boolean;
  syncing: boolean;
  /** Stores the completion on the phone, then tries to send it. */
  save: (input: SaveCompletionInput) => Promise<SaveOutcome>;
  dismiss: (key: string) => Promise<void>;
  syncNow: () => void;
  waitingFor: (taskId: number) => QueuedCompletion | undefined;
}

const QueueContext = createContext<CompletionQueue | null>(null);

/** Runs the completion queue for the signed-in crew member while any field page is open. */
export function CompletionQueueProvider({ userId, children }: { userId: number; children: ReactNode }) {
  const qc = useQueryClient();
  const store = completionStore();
  const [items, setItems] = useState<QueuedCompletion[]>([]);
  const [online, setOnline] = useState(() => (typeof navigator === 'undefined' ? true : navigator.onLine));
  const [syncing, setSyncing] = useState(false);

  const refresh = useCallback(async () => {
    const all = await store.all();
    setItems(all.filter((i) => i.userId === userId));
  }, [store, userId]);

  const run = useMemo(
    () =>
      createSyncRunner(async () => {
        setSyncing(true);
        try {
          const report = await syncQueue(
            store,
            async (item) => {
              const answer = await sendCompletion(item);
              qc.setQueryData(fieldKeys.task(answer.task.id), answer.task);
              return answer;
            },
            { userId, isOnline: () => navigator.onLine },
          );
          await refresh();
          if (report.sent.length || report.rejected.length) await qc.invalidateQueries({ queryKey: fieldKeys.tasks });
          return report;
        } finally {
          setSyncing(false);
        }
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

  const waiting = useMemo(() => waitingItems(items), [items]);
  const rejected = useMemo(() => items.filter((i) => i.rejected !== null), [items]);

  useEffect(() => {
    if (waiting.length === 0) return;
    const timer = window.setInterval(syncNow, SYNC_INTERVAL_MS);
    return () => window.clearInterval(timer);
  }, [waiting.length, syncNow]);

  const save = useCallback(
    async (input: SaveCompletionInput): Promise<SaveOutcome> => {
      await store.put(makeQueuedCompletion({ ...input, userId }));
      await refresh();
      try {
        await run();
      } catch {
        /* stays queued */
      }
      // The store says what became of it, whichever run sent it.
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

  const value = useMemo<CompletionQueue>(
    () => ({ waiting, rejected, online, syncing, save, dismiss, syncNow, waitingFor: (taskId) => waiting.find((i) => i.taskId === taskId) }),
    [waiting, rejected, online, syncing, save, dismiss, syncNow],
  );
  return <QueueContext.Provider value={value}>{children}</QueueContext.Provider>;
}

/** The completion queue (inside CompletionQueueProvider). */
export function useCompletionQueue(): CompletionQueue {
  const queue = useContext(QueueContext);
  if (!queue) throw new Error('useCompletionQueue needs CompletionQueueProvider above it.');
  return queue;
}
