import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Invoice, InvoiceCreate } from '../../../../shared/api/invoices';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

export async function createInvoice(body: InvoiceCreate): Promise<Invoice> {
  return (await api.post<{ invoice: Invoice }>('/api/invoices', body)).invoice;
}

/** Office: invoice an installed job (accepted quote + variations − deposit); e-mails it unless `send: false`. */
export function useCreateInvoice() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createInvoice, onSuccess: () => qc.invalidateQueries({ queryKey: invoiceKeys.all }) });
}
