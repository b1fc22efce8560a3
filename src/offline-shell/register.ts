import { registerSW } from 'virtual:pwa-register';
import { setUpdateWaiting } from './update-state';

/**
 * Registers the service worker in the built app (vite-plugin-pwa leaves the dev server without
 * one: a cache in front of Vite's modules would serve stale code). A new build found later waits
 * until the user chooses to reload; checked again when the app comes back to the foreground.
 */
export function registerOfflineShell() {
  if (!import.meta.env.PROD || !('serviceWorker' in navigator)) return;
  const update = registerSW({
    onNeedRefresh: () => setUpdateWaiting(() => takeOver(update)),
    // The reload is ours (takeOver): the library reloads only pages that had a worker when they
    // opened, and a phone may keep the first page it installed from open for days.
    onNeedReload: () => undefined,
    onRegisteredSW: (_url, registration) => {
      if (!registration) return;
      document.addEventListener('visibilitychange', () => {
        if (document.visibilityState === 'visible') void registration.update().catch(() => undefined);
      });
    },
  });
}

/** Lets the waiting build take over, and reloads once it controls the page. */
function takeOver(update: (reload?: boolean) => Promise<void>): Promise<void> {
  navigator.serviceWorker.addEventListener('controllerchange', () => window.location.reload(), { once: true });
  return update(true);
}
