import { useSyncExternalStore } from 'react';
import { IDEMPOTENCY_HEADER } from '../../../../shared/api/job-sheet';
import { allItems, deleteItem, newKey, putItem, type OutboxItem } from './outbox-db';

/**
 * The job sheet's outbox. Every tick, note and photo goes through it, with or without signal:
 * it is written to IndexedDB first (so closing the app loses nothing), then sent in order with its
 * Idempotency-Key (so a send that reached the server but whose answer was lost is not doubled).
 */
type Snapshot = { items: OutboxItem[]; sending: boolean; online: boolean; lastError: string | null };

let snapshot: Snapshot = { items: [], sending: false, online: typeof navigator === 'undefined' ? true : navigator.onLine, lastError: null };
const listeners = new Set<() => void>();
const sentListeners = new Set<(item: OutboxItem, response: unknown) => void>();

function set(patch: Partial<Snapshot>) {
  snapshot = { ...snapshot, ...patch };
  for (const l of listeners) l();
}

async function reload() {
  set({ items: await allItems() });
}

export function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Called with each item the server accepted (and its response body). */
export function onSent(listener: (item: OutboxItem, response: unknown) => void) {
  sentListeners.add(listener);
  return () => sentListeners.delete(listener);
}

export function useOutbox(): Snapshot {
  return useSyncExternalStore(
    subscribe,
    () => snapshot,
    () => snapshot,
  );
}

/** Queues a change; `key` only when the change was already tried online with that Idempotency-Key (a finish). */
export async function enqueue(item: Omit<OutboxItem, 'key' | 'createdAt' | 'status'> & { key?: string }): Promise<OutboxItem> {
  const full: OutboxItem = { ...item, key: item.key ?? newKey(), createdAt: new Date().toISOString(), status: 'waiting' };
  await putItem(full);
  await reload();
  // A flush already running read the list before this item existed: send it after that one.
  void (flushing ? flushing.then(flush) : flush());
  return full;
}

async function send(item: OutboxItem): Promise<Response> {
  const headers: Record<string, string> = { [IDEMPOTENCY_HEADER]: item.key, Accept: 'application/json' };
  let body: BodyInit;
  if (item.file) {
    const form = new FormData();
    for (const [k, v] of Object.entries(item.body)) if (v !== undefined && v !== null) form.append(k, String(v));
    form.append('photo', item.file, item.fileName ?? 'photo.jpg');
    body = form;
  } else {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(item.body);
  }
  return fetch(item.url, { method: 'POST', credentials: 'same-origin', headers, body });
}

let flushing: Promise<void> | null = null;

/** Sends waiting items one by one, oldest first; stops at the first network failure and tries again later. */
export function flush(): Promise<void> {
  flushing ??= (async () => {
    set({ sending: true });
    try {
      for (const item of await allItems()) {
        if (item.status !== 'waiting') continue;
        let res: Response;
        try {
          res = await send(item);
        } catch {
          set({ online: false, lastError: 'No connection: waiting to send.' });
          scheduleRetry();
          return;
        }
        if (res.ok) {
          retryDelayMs = RETRY_FIRST_MS;
          const data = await res.json().catch(() => null);
          await deleteItem(item.key);
          for (const l of sentListeners) l(item, data);
          set({ online: true, lastError: null });
        } else if (res.status >= 500 || res.status === 408 || res.status === 429 || res.status === 401) {
          // The server or the session is not ready: keep it and try again later (after signing in).
          set({ lastError: res.status === 401 ? 'Sign in again to send your changes.' : 'The server is busy: waiting to send.' });
          scheduleRetry();
          return;
        } else {
          const err = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
          await putItem({ ...item, status: 'failed', error: err?.error?.message ?? `refused (${res.status})` });
        }
        await reload();
      }
    } finally {
      await reload();
      set({ sending: false });
      flushing = null;
    }
  })();
  return flushing;
}

/**
 * Back-off between tries after a failed send: 1 s, doubling, at most 8 s. The browser's `online`
 * event is not enough on its own: a page opened while offline may never receive it (seen in
 * Chromium 150), so sending must not wait for that one event.
 */
export const RETRY_FIRST_MS = 1_000;
export const RETRY_MAX_MS = 8_000;
let retryDelayMs = RETRY_FIRST_MS;
let retryTimer: ReturnType<typeof setTimeout> | null = null;

function scheduleRetry() {
  if (retryTimer || typeof window === 'undefined') return;
  const delay = retryDelayMs;
  retryDelayMs = Math.min(retryDelayMs * 2, RETRY_MAX_MS);
  retryTimer = setTimeout(() => {
    retryTimer = null;
    if (snapshot.items.some((i) => i.status === 'waiting')) void flush();
  }, delay);
}

/** Try now (signal came back, the app came to the front): restarts the back-off from its shortest step. */
function retryNow() {
  retryDelayMs = RETRY_FIRST_MS;
  if (retryTimer) clearTimeout(retryTimer);
  retryTimer = null;
  if (snapshot.items.some((i) => i.status === 'waiting')) void flush();
}

let started = false;

/**
 * Loads the outbox and sends it: at once, whenever the connection comes back, the page becomes
 * visible or gets focus, after a failed send on a short back-off, and every 30 s while anything waits.
 */
export function startOutbox() {
  if (started || typeof window === 'undefined') return;
  started = true;
  void reload().then(() => flush());
  window.addEventListener('online', () => {
    set({ online: true });
    retryNow();
  });
  window.addEventListener('offline', () => set({ online: false }));
  window.addEventListener('focus', retryNow);
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'visible') retryNow();
  });
  setInterval(() => {
    if (snapshot.items.some((i) => i.status === 'waiting')) void flush();
  }, 30_000);
}
