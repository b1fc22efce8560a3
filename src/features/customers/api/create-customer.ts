import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Customer, CustomerBody } from '../../../../shared/api/customers';
import { api } from '../../../lib/api-client';
import { customerKeys } from './keys';

export async function createCustomer(body: CustomerBody): Promise<Customer> {
  return (await api.post<{ customer: Customer }>('/api/customers', body)).customer;
}

export function useCreateCustomer() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createCustomer,
    onSuccess: () => qc.invalidateQueries({ queryKey: customerKeys.all }),
  });
}
