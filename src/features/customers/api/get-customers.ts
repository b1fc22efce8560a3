import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Customer } from '../../../../shared/api/customers';
import { api } from '../../../lib/api-client';
import { customerKeys } from './keys';

export async function getCustomers(signal?: AbortSignal): Promise<Customer[]> {
  return (await api.get<{ customers: Customer[] }>('/api/customers', undefined, signal)).customers;
}

export const customersQueryOptions = () => queryOptions({ queryKey: customerKeys.list(), queryFn: ({ signal }) => getCustomers(signal) });

export function useCustomers(opts: { enabled?: boolean } = {}) {
  return useQuery({ ...customersQueryOptions(), enabled: opts.enabled ?? true });
}
