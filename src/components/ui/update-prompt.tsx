import { useSyncExternalStore } from 'react';
import { onUpdateWaiting, updateWaiting } from '../../lib/update-state';

/** "A new version of Browseline is ready" with an Update button, when the service worker has one waiting. */
export function UpdatePrompt() {
  const waiting = useSyncExternalStore(onUpdateWaiting, updateWaiting, () => false);
  if (!waiting) return null;
  return (
    <div role="status" className="fixed inset-x-0 bottom-4 z-50 mx-auto flex w-fit max-w-[calc(100%-2rem)] items-center gap-3 rounded-md border border-moss bg-card px-4 py-3 text-sm shadow-lg">
      <span>A new version of Browseline is ready.</span>
      <button type="button" className="rounded bg-moss px-3 py-2 font-semibold text-white" onClick={() => void import('../../lib/service-worker').then((m) => m.applyUpdate())}>
        Update
      </button>
    </div>
  );
}
