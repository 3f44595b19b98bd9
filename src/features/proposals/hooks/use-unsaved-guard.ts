/** Asks before leaving a page with unsaved changes: the router's blocker for links, the browser's own prompt for reloads and closing the tab. */
import { useEffect } from 'react';
import { useBlocker } from 'react-router-dom';

/** Blocks navigation to another page while `dirty`; the caller shows the blocker's confirm dialog. */
export function useUnsavedGuard(dirty: boolean) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);
  return blocker;
}
