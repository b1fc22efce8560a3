/**
 * Asks the service worker (src/offline-shell/sw.ts, registered at start) to keep these API reads
 * (e.g. the job sheet's URL) for use without signal; the app's own files are already in its
 * precache. Resolves with the number of reads kept, or null where service workers are unavailable
 * (and in `npm run dev`, which runs without one).
 */
export async function keepForOffline(urls: string[]): Promise<number | null> {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator) || !import.meta.env.PROD) return null;
  const reg = await navigator.serviceWorker.ready;
  const worker = reg.active;
  if (!worker) return null;
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
