/** The phone's sit queue: the shared offline queue (src/lib/offline-queue.ts) with sits' send function and store. */
import { useQueryClient } from '@tanstack/react-query';
import { makeQueuedItem, useOfflineQueue, type SaveOutcome } from '../../../lib/offline-queue';
import { sitStore, type QueuedSit } from '../lib/sit-queue';
import { sendSit } from '../api/sits';
import { huntingKeys } from '../api/keys';
import type { SitCreateInput } from '../../../../shared/schemas/hunting';

export type SitSaveOutcome = SaveOutcome;

/** Runs the sit queue for the signed-in person on this page. */
export function useSitQueue(userId: number) {
  const qc = useQueryClient();
  const queue = useOfflineQueue<QueuedSit>({
    name: 'sits',
    userId,
    store: sitStore(),
    send: sendSit,
    what: 'sit',
    afterSync: (report) => (report.sent.length ? qc.invalidateQueries({ queryKey: huntingKeys.all }) : undefined),
  });
  /** Stores the sit on the phone BEFORE sending it, then tries once. */
  const save = (input: { key: string; propertyId: number; standName: string; body: SitCreateInput }) => queue.save(makeQueuedItem<QueuedSit>({ ...input, userId }));
  return { ...queue, save };
}
