import type { InvoiceListQuery } from '../../../../shared/api/invoices';

/** Query keys of invoices and payments: invalidate `all` after any invoice or payment change. */
export const invoiceKeys = {
  all: ['invoices'] as const,
  list: (query: InvoiceListQuery) => [...invoiceKeys.all, 'list', query] as const,
  detail: (id: string) => [...invoiceKeys.all, 'detail', id] as const,
  paymentSettings: () => [...invoiceKeys.all, 'payment-settings'] as const,
  deposit: (quoteId: string) => [...invoiceKeys.all, 'deposit', quoteId] as const,
  jobMoney: (jobId: string) => [...invoiceKeys.all, 'job', jobId] as const,
};
