// Registers the service worker (the app shell and the scout's pages without signal); new versions take over at once.
import { registerSW } from 'virtual:pwa-register';

export function registerServiceWorker() {
  // Service workers need a secure context (https, or localhost / 127.0.0.1 while developing).
  if (!('serviceWorker' in navigator) || !window.isSecureContext) return;
  registerSW({ immediate: true });
}
