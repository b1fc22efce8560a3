/** Site records made offline (ticks, notes, photos) keep the moment they were made, within bounds. */
const MAX_PAST_MS = 14 * 24 * 3600_000;

/**
 * When a record was made: the client's time if it is plausible (a queued offline tick keeps the
 * moment it was ticked), otherwise the server's. Never in the future, never weeks old.
 */
export function recordedAt(clientIso: string | undefined, now = new Date()): Date {
  if (!clientIso) return now;
  const t = new Date(clientIso);
  if (Number.isNaN(t.getTime()) || t.getTime() > now.getTime() + 60_000 || now.getTime() - t.getTime() > MAX_PAST_MS) return now;
  return t > now ? now : t;
}
