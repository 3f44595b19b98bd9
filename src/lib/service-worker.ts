/**
 * The service worker (vite-plugin-pwa / Workbox): registered after the page has loaded, so it never
 * competes with the first paint. When a new version is deployed the app shows "Update"
 * (components/ui/update-prompt.tsx); nothing reloads under a person's hands.
 */
/// <reference types="vite-plugin-pwa/client" />
import { registerSW } from 'virtual:pwa-register';
import { markUpdateWaiting } from './update-state';

let update: ((reload?: boolean) => Promise<void>) | null = null;

/** Switches to the waiting version and reloads the page. */
export function applyUpdate(): void {
  void update?.(true);
}

/** Registers the service worker. */
export function registerServiceWorker(): void {
  if (!('serviceWorker' in navigator)) return;
  update = registerSW({ immediate: true, onNeedRefresh: markUpdateWaiting });
}
