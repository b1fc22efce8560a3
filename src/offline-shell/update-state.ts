import { useSyncExternalStore } from 'react';

/**
 * Whether a new build is waiting to take over, and how to let it. Filled in by the service-worker
 * registration (register.ts, only in the built app); read by the update prompt.
 */
let waiting: (() => Promise<void>) | null = null;
const listeners = new Set<() => void>();

export function setUpdateWaiting(apply: (() => Promise<void>) | null) {
  waiting = apply;
  for (const l of listeners) l();
}

export function useUpdateWaiting(): (() => Promise<void>) | null {
  return useSyncExternalStore(
    (onChange) => {
      listeners.add(onChange);
      return () => listeners.delete(onChange);
    },
    () => waiting,
  );
}
