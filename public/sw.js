/* Quiltline service worker: keeps the app shell and the job sheets an installer has opened, so a
 * sheet opens and works in a loft with no signal. Writes are not handled here: the page queues
 * them in IndexedDB and sends them itself with idempotency keys (src/features/job-sheet/offline).
 */
const VERSION = 'v1';
const SHELL = `quiltline-shell-${VERSION}`;
const DATA = `quiltline-data-${VERSION}`;

// API reads worth keeping for offline use: who is signed in, the installer's list, job sheets, photo thumbnails.
const API_KEEP = [/^\/api\/auth\/me$/, /^\/api\/my-jobs$/, /^\/api\/jobs\/[0-9a-f-]{36}(\/job-sheet)?$/, /^\/api\/photos\/[0-9a-f-]{36}\/thumb$/];

self.addEventListener('install', (event) => {
  event.waitUntil(
    caches
      .open(SHELL)
      .then((c) => c.add(new Request('/', { cache: 'reload' })))
      .catch(() => undefined)
      .then(() => self.skipWaiting()),
  );
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    caches
      .keys()
      .then((keys) => Promise.all(keys.filter((k) => k.startsWith('quiltline-') && k !== SHELL && k !== DATA).map((k) => caches.delete(k))))
      .then(() => self.clients.claim()),
  );
});

function isKeptApi(pathname) {
  return API_KEEP.some((re) => re.test(pathname));
}

async function networkFirst(request, cacheName) {
  const cache = await caches.open(cacheName);
  try {
    const response = await fetch(request);
    if (response.ok) await cache.put(request, response.clone());
    // Signed out: forget the company's data kept on this device.
    if (response.status === 401) await caches.delete(DATA);
    return response;
  } catch (err) {
    const cached = await cache.match(request);
    if (cached) return cached;
    throw err;
  }
}

async function cacheFirst(request) {
  const cache = await caches.open(SHELL);
  const cached = await cache.match(request);
  if (cached) return cached;
  const response = await fetch(request);
  if (response.ok) await cache.put(request, response.clone());
  return response;
}

async function navigation(request) {
  const cache = await caches.open(SHELL);
  try {
    const response = await fetch(request);
    if (response.ok && (response.headers.get('content-type') || '').includes('text/html')) await cache.put('/', response.clone());
    return response;
  } catch (err) {
    // Every client route is the same single page: the cached shell serves them all.
    const cached = await cache.match('/');
    if (cached) return cached;
    throw err;
  }
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (request.mode === 'navigate') {
    event.respondWith(navigation(request));
  } else if (url.pathname.startsWith('/api/')) {
    if (isKeptApi(url.pathname)) event.respondWith(networkFirst(request, DATA));
  } else if (url.pathname !== '/sw.js') {
    event.respondWith(cacheFirst(request));
  }
});

/**
 * { type: 'keep', urls: [...] } from the page: fetch and keep these now (the page's own scripts,
 * styles and fonts, and the sheet's data), then answer on the message port with what was kept.
 */
self.addEventListener('message', (event) => {
  const data = event.data || {};
  const port = event.ports && event.ports[0];
  if (data.type === 'keep' && Array.isArray(data.urls)) {
    event.waitUntil(
      (async () => {
        let kept = 0;
        for (const raw of data.urls) {
          try {
            const url = new URL(raw, self.location.origin);
            if (url.origin !== self.location.origin) continue;
            const isApi = url.pathname.startsWith('/api/');
            if (isApi && !isKeptApi(url.pathname)) continue;
            const cache = await caches.open(isApi ? DATA : SHELL);
            const response = await fetch(url.pathname + url.search, { credentials: 'same-origin' });
            if (response.ok) {
              await cache.put(url.pathname + url.search, response);
              kept += 1;
            }
          } catch {
            // One missing file must not stop the others from being kept.
          }
        }
        if (port) port.postMessage({ type: 'kept', kept });
      })(),
    );
  } else if (data.type === 'forget') {
    event.waitUntil(caches.delete(DATA).then(() => port && port.postMessage({ type: 'forgotten' })));
  }
});
