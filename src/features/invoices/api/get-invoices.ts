import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvoiceListQuery, InvoiceSummary } from '../../../../shared/api/invoices';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

/** The company's invoices and credit notes, newest first; `status: 'overdue'` keeps the overdue ones. */
export async function getInvoices(query: InvoiceListQuery, signal?: AbortSignal): Promise<InvoiceSummary[]> {
  return (await api.get<{ invoices: InvoiceSummary[] }>('/api/invoices', query, signal)).invoices;
}

export const invoicesQueryOptions = (query: InvoiceListQuery) =>
  queryOptions({ queryKey: invoiceKeys.list(query), queryFn: ({ signal }) => getInvoices(query, signal) });

export function useInvoices(query: InvoiceListQuery, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...invoicesQueryOptions(query), enabled });
}
