/**
 * Invoice arithmetic, in integer minor units throughout, with the quote's own rules
 * (shared/quote/money.ts): a line's net = quantity × unit price and its tax = net × rate, each
 * rounded half away from zero once, per line; totals are exact sums of the rounded lines.
 * Lines copied from the accepted quote are priced exactly as the quote priced them, so the invoice
 * agrees with the quote to the penny.
 * Balance = gross − deposit already paid − credit notes issued against the invoice.
 */
import { applyRateBp, multiplyMinor, sumMinor } from '../../../shared/quote/money';
import { groupTaxByRate } from '../../../shared/quote/totals';

export interface LineInput {
  quantity: number;
  unitPriceMinor: number;
  rateBp: number;
}

export interface LineAmounts {
  netMinor: number;
  taxMinor: number;
  grossMinor: number;
}

/** Net, tax and gross of one line (see the module comment for the rounding). */
export function lineAmounts(line: LineInput): LineAmounts {
  const netMinor = multiplyMinor(line.quantity, line.unitPriceMinor);
  const taxMinor = applyRateBp(netMinor, line.rateBp);
  return { netMinor, taxMinor, grossMinor: netMinor + taxMinor };
}

export interface Totals {
  netMinor: number;
  taxMinor: number;
  grossMinor: number;
  taxByRate: { rateBp: number; netMinor: number; taxMinor: number }[];
}

/** Sum lines that already carry their amounts; tax grouped by rate, highest rate first. */
export function sumLines(lines: readonly { netMinor: number; taxMinor: number; rateBp: number }[]): Totals {
  const netMinor = sumMinor(lines.map((l) => l.netMinor));
  const taxMinor = sumMinor(lines.map((l) => l.taxMinor));
  return { netMinor, taxMinor, grossMinor: netMinor + taxMinor, taxByRate: groupTaxByRate(lines) };
}

/** What is left to pay: total − deposit paid − credit notes; never below zero. */
export function balanceDue(grossMinor: number, depositMinor: number, creditedMinor: number): number {
  return Math.max(0, grossMinor - depositMinor - creditedMinor);
}

/** An unpaid invoice is overdue from the day after its due date. */
export function isOverdue(status: string, dueDate: string | null, today: string): boolean {
  return status !== 'paid' && !!dueDate && today > dueDate;
}
