/**
 * Registers the service worker once the page has loaded (production builds only), so it never
 * competes with the first paint. The sign-in page does it too: while the person types, the worker
 * fetches the app shell, and the field sheet or the portal opens from it right after sign-in.
 */
export function registerServiceWorkerAfterLoad(): void {
  if (!import.meta.env.PROD) return;
  const register = () => void import('./service-worker').then((m) => m.registerServiceWorker());
  if (document.readyState === 'complete') register();
  else window.addEventListener('load', register, { once: true });
}
