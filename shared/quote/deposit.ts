import { applyRateBp } from './money';

/** How a company asks for a deposit: none, a percentage of the quote total, or a fixed amount. */
export type DepositMode = 'none' | 'percent' | 'fixed';

/**
 * The deposit asked on a quote total: a percentage (basis points, rounded half away from zero like
 * every rate) or a fixed amount capped at the total. 0 when no deposit is asked.
 */
export function depositFor(grossMinor: number, mode: DepositMode, percentBp: number | null, fixedMinor: number | null): number {
  if (grossMinor <= 0) return 0;
  if (mode === 'percent' && percentBp) return applyRateBp(grossMinor, percentBp);
  if (mode === 'fixed' && fixedMinor) return Math.min(fixedMinor, grossMinor);
  return 0;
}

/** The deposit a customer is asked on acceptance: its amount, and the percentage when it is one. */
export interface DepositTerms {
  amountMinor: number;
  percentBp: number | null;
}

/** The deposit terms for a quote total under the company's settings, or null when none is asked. */
export function depositTerms(
  grossMinor: number,
  s: { depositMode: DepositMode; depositPercentBp: number | null; depositFixedMinor: number | null },
): DepositTerms | null {
  const amountMinor = depositFor(grossMinor, s.depositMode, s.depositPercentBp, s.depositFixedMinor);
  if (amountMinor <= 0) return null;
  return { amountMinor, percentBp: s.depositMode === 'percent' ? s.depositPercentBp : null };
}

/**
 * One sentence telling the customer about the deposit before they accept (the quote page, its PDF
 * and e-mail say the same), e.g. "A deposit of £143.94 (25% of the total) is paid by card when you
 * accept this quote; the rest is invoiced once the work is done."
 */
export function depositSentence(terms: DepositTerms, money: (minor: number) => string): string {
  const share = terms.percentBp ? ` (${terms.percentBp / 100}% of the total)` : '';
  return `A deposit of ${money(terms.amountMinor)}${share} is paid by card when you accept this quote; the rest is invoiced once the work is done.`;
}
