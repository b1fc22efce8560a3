/// <reference lib="webworker" />
/*
 * Quiltline's service worker (built by vite-plugin-pwa, injectManifest): the app shell comes from a
 * precache manifest versioned by each build, so a deploy replaces it and old caches are pruned on
 * activate; the job sheets an installer has opened are kept so a sheet opens and works in a loft
 * with no signal. Writes are not handled here: the page queues them in IndexedDB and sends them
 * itself with idempotency keys (src/features/job-sheet/offline).
 */
import { clientsClaim } from 'workbox-core';
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { NetworkFirst } from 'workbox-strategies';
import { isKeptApi, OFFLINE_DATA_CACHE, type ShellMessage } from './shell-messages';

declare let self: ServiceWorkerGlobalScope;

precacheAndRoute(self.__WB_MANIFEST);
cleanupOutdatedCaches();
// The first install controls the open page at once, so the sheet it shows is kept; an update waits
// for the user's "reload" (a SKIP_WAITING message) instead of swapping the code under a form.
clientsClaim();

// Every client route is the same single page: the network's copy when there is signal, else the
// precached one. The customer's payment pages and the API are the server's own.
registerRoute(
  new NavigationRoute(
    async ({ request }) => {
      try {
        return await fetch(request);
      } catch (err) {
        const shell = await matchPrecache('/index.html');
        if (shell) return shell;
        throw err;
      }
    },
    { denylist: [/^\/api\//, /^\/pay\//] },
  ),
);

// API reads worth keeping for offline use; a 401 means signed out: forget the company's data on this device.
registerRoute(
  ({ url, request }) => request.method === 'GET' && url.origin === self.location.origin && isKeptApi(url.pathname),
  new NetworkFirst({
    cacheName: OFFLINE_DATA_CACHE,
    plugins: [
      {
        fetchDidSucceed: async ({ response }) => {
          if (response.status === 401) await caches.delete(OFFLINE_DATA_CACHE);
          return response;
        },
      },
    ],
  }),
);

/** Messages from the page: keep these API reads now, or take over after an update. */
self.addEventListener('message', (event) => {
  const data = (event.data ?? {}) as ShellMessage;
  const port = event.ports?.[0];
  if (data.type === 'SKIP_WAITING') {
    void self.skipWaiting();
  } else if (data.type === 'keep' && Array.isArray(data.urls)) {
    event.waitUntil(keep(data.urls).then((kept) => port?.postMessage({ type: 'kept', kept })));
  }
});

async function keep(urls: string[]): Promise<number> {
  const cache = await caches.open(OFFLINE_DATA_CACHE);
  let kept = 0;
  for (const raw of urls) {
    try {
      const url = new URL(raw, self.location.origin);
      if (url.origin !== self.location.origin || !isKeptApi(url.pathname)) continue;
      const response = await fetch(url.pathname + url.search, { credentials: 'same-origin' });
      if (response.ok) {
        await cache.put(url.pathname + url.search, response);
        kept += 1;
      }
    } catch {
      // One missing read must not stop the others from being kept.
    }
  }
  return kept;
}
