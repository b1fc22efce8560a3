import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreditNoteCreate, Invoice, InvoicePatch } from '../../../../shared/api/invoices';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

export async function updateInvoice(id: string, patch: InvoicePatch): Promise<Invoice> {
  return (await api.patch<{ invoice: Invoice }>(`/api/invoices/${encodeURIComponent(id)}`, patch)).invoice;
}

export async function sendInvoice(id: string): Promise<Invoice> {
  return (await api.post<{ invoice: Invoice }>(`/api/invoices/${encodeURIComponent(id)}/send`)).invoice;
}

export async function createCreditNote(id: string, body: CreditNoteCreate): Promise<Invoice> {
  return (await api.post<{ creditNote: Invoice }>(`/api/invoices/${encodeURIComponent(id)}/credit-notes`, body)).creditNote;
}

/** Change an unpaid invoice (variations, due date, notes); the server refuses a paid one. */
export function useUpdateInvoice(id: string) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (patch: InvoicePatch) => updateInvoice(id, patch), onSuccess: () => qc.invalidateQueries({ queryKey: invoiceKeys.all }) });
}

export function useSendInvoice(id: string) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: () => sendInvoice(id), onSuccess: () => qc.invalidateQueries({ queryKey: invoiceKeys.all }) });
}

export function useCreateCreditNote(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreditNoteCreate) => createCreditNote(id, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: invoiceKeys.all }),
  });
}
