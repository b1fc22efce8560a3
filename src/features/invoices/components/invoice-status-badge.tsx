import type { InvoiceSummary } from '../../../../shared/api/invoices';
import { cn } from '../../../lib/cn';

/** Paid, to pay, overdue, or credit note — as a small coloured tag. */
export function InvoiceStatusBadge({
  invoice,
  className,
}: {
  invoice: Pick<InvoiceSummary, 'kind' | 'status' | 'overdue' | 'balanceMinor'>;
  className?: string;
}) {
  const [label, tone] =
    invoice.kind === 'credit_note'
      ? ['Credit note', 'bg-brick-light/40 text-brick-dark border-brick/30']
      : invoice.status === 'paid'
        ? ['Paid', 'bg-teal-dark text-white border-teal-dark']
        : invoice.overdue
          ? ['Overdue', 'bg-brick text-white border-brick-dark']
          : invoice.balanceMinor === 0
            ? ['Settled', 'bg-teal-light/60 text-teal-dark border-teal/30']
            : ['To pay', 'bg-straw-light text-graphite border-straw-dark/40'];
  return <span className={cn('inline-flex items-center whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-medium', tone, className)}>{label}</span>;
}
