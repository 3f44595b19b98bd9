import { useEffect, useState, useSyncExternalStore } from 'react';
import { describeAge } from '../../lib/persist-rules';

const subscribe = (cb: () => void) => {
  window.addEventListener('online', cb);
  window.addEventListener('offline', cb);
  return () => {
    window.removeEventListener('online', cb);
    window.removeEventListener('offline', cb);
  };
};

/** Whether the browser says it has a connection. */
export const useOnline = () => useSyncExternalStore(subscribe, () => navigator.onLine, () => true);

/**
 * With no signal (or when the last refresh failed), says that the page shows what this person saw
 * last, and how old it is.
 */
export function OfflineNotice({ updatedAt, refreshFailed = false }: { updatedAt: number | undefined; refreshFailed?: boolean }) {
  const online = useOnline();
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(timer);
  }, []);
  if ((online && !refreshFailed) || !updatedAt) return null;
  const at = new Date(updatedAt).toLocaleString('en-US', { weekday: 'short', hour: 'numeric', minute: '2-digit' });
  return (
    <div role="status" className="rounded-md border border-ochre bg-ochre/10 px-4 py-2 text-sm">
      <span className="font-semibold">{online ? 'Browseline cannot be reached.' : 'No signal.'}</span> Showing what you saw {describeAge(updatedAt, now)} ({at}); it refreshes when the phone is back online.
    </div>
  );
}
