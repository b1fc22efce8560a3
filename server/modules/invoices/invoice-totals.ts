/**
 * Invoice arithmetic, in integer minor units throughout.
 *
 * - A line's net = quantityMilli × unitPriceMinor / 1000, rounded half away from zero to a whole
 *   minor unit; its tax = net × taxRateBp / 10000, rounded the same way, per line (the quote's rule:
 *   tax is worked out on each line, then summed, so every line on the PDF adds up on its own).
 * - Lines copied from the accepted quote keep the quote's own net and tax, so the invoice agrees
 *   with the quote to the penny even if a rounding rule changes later.
 * - Balance = gross − deposit already paid − credit notes issued against the invoice.
 */

/** a / b rounded half away from zero, exact for any integers (BigInt inside). */
export function divRoundHalfAway(a: bigint, b: bigint): number {
  const neg = a < 0n !== b < 0n;
  const aa = a < 0n ? -a : a;
  const bb = b < 0n ? -b : b;
  const q = (aa * 2n + bb) / (bb * 2n);
  const r = neg ? -q : q;
  if (r > BigInt(Number.MAX_SAFE_INTEGER) || r < -BigInt(Number.MAX_SAFE_INTEGER)) throw new RangeError('amount too large');
  return Number(r);
}

export interface LineInput {
  quantityMilli: number;
  unitPriceMinor: number;
  taxRateBp: number;
}

export interface LineAmounts {
  netMinor: number;
  taxMinor: number;
  grossMinor: number;
}

/** Net, tax and gross of one line (see the module comment for the rounding). */
export function lineAmounts(line: LineInput): LineAmounts {
  for (const [k, v] of Object.entries(line)) {
    if (!Number.isInteger(v)) throw new TypeError(`${k} must be an integer, got ${v}`);
  }
  const netMinor = divRoundHalfAway(BigInt(line.quantityMilli) * BigInt(line.unitPriceMinor), 1000n);
  const taxMinor = divRoundHalfAway(BigInt(netMinor) * BigInt(line.taxRateBp), 10000n);
  return { netMinor, taxMinor, grossMinor: netMinor + taxMinor };
}

export interface Totals {
  netMinor: number;
  taxMinor: number;
  totalMinor: number;
  taxBreakdown: { rateBp: number; netMinor: number; taxMinor: number }[];
}

/** Sum lines that already carry their amounts; tax grouped by rate, highest rate first. */
export function sumLines(lines: (LineAmounts & { taxRateBp: number })[]): Totals {
  const byRate = new Map<number, { rateBp: number; netMinor: number; taxMinor: number }>();
  let netMinor = 0;
  let taxMinor = 0;
  for (const l of lines) {
    netMinor += l.netMinor;
    taxMinor += l.taxMinor;
    const g = byRate.get(l.taxRateBp) ?? { rateBp: l.taxRateBp, netMinor: 0, taxMinor: 0 };
    g.netMinor += l.netMinor;
    g.taxMinor += l.taxMinor;
    byRate.set(l.taxRateBp, g);
  }
  return { netMinor, taxMinor, totalMinor: netMinor + taxMinor, taxBreakdown: [...byRate.values()].sort((a, b) => b.rateBp - a.rateBp) };
}

/** What is left to pay: total − deposit paid − credit notes; never below zero. */
export function balanceDue(totalMinor: number, depositMinor: number, creditedMinor: number): number {
  return Math.max(0, totalMinor - depositMinor - creditedMinor);
}

/**
 * The deposit asked for a quote total: a percentage (basis points, rounded half away from zero)
 * or a fixed amount capped at the total. 0 when no deposit is asked.
 */
export function depositFor(totalMinor: number, mode: 'none' | 'percent' | 'fixed', percentBp: number | null, fixedMinor: number | null): number {
  if (totalMinor <= 0) return 0;
  if (mode === 'percent' && percentBp) return divRoundHalfAway(BigInt(totalMinor) * BigInt(percentBp), 10000n);
  if (mode === 'fixed' && fixedMinor) return Math.min(fixedMinor, totalMinor);
  return 0;
}

/** Add whole days to an ISO date (YYYY-MM-DD), in UTC. */
export function addDays(isoDate: string, days: number): string {
  const d = new Date(`${isoDate}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** An unpaid invoice is overdue the day after its due date. */
export function isOverdue(status: string, dueDate: string | null, today: string): boolean {
  return status !== 'paid' && !!dueDate && today > dueDate;
}
