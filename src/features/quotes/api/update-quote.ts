import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Quote, QuotePatch } from '../../../../shared/api/quotes';
import { api } from '../../../lib/api-client';
import { quoteKeys } from './keys';

/** Saves lines / valid-until / notes. A sent quote comes back as a new draft version (a different id). */
export async function updateQuote(id: string, patch: QuotePatch): Promise<Quote> {
  return (await api.patch<{ quote: Quote }>(`/api/quotes/${encodeURIComponent(id)}`, patch)).quote;
}

export function useUpdateQuote(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (patch: QuotePatch) => updateQuote(id, patch),
    onSuccess: (q) => {
      qc.setQueryData(quoteKeys.detail(q.id), q);
      void qc.invalidateQueries({ queryKey: quoteKeys.all });
    },
  });
}
