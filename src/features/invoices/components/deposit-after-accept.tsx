import { useEffect } from 'react';
import { formatMoney } from '../../../../shared/quote/money';
import { formatDateTime } from '../../../components/ui';
import { buttonClass } from '../../../components/ui/button';
import { usePublicDeposit } from '../api/public-deposit';

/**
 * For the customer's quote page once the quote is accepted: when a deposit is due, send them on to
 * pay it (our /pay page, which opens the hosted checkout); when paid, say so. Renders nothing when
 * no deposit is asked. `redirect` moves on at once (use it right after the customer accepts).
 */
export function DepositAfterAccept({ link, redirect = false }: { link: string; redirect?: boolean }) {
  const deposit = usePublicDeposit(link);
  const payUrl = deposit.data?.payUrl ?? null;
  useEffect(() => {
    if (redirect && payUrl) window.location.assign(payUrl);
  }, [redirect, payUrl]);
  if (!deposit.isSuccess || deposit.data.state === 'none') return null;
  const d = deposit.data;
  const money = formatMoney(d.amountMinor, d.currency);
  if (d.state === 'paid') {
    return (
      <p data-testid="deposit-paid" className="rounded-md border border-teal/40 bg-teal-light/30 px-3 py-2 text-sm text-teal-dark">
        Deposit of {money} received {formatDateTime(d.paidAt)}. Thank you.
      </p>
    );
  }
  if (!payUrl) return null;
  return (
    <div data-testid="deposit-due" className="flex flex-wrap items-center gap-3 rounded-md border border-straw-dark/40 bg-straw-light/40 px-3 py-2 text-sm">
      <span>
        A deposit of <strong>{money}</strong> books the work.
      </span>
      <a className={buttonClass('primary', 'sm')} href={payUrl}>
        Pay the deposit
      </a>
    </div>
  );
}
