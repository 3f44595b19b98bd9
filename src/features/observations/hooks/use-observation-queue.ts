/** The phone's observation queue: the shared offline queue (src/lib/offline-queue.ts) with observations' send function and store. */
import { useQueryClient } from '@tanstack/react-query';
import { makeQueuedItem, useOfflineQueue, type NewQueuedItem, type SaveOutcome } from '../../../lib/offline-queue';
import { observationStore, type QueuedObservation } from '../lib/observation-queue';
import { sendObservation } from '../api/create-observation';
import { observationKeys } from '../api/keys';

export type LogOutcome = SaveOutcome;

/** The signed-in person's observation queue: what waits, what was refused, save and dismiss. */
export function useObservationQueue(userId: number) {
  const qc = useQueryClient();
  const queue = useOfflineQueue<QueuedObservation>({
    name: 'observations',
    userId,
    store: observationStore(),
    send: sendObservation,
    what: 'observation',
    afterSync: (report) => (report.sent.length ? qc.invalidateQueries({ queryKey: observationKeys.all }) : undefined),
  });
  /** Stores the observation on the phone first, then tries to send it. */
  const save = (input: Omit<NewQueuedItem<QueuedObservation>, 'userId'>) => queue.save(makeQueuedItem<QueuedObservation>({ ...input, userId }));
  return { ...queue, save };
}
