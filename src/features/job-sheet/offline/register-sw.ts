/**
 * Registers the service worker (public/sw.js) and asks it to keep what this page needs offline:
 * the scripts, styles and fonts already loaded, plus `extra` (e.g. the job sheet's API URL).
 * Resolves with the number of files kept, or null where service workers are unavailable (and in `npm run dev`).
 */
export async function keepForOffline(extra: string[]): Promise<number | null> {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return null;
  // Only the built app: under the Vite dev server a cache-first worker would serve stale modules.
  if (!import.meta.env.PROD) return null;
  await navigator.serviceWorker.register('/sw.js', { scope: '/' });
  const reg = await navigator.serviceWorker.ready;
  const worker = reg.active;
  if (!worker) return null;
  const loaded = performance
    .getEntriesByType('resource')
    .map((e) => e.name)
    .filter((u) => u.startsWith(location.origin) && !u.includes('/api/'));
  const urls = [...new Set(['/', ...loaded, ...extra])];
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    const timer = setTimeout(() => resolve(null), 20_000);
    channel.port1.onmessage = (e) => {
      clearTimeout(timer);
      resolve(typeof e.data?.kept === 'number' ? e.data.kept : null);
    };
    worker.postMessage({ type: 'keep', urls }, [channel.port2]);
  });
}
