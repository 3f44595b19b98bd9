/** The phone's completion queue in React: the shared offline queue (src/lib/offline-queue.ts) with completions' send function and store, given to every field page through a context. */
import { createContext, useContext, useMemo, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useOfflineQueue, type OfflineQueue, type SaveOutcome } from '../../../lib/offline-queue';
import { makeQueuedCompletion, type CompletionFields, type QueuedCompletion, type QueuedPhoto } from '../lib/completion-queue';
import { completionStore } from '../lib/completion-store';
import { sendCompletion } from '../api/complete-task';
import { fieldKeys } from '../api/keys';

export interface SaveCompletionInput {
  key: string;
  taskId: number;
  taskName: string;
  unitName: string;
  fields: CompletionFields;
  photos: QueuedPhoto[];
}

interface CompletionQueue extends Omit<OfflineQueue<QueuedCompletion>, 'save'> {
  /** Stores the completion on the phone, then tries to send it. */
  save: (input: SaveCompletionInput) => Promise<SaveOutcome>;
  waitingFor: (taskId: number) => QueuedCompletion | undefined;
}

const QueueContext = createContext<CompletionQueue | null>(null);

/** Runs the completion queue for the signed-in crew member while any field page is open. */
export function CompletionQueueProvider({ userId, children }: { userId: number; children: ReactNode }) {
  const qc = useQueryClient();
  const queue = useOfflineQueue<QueuedCompletion>({
    name: 'completions',
    userId,
    store: completionStore(),
    send: async (item) => {
      const answer = await sendCompletion(item);
      qc.setQueryData(fieldKeys.task(answer.task.id), answer.task);
      return answer;
    },
    afterSync: (report) => (report.sent.length || report.rejected.length ? qc.invalidateQueries({ queryKey: fieldKeys.tasks }) : undefined),
  });

  const value = useMemo<CompletionQueue>(
    () => ({
      ...queue,
      save: (input) => queue.save(makeQueuedCompletion({ ...input, userId })),
      waitingFor: (taskId) => queue.waiting.find((i) => i.taskId === taskId),
    }),
    [queue, userId],
  );
  return <QueueContext.Provider value={value}>{children}</QueueContext.Provider>;
}

/** The completion queue (inside CompletionQueueProvider). */
export function useCompletionQueue(): CompletionQueue {
  const queue = useContext(QueueContext);
  if (!queue) throw new Error('useCompletionQueue needs CompletionQueueProvider above it.');
  return queue;
}
