/**
 * Registers the service worker (production builds only) a few seconds after the page has loaded, or
 * at the person's first key or tap on the sign-in page: on a slow link the shell's download (about
 * 150 KB) then never competes with the page's own first load, a reload, or its first data. On the
 * sign-in page the worker fetches the app shell while the person types, and the field sheet or the
 * portal opens from it right after sign-in.
 */
export const SHELL_DOWNLOAD_DELAY_MS = 4000;

/** Arms the registration: after load + `SHELL_DOWNLOAD_DELAY_MS`, or sooner at the first input when asked. */
export function registerServiceWorkerAfterLoad(options: { onFirstInput?: boolean } = {}): void {
  if (!import.meta.env.PROD) return;
  let started = false;
  const register = () => {
    if (started) return;
    started = true;
    void import('./service-worker').then((m) => m.registerServiceWorker());
  };
  const arm = () => {
    window.setTimeout(register, SHELL_DOWNLOAD_DELAY_MS);
    // Not focus: the form may focus its first field by itself. A key or a tap means a person is there.
    if (options.onFirstInput) for (const type of ['keydown', 'pointerdown']) window.addEventListener(type, register, { once: true, capture: true });
  };
  if (document.readyState === 'complete') arm();
  else window.addEventListener('load', arm, { once: true });
}
