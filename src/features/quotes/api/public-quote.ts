import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AcceptQuoteBody, PublicQuote } from '../../../../shared/api/quotes';
import { api } from '../../../lib/api-client';
import { quoteKeys } from './keys';

const base = (token: string) => `/api/public/quotes/${encodeURIComponent(token)}`;

export async function getPublicQuote(token: string, signal?: AbortSignal): Promise<PublicQuote> {
  return (await api.get<{ quote: PublicQuote }>(base(token), undefined, signal)).quote;
}

export function usePublicQuote(token: string) {
  return useQuery({ queryKey: quoteKeys.public(token), queryFn: ({ signal }) => getPublicQuote(token, signal), retry: false });
}

export function publicQuotePdfUrl(token: string) {
  return `${base(token)}/pdf`;
}

export function useAnswerQuote(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (answer: { accept: AcceptQuoteBody } | { decline: { reason: string } }) =>
      'accept' in answer
        ? (await api.post<{ quote: PublicQuote }>(`${base(token)}/accept`, answer.accept)).quote
        : (await api.post<{ quote: PublicQuote }>(`${base(token)}/decline`, answer.decline)).quote,
    onSuccess: (q) => qc.setQueryData(quoteKeys.public(token), q),
  });
}
