/** "A new version waits" — set by the service worker's registration (lib/service-worker.ts), read by the update prompt. */
type Listener = () => void;
let waiting = false;
const listeners = new Set<Listener>();

/** Whether a new version waits to be used. */
export const updateWaiting = () => waiting;

/** Subscribes to changes (for useSyncExternalStore). */
export function onUpdateWaiting(listener: Listener): () => void {
  listeners.add(listener);
  return () => {
    listeners.delete(listener);
  };
}

/** Records that a new version waits. */
export function markUpdateWaiting(): void {
  waiting = true;
  for (const l of listeners) l();
}
