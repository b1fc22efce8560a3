import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Customer } from '../../../../shared/api/customers';
import { api } from '../../../lib/api-client';
import { customerKeys } from './keys';

export async function getCustomer(id: string, signal?: AbortSignal): Promise<Customer> {
  return (await api.get<{ customer: Customer }>(`/api/customers/${encodeURIComponent(id)}`, undefined, signal)).customer;
}

export const customerQueryOptions = (id: string) =>
  queryOptions({ queryKey: customerKeys.detail(id), queryFn: ({ signal }) => getCustomer(id, signal) });

export function useCustomer(id: string) {
  return useQuery(customerQueryOptions(id));
}
