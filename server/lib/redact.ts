/** Keys that carry money or margins; installers never receive them (they see no prices). */
export const PRICE_KEY_RE = /(price|cost|total|minor|amount|vat|tax|margin|rate|payment|deposit|discount)/i;

/**
 * A deep copy without price-like keys. Used on every job-shaped response for users without
 * `prices:read`, so a field added later (a quote total on the job, say) cannot leak by accident.
 */
export function redactPrices<T>(value: T): T {
  if (Array.isArray(value)) return value.map((v) => redactPrices(v)) as T;
  if (value && typeof value === 'object' && !(value instanceof Date)) {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      if (!PRICE_KEY_RE.test(k)) out[k] = redactPrices(v);
    }
    return out as T;
  }
  return value;
}
