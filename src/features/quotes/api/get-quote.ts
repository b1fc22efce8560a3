import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Quote } from '../../../../shared/api/quotes';
import { api } from '../../../lib/api-client';
import { quoteKeys } from './keys';

export async function getQuote(id: string, signal?: AbortSignal): Promise<Quote> {
  return (await api.get<{ quote: Quote }>(`/api/quotes/${encodeURIComponent(id)}`, undefined, signal)).quote;
}

export const quoteQueryOptions = (id: string) => queryOptions({ queryKey: quoteKeys.detail(id), queryFn: ({ signal }) => getQuote(id, signal) });

export function useQuote(id: string) {
  return useQuery(quoteQueryOptions(id));
}
