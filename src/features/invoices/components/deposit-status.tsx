import { formatMoney } from '../../../../shared/quote/money';
import { formatDateTime } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { useDeposit } from '../api/get-deposit';

/** For the quote page: whether a deposit is asked for this quote and whether it is paid (amount, time). */
export function DepositStatus({ quoteId, className }: { quoteId: string; className?: string }) {
  const deposit = useDeposit(quoteId);
  if (!deposit.isSuccess) return null;
  const d = deposit.data;
  if (d.state === 'none') return null;
  const money = formatMoney(d.amountMinor, d.currency);
  return (
    <p
      data-testid="deposit-status"
      className={cn(
        'rounded-md border px-3 py-2 text-sm',
        d.state === 'paid' ? 'border-teal/40 bg-teal-light/30 text-teal-dark' : 'border-straw-dark/40 bg-straw-light/40 text-graphite',
        className,
      )}
    >
      {d.state === 'paid'
        ? `Deposit of ${money} paid ${formatDateTime(d.paidAt)}`
        : `Deposit of ${money} due when the customer accepts${d.attempts ? ` (${d.attempts} checkout${d.attempts > 1 ? 's' : ''} started, not paid)` : ''}`}
    </p>
  );
}
