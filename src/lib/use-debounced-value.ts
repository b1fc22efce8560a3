import { useEffect, useState } from 'react';

/** The value, once it has stopped changing for `delayMs` (search boxes: one request per pause, not per key). */
export function useDebouncedValue<T>(value: T, delayMs = 250): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(t);
  }, [value, delayMs]);
  return settled;
}
