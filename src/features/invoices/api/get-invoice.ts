import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invoice } from '../../../../shared/api/invoices';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

export async function getInvoice(id: string, signal?: AbortSignal): Promise<Invoice> {
  return (await api.get<{ invoice: Invoice }>(`/api/invoices/${encodeURIComponent(id)}`, undefined, signal)).invoice;
}

export const invoiceQueryOptions = (id: string) => queryOptions({ queryKey: invoiceKeys.detail(id), queryFn: ({ signal }) => getInvoice(id, signal) });

export function useInvoice(id: string) {
  return useQuery(invoiceQueryOptions(id));
}

/** The PDF, served by the API with the session cookie. */
export const invoicePdfUrl = (id: string) => `/api/invoices/${encodeURIComponent(id)}/pdf`;
