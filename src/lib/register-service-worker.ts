/**
 * Registers the service worker (production builds only) once the page has loaded, so it never
 * competes with the first paint. In the app most of the shell is then already in the browser's cache
 * and the worker is ready within a moment, so the next open or reload comes from it.
 *
 * The sign-in page (`onFirstInput`) waits for the person's first key or tap (or a few seconds): its
 * shell download (about 150 KB, none of it cached yet) then never competes with reopening the sign-in
 * page on a slow link, and still runs while the person types, so the field sheet or the portal opens
 * from it right after sign-in.
 */
export const SIGN_IN_SHELL_DELAY_MS = 4000;

/** Arms the registration: at load, or for the sign-in page at the first input (at the latest `SIGN_IN_SHELL_DELAY_MS` after load). */
export function registerServiceWorkerAfterLoad(options: { onFirstInput?: boolean } = {}): void {
  if (!import.meta.env.PROD) return;
  let started = false;
  const register = () => {
    if (started) return;
    started = true;
    void import('./service-worker').then((m) => m.registerServiceWorker());
  };
  const arm = () => {
    if (!options.onFirstInput) return register();
    window.setTimeout(register, SIGN_IN_SHELL_DELAY_MS);
    // Not focus: the form may focus its first field by itself. A key or a tap means a person is there.
    for (const type of ['keydown', 'pointerdown']) window.addEventListener(type, register, { once: true, capture: true });
  };
  if (document.readyState === 'complete') arm();
  else window.addEventListener('load', arm, { once: true });
}
