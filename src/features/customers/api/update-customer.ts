import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Customer, CustomerPatch } from '../../../../shared/api/customers';
import { api } from '../../../lib/api-client';
import { customerKeys } from './keys';

export async function updateCustomer(id: string, body: CustomerPatch): Promise<Customer> {
  return (await api.patch<{ customer: Customer }>(`/api/customers/${encodeURIComponent(id)}`, body)).customer;
}

/** Saves a customer; jobs show the customer's name, so their queries are refreshed too. */
export function useUpdateCustomer() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: CustomerPatch }) => updateCustomer(id, body),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: customerKeys.all }), qc.invalidateQueries({ queryKey: ['jobs'] })]),
  });
}
