import { useQuery } from '@tanstack/react-query';
import type { PublicDeposit } from '../../../../shared/api/payments';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

/** The customer's deposit for a quote link (no sign-in). */
export async function getPublicDeposit(link: string, signal?: AbortSignal): Promise<PublicDeposit> {
  return (await api.get<{ deposit: PublicDeposit }>(`/api/payments/public/deposit/${encodeURIComponent(link)}`, undefined, signal)).deposit;
}

export function usePublicDeposit(link: string, enabled = true) {
  return useQuery({ queryKey: [...invoiceKeys.all, 'public-deposit', link], queryFn: ({ signal }) => getPublicDeposit(link, signal), enabled, retry: false });
}
